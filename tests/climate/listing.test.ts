/**
 * Which files a climate folder gives: symbolic links to files are followed (a folder of links only is
 * read), a file reached twice is read once, links that lead nowhere or to folders are passed over,
 * and a link to a device is refused with the reason.
 */
import { mkdirSync, symlinkSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { listClimateFiles, loadClimate } from "../../src/climate/index.js";
import { InputError } from "../../src/errors.js";
import { HAVE_SAMPLES, noCache, sample, scratchDir } from "./helpers.js";

const tmp = scratchDir();

describe.skipIf(!HAVE_SAMPLES)("symbolic links in climate folders", () => {
  it("a folder of links only is read through them", async () => {
    const dir = join(tmp.dir, "links");
    mkdirSync(dir);
    symlinkSync(sample("725300-94846-2014.gz"), join(dir, "725300-94846-2014.gz"));
    symlinkSync(sample("726430-14920-2015.gz"), join(dir, "726430-14920-2015.gz"));
    const stations = await loadClimate([dir], noCache);
    // The two samples' stations (file names of the real files).
    expect(stations.map((s) => s.meta.id)).toEqual(["725300-94846", "726430-14920"]);
    const [direct] = await loadClimate([sample("725300-94846-2014.gz")], noCache);
    expect(stations[0]!.qc).toEqual(direct!.qc);
  });

  it("a file reached twice is listed once; dangling links and links to folders are passed over", async () => {
    const dir = join(tmp.dir, "twice");
    mkdirSync(join(dir, "sub"), { recursive: true });
    symlinkSync(sample("726430-14920-2015.gz"), join(dir, "a-726430-14920-2015.gz"));
    symlinkSync(join(dir, "a-726430-14920-2015.gz"), join(dir, "sub", "b-726430-14920-2015.gz"));
    symlinkSync(join(dir, "nowhere"), join(dir, "dangling.gz"));
    symlinkSync(tmp.dir, join(dir, "folder-link"));
    expect(await listClimateFiles([dir])).toEqual([join(dir, "a-726430-14920-2015.gz")]);
  });

  it("a link to a device in a folder is refused, saying what it is", async () => {
    const dir = join(tmp.dir, "device");
    mkdirSync(dir);
    symlinkSync(sample("726430-14920-2015.gz"), join(dir, "726430-14920-2015.gz"));
    symlinkSync("/dev/zero", join(dir, "zero.gz"));
    const err = await loadClimate([dir], noCache).catch((e) => e);
    expect(err).toBeInstanceOf(InputError);
    expect(err.message).toMatch(
      /zero\.gz: is a character device, not a regular file; expected a climate file/,
    );
  });
});
