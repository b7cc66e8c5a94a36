/**
 * The output folder swap under kill -9. A child process (the build, which `npm test` makes first;
 * skipped, saying so, without it) writes the real output of a plan run through the swap of
 * src/cli/outputFolder.ts and is killed with SIGKILL at every step of the swap (the test hook
 * COLDSOAK_TEST_SWAP_PAUSE_MS pauses after each) and at spread-out instants. Whatever the instant,
 * `out/<name>` holds the complete results of the run before or of the run killed, and the next run
 * removes what killed runs left. Concurrent runs on one output root all succeed.
 */
import { type ChildProcess, spawn } from "node:child_process";
import { existsSync, readlinkSync } from "node:fs";
import { cp, mkdir, rm, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { folderFiles, makeClimateRoot, planText, visibleEntries, writeCaseIn } from "./planCase.js";
import { runCli } from "./runCli.js";

const DIST = fileURLToPath(new URL("../../dist/", import.meta.url));
const HAVE_BUILD = existsSync(join(DIST, "cli", "outputFolder.js"));
if (!HAVE_BUILD) console.warn(`output-swap tests skipped: ${DIST} holds no build (run npm run build)`);

/** Pause after each swap step, long enough for this process to see the step announced and kill. */
const STEP_PAUSE_MS = 400;

interface Outcome {
  code: number | null;
  signal: NodeJS.Signals | null;
  stderr: string;
}

/**
 * Runs a child (node + args); kills it with SIGKILL when it announces swap step `killAt`, or
 * `killAfterMs` after its start. `pauseMs` sets the swap's test hook.
 */
function runChild(
  args: string[],
  opts: { killAt?: string; killAfterMs?: number; pauseMs?: number } = {},
): Promise<Outcome> {
  const env: NodeJS.ProcessEnv = { ...process.env, SOURCE_DATE_EPOCH: "1700000000" };
  if (opts.pauseMs !== undefined) env.COLDSOAK_TEST_SWAP_PAUSE_MS = String(opts.pauseMs);
  const child: ChildProcess = spawn(process.execPath, args, { env });
  let stderr = "";
  child.stderr!.on("data", (d: Buffer) => {
    stderr += d.toString();
    if (opts.killAt !== undefined && stderr.includes(`swap-step: ${opts.killAt}\n`)) child.kill("SIGKILL");
  });
  child.stdout!.resume();
  if (opts.killAfterMs !== undefined) setTimeout(() => child.kill("SIGKILL"), opts.killAfterMs);
  return new Promise((resolve) =>
    child.on("exit", (code, signal) => resolve({ code, signal: signal as NodeJS.Signals | null, stderr })),
  );
}

let root = "";
/** The complete output of two plans named alike ("minimal") whose seeds differ, and the same saved as JSON for the child. */
const expected: [Map<string, string>, Map<string, string>] = [new Map(), new Map()];
const outputJson: [string, string] = ["", ""];
/** The child script: writes a saved output through the swap, as `coldsoak plan` does at its end. */
let swapScript = "";

beforeAll(async () => {
  if (!HAVE_BUILD) return;
  root = await makeClimateRoot();
  process.env.SOURCE_DATE_EPOCH = "1700000000";
  for (const i of [0, 1] as const) {
    const c = await writeCaseIn(
      root,
      planText((t) => {
        t.seed = i + 1;
      }),
    );
    const r = await runCli(["plan", c.plan, "--out", join(root, `clean${i}`), "--no-cache"]);
    expect(r.code, r.err).toBe(0);
    expected[i] = folderFiles(join(root, `clean${i}`, "minimal"));
    outputJson[i] = join(root, `output${i}.json`);
    await writeFile(outputJson[i], JSON.stringify([...expected[i]]));
  }
  expect(expected[0].get("results.json")).not.toBe(expected[1].get("results.json"));
  swapScript = join(root, "swap-child.mjs");
  await writeFile(
    swapScript,
    [
      'import { readFileSync } from "node:fs";',
      `import { writeOutputFolder } from ${JSON.stringify(pathToFileURL(join(DIST, "cli", "outputFolder.js")).href)};`,
      "const [out, saved] = process.argv.slice(2);",
      'await writeOutputFolder(out, "minimal", new Map(JSON.parse(readFileSync(saved, "utf8"))));',
    ].join("\n"),
  );
}, 120_000);

afterAll(async () => {
  if (root !== "") await rm(root, { recursive: true, force: true });
});

/** The swap child writing plan i's output into `out`. */
const swapArgs = (out: string, i: 0 | 1) => [swapScript, out, outputJson[i]];

/** Which plan's complete output `out/minimal` holds: 0, 1, or null when neither (missing or partial). */
function visibleResults(out: string): 0 | 1 | null {
  const dir = join(out, "minimal");
  if (!existsSync(dir)) return null;
  const files = JSON.stringify([...folderFiles(dir)]);
  for (const i of [0, 1] as const) if (files === JSON.stringify([...expected[i]])) return i;
  return null;
}

describe.skipIf(!HAVE_BUILD)("output folder swap under kill -9", () => {
  it("killed at every step of the swap, out/<name> holds the old or the new results, complete", async () => {
    const out = join(root, "steps");
    expect((await runChild(swapArgs(out, 0))).code).toBe(0);
    let shown: 0 | 1 = 0;
    // Steps of the swap in order (src/cli/outputFolder.ts); the last two come after the rename.
    const steps = ["writing", "written", "linked", "swapped", "cleaned"];
    for (const [k, stepName] of steps.entries()) {
      const next = (1 - shown) as 0 | 1;
      const r = await runChild(swapArgs(out, next), { killAt: stepName, pauseMs: STEP_PAUSE_MS });
      expect(r.signal, r.stderr).toBe("SIGKILL");
      // Before the rename of the link the old results show, from it on the new ones.
      expect(visibleResults(out), `killed at ${stepName}`).toBe(k < 3 ? shown : next);
      shown = visibleResults(out)!;
    }
    // The next run removes every leftover of the killed runs.
    const last = (1 - shown) as 0 | 1;
    expect((await runChild(swapArgs(out, last))).code).toBe(0);
    expect(visibleResults(out)).toBe(last);
    expect(visibleEntries(out)).toEqual(["minimal"]);
  });

  it("killed at 16 instants spread over a run, out/<name> is always complete", async () => {
    const out = join(root, "instants");
    expect((await runChild(swapArgs(out, 0))).code).toBe(0);
    const started = Date.now();
    expect((await runChild(swapArgs(out, 1), { pauseMs: 50 })).code).toBe(0);
    const runMs = Date.now() - started;
    let shown: 0 | 1 = 1;
    for (let k = 1; k <= 16; k++) {
      const next = (1 - shown) as 0 | 1;
      const r = await runChild(swapArgs(out, next), { pauseMs: 50, killAfterMs: (runMs * k) / 17 });
      const now = visibleResults(out);
      expect(now, `killed after ${k}/17 of a run (exit ${r.code ?? r.signal})`).not.toBeNull();
      shown = now!;
    }
    expect((await runChild(swapArgs(out, 0))).code).toBe(0);
    expect(visibleEntries(out)).toEqual(["minimal"]);
  });

  it("a folder written by the earlier layout is replaced; a kill while it is moved aside loses nothing", async () => {
    const out = join(root, "legacy");
    await mkdir(out);
    await cp(join(root, "clean0", "minimal"), join(out, "minimal"), { recursive: true, dereference: true });
    // Killed right after the old folder was moved aside: the name is missing for that instant only.
    const r = await runChild(swapArgs(out, 1), { killAt: "moved-aside", pauseMs: STEP_PAUSE_MS });
    expect(r.signal).toBe("SIGKILL");
    // The next run links the moved folder back first: killed while writing, the old results show.
    await runChild(swapArgs(out, 1), { killAt: "writing", pauseMs: STEP_PAUSE_MS });
    expect(visibleResults(out)).toBe(0);
    expect((await runChild(swapArgs(out, 1))).code).toBe(0);
    expect(visibleResults(out)).toBe(1);
    expect(visibleEntries(out)).toEqual(["minimal"]);
  });

  it("concurrent runs on one output root all succeed and leave one complete folder", async () => {
    const out = join(root, "concurrent");
    // Swaps paused at each step, so that they overlap: each sees the others' folders in progress.
    const runs = await Promise.all(
      [0, 1, 0, 1].map((i) => runChild(swapArgs(out, i as 0 | 1), { pauseMs: 100 })),
    );
    for (const r of runs) expect(r.code, r.stderr).toBe(0);
    expect(visibleResults(out)).not.toBeNull();
    expect(readlinkSync(join(out, "minimal"))).toMatch(/^\.minimal\.v-/);
    // Versions replaced while another run was between its steps are left for the next run to remove.
    expect((await runChild(swapArgs(out, 1))).code).toBe(0);
    expect(visibleResults(out)).toBe(1);
    expect(visibleEntries(out)).toEqual(["minimal"]);
  });
});
