/**
 * Output digest of `coldsoak climate` on the real NOAA samples: the `--json` document, the table and
 * the `--csv` file of every sample in ../shared/isd-samples, and the `--json` document of twenty copies
 * of one real station-year (725300-94846, January–April 2014) moved to the years 1960–1979, read with an
 * empty cache and again from the filled cache. The copies cross twenty years of the zone's daylight
 * saving rules, as they were, so the local days and months depend on many offset changes.
 *
 * The expected hashes (`climate-digest.json`) are the program's own earlier output, taken before the
 * local-time and start-up work: a declared regression guard, not a check against an outside source
 * (the outside checks of the climate figures live in tests/climate). A deliberate change of the figures
 * updates the digest on purpose, in its own commit that says what changed:
 *
 *   UPDATE_CLIMATE_DIGEST=1 npx vitest run tests/cli/climateDigest.test.ts
 */
import { createHash } from "node:crypto";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gunzipSync, gzipSync } from "node:zlib";
import { beforeAll, describe, expect, it } from "vitest";
import { HAVE_SAMPLES, SAMPLES_DIR, sample, scratchDir } from "../climate/helpers.js";
import { runCli } from "./runCli.js";

const DIGEST = fileURLToPath(new URL("./climate-digest.json", import.meta.url));
const tmp = scratchDir();

const sha256 = (text: string | Buffer) => createHash("sha256").update(text).digest("hex");

/** Twenty copies of a real station-year, the year field (ISD positions 16–19) set to 1960 … 1979. */
function writeTwentyYears(dir: string): void {
  mkdirSync(dir);
  const text = gunzipSync(readFileSync(sample("725300-94846-2014.gz"))).toString("latin1");
  for (let year = 1960; year < 1980; year++) {
    const shifted = text.replace(/^(.{15})2014/gm, (_m, head: string) => `${head}${year}`);
    writeFileSync(join(dir, `725300-94846-${year}.gz`), gzipSync(Buffer.from(shifted, "latin1")));
  }
}

/** Stdout of a successful run. */
async function out(args: string[]): Promise<string> {
  const r = await runCli(args);
  expect(r.code, r.err).toBe(0);
  return r.out;
}

describe.skipIf(!HAVE_SAMPLES)(
  "coldsoak climate outputs on real samples against the committed digest",
  () => {
    const digest: Record<string, string> = {};
    beforeAll(async () => {
      const twenty = join(tmp.dir, "twenty");
      writeTwentyYears(twenty);
      const csv = join(tmp.dir, "samples.csv");
      digest["samples.json"] = sha256(await out(["climate", SAMPLES_DIR, "--json", "--no-cache"]));
      digest["samples.txt"] = sha256(await out(["climate", SAMPLES_DIR, "--no-cache", "--csv", csv]));
      digest["samples.csv"] = sha256(readFileSync(csv));
      const cache = ["--cache-dir", join(tmp.dir, "cache")];
      digest["twenty.json"] = sha256(await out(["climate", twenty, "--json", ...cache]));
      digest["twenty-cached.json"] = sha256(await out(["climate", twenty, "--json", ...cache]));
      if (process.env["UPDATE_CLIMATE_DIGEST"] === "1")
        writeFileSync(DIGEST, `${JSON.stringify(digest, null, 2)}\n`);
    }, 120_000);

    it("prints and writes the same bytes as the committed digest", () => {
      const expected = JSON.parse(readFileSync(DIGEST, "utf8")) as Record<string, string>;
      expect(Object.keys(digest)).toEqual(Object.keys(expected));
      for (const [name, hash] of Object.entries(expected)) expect(digest[name], name).toBe(hash);
    });

    it("serves the same document from the cache as from the files", () => {
      expect(digest["twenty-cached.json"]).toBe(digest["twenty.json"]);
    });
  },
);
