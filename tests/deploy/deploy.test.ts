/**
 * The batch-engine examples of deploy/ against the shard contract (deploy/README.md; README, "Scale
 * past one machine"): shard k is the engine's task number as is (k = 0 … n − 1), n is the task count,
 * every shard writes screen-part-k-of-n.json and the merge reads exactly the n partials. Lint-level:
 * the YAML parses, the Slurm scripts pass `bash -n`, and each command is run by the shell it is
 * written for with a stand-in `coldsoak` (and `sbatch`) on PATH that records its arguments, so the
 * arguments the real tool would get are checked without a cluster.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseAllDocuments } from "yaml";
import { partialName } from "../../src/plan/screenMerge.js";
import { parseShard } from "../../src/plan/shard.js";

const DEPLOY = fileURLToPath(new URL("../../deploy/", import.meta.url));
const K8S = join(DEPLOY, "kubernetes");
const SLURM = join(DEPLOY, "slurm");

interface Container {
  command: string[];
  args: string[];
  env: { name: string; value: string }[];
  volumeMounts: { name: string; mountPath: string }[];
}

interface JobSpec {
  kind: string;
  spec: {
    completionMode?: string;
    completions?: number;
    parallelism?: number;
    template: { spec: { restartPolicy: string; containers: Container[] } };
  };
}

/** The one document of a YAML file, failing on any parse error or warning. */
function yamlJob(file: string): JobSpec {
  const docs = parseAllDocuments(readFileSync(file, "utf8"));
  expect(Array.isArray(docs)).toBe(true);
  const list = docs as Exclude<typeof docs, { empty: true }>;
  expect(list).toHaveLength(1);
  expect(list[0]!.errors).toEqual([]);
  expect(list[0]!.warnings).toEqual([]);
  return list[0]!.toJS() as JobSpec;
}

const envOf = (c: Container) => Object.fromEntries(c.env.map((e) => [e.name, e.value]));

let dir: string;
let bin: string;
let record: string;

/** Runs a file or a shell command line with the stand-ins first on PATH; returns exit code and the arguments each stand-in got. */
function run(
  file: string,
  args: string[],
  env: Record<string, string>,
): { code: number; calls: string[][]; err: string } {
  rmSync(record, { force: true });
  const r = spawnSync(file, args, {
    env: { PATH: `${bin}:${process.env["PATH"]}`, RECORD: record, ...env },
    encoding: "utf8",
  });
  let calls: string[][] = [];
  try {
    calls = readFileSync(record, "utf8")
      .split("\u0001\n")
      .filter((c) => c !== "")
      .map((c) => c.split("\u0000").slice(0, -1));
  } catch {
    calls = [];
  }
  return { code: r.status ?? -1, calls, err: r.stderr };
}

/** A folder of partials for shards 0 … n − 1 of n, and decoys of another count and another name. */
function partials(n: number): string {
  const parts = mkdtempSync(join(dir, "parts-"));
  for (let k = 0; k < n; k++) writeFileSync(join(parts, partialName(k, n)), "{}");
  writeFileSync(join(parts, partialName(0, n + 1)), "{}");
  writeFileSync(join(parts, "screen.json"), "{}");
  return parts;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "coldsoak-deploy-"));
  bin = join(dir, "bin");
  record = join(dir, "calls");
  mkdirSync(bin);
  // Each call: program name and arguments, NUL-terminated, the call ended by \x01 and a newline.
  const standIn = (name: string, stdout = "") =>
    `#!/bin/sh\n{ printf '%s\\0' ${name} "$@"; printf '\\001\\n'; } >> "$RECORD"\n${stdout}`;
  writeFileSync(join(bin, "coldsoak"), standIn("coldsoak"));
  // sbatch --parsable prints the job id (and the cluster after a semicolon on a federation).
  writeFileSync(join(bin, "sbatch"), standIn("sbatch", "echo '4242;cluster'\n"));
  chmodSync(join(bin, "coldsoak"), 0o755);
  chmodSync(join(bin, "sbatch"), 0o755);
});

afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

describe("Kubernetes Indexed Job", () => {
  let job: JobSpec;
  let merge: JobSpec;
  beforeAll(() => {
    job = yamlJob(join(K8S, "screen-job.yaml"));
    merge = yamlJob(join(K8S, "merge-job.yaml"));
  });

  it("is an Indexed Job of n completions, and SHARDS is n in the shards and the merge", () => {
    expect(job.kind).toBe("Job");
    expect(job.spec.completionMode).toBe("Indexed");
    const n = job.spec.completions!;
    expect(n).toBeGreaterThan(1);
    expect(job.spec.parallelism!).toBeLessThanOrEqual(n);
    expect(job.spec.template.spec.restartPolicy).toBe("Never");
    const [c] = job.spec.template.spec.containers;
    expect(envOf(c!)["SHARDS"]).toBe(String(n));
    expect(envOf(merge.spec.template.spec.containers[0]!)["SHARDS"]).toBe(String(n));
    expect(merge.spec.completionMode).toBeUndefined();
  });

  it("gives the pod of completion index k the arguments --shard k/n", () => {
    const c = job.spec.template.spec.containers[0]!;
    const n = job.spec.completions!;
    for (const k of [0, 1, n - 1]) {
      const r = run(c.command[0]!, [...c.command.slice(1), ...c.args], {
        ...envOf(c),
        JOB_COMPLETION_INDEX: String(k),
      });
      expect(r.code).toBe(0);
      expect(r.calls).toHaveLength(1);
      const argv = r.calls[0]!;
      expect(argv.slice(0, 2)).toEqual(["coldsoak", "screen"]);
      const shard = argv[argv.indexOf("--shard") + 1]!;
      expect(shard).toBe(`${k}/${n}`);
      expect(parseShard(shard)).toEqual({ index: k, count: n });
      const out = argv[argv.indexOf("--out") + 1]!;
      expect(c.volumeMounts.some((m) => out.startsWith(m.mountPath))).toBe(true);
    }
  });

  it("merges exactly the n partials", () => {
    const c = merge.spec.template.spec.containers[0]!;
    const n = job.spec.completions!;
    const parts = partials(n);
    const line = c.args.join(" ").replaceAll("/work/parts", parts);
    const r = run(c.command[0]!, [...c.command.slice(1), line], envOf(c));
    expect(r.code).toBe(0);
    const argv = r.calls[0]!;
    expect(argv.slice(0, 2)).toEqual(["coldsoak", "screen-merge"]);
    const files = argv.filter((a) => a.startsWith(parts)).map((f) => f.slice(parts.length + 1));
    expect(files.sort()).toEqual(Array.from({ length: n }, (_v, k) => partialName(k, n)).sort());
  });
});

describe("Slurm job array", () => {
  const sbatch = join(SLURM, "screen-array.sbatch");
  const mergeScript = join(SLURM, "merge.sbatch");

  it("passes bash -n", () => {
    for (const f of ["screen-array.sbatch", "merge.sbatch", "submit.sh"])
      expect(() => execFileSync("bash", ["-n", join(SLURM, f)])).not.toThrow();
    expect(() => execFileSync("bash", ["-n", join(K8S, "run.sh")])).not.toThrow();
  });

  it("declares the array 0-(n-1) and gives task k the arguments --shard k/n", () => {
    const m = /^#SBATCH --array=0-(\d+)$/m.exec(readFileSync(sbatch, "utf8"));
    expect(m).not.toBeNull();
    const n = Number(m![1]) + 1;
    for (const k of [0, 7, n - 1]) {
      const r = run("bash", [sbatch], {
        SLURM_ARRAY_TASK_ID: String(k),
        SLURM_ARRAY_TASK_MIN: "0",
        SLURM_ARRAY_TASK_MAX: String(n - 1),
        SLURM_CPUS_PER_TASK: "2",
        PLAN: "region.yaml",
        ARCHIVE: "/data/isd",
        PARTS: "/scratch/parts",
      });
      expect(r.code).toBe(0);
      expect(r.calls).toEqual([
        [
          "coldsoak",
          "screen",
          "region.yaml",
          "/data/isd",
          "--shard",
          `${k}/${n}`,
          "--out",
          "/scratch/parts",
          "--workers",
          "2",
        ],
      ]);
    }
  });

  it("refuses an array that does not start at 0, and a missing path", () => {
    const base = { SLURM_ARRAY_TASK_ID: "3", SLURM_ARRAY_TASK_MAX: "9", PLAN: "p", ARCHIVE: "a", PARTS: "o" };
    expect(run("bash", [sbatch], { ...base, SLURM_ARRAY_TASK_MIN: "1" }).code).toBe(2);
    const { PLAN: _p, ...noPlan } = base;
    const r = run("bash", [sbatch], { ...noPlan, SLURM_ARRAY_TASK_MIN: "0" });
    expect(r.code).not.toBe(0);
    expect(r.calls).toEqual([]);
  });

  it("merges exactly the n partials", () => {
    const n = 7;
    const parts = partials(n);
    const r = run("bash", [mergeScript], { PARTS: parts, SHARDS: String(n), OUT: "/scratch/results" });
    expect(r.code).toBe(0);
    const argv = r.calls[0]!;
    expect(argv.slice(0, 2)).toEqual(["coldsoak", "screen-merge"]);
    expect(argv.slice(-2)).toEqual(["--out", "/scratch/results"]);
    const files = argv.filter((a) => a.startsWith(parts)).map((f) => f.slice(parts.length + 1));
    expect(files.sort()).toEqual(Array.from({ length: n }, (_v, k) => partialName(k, n)).sort());
  });

  it("submits the array 0-(n-1) and the merge after it, with n", () => {
    const work = join(dir, "work");
    const plan = join(dir, "region.yaml");
    writeFileSync(plan, "name: region\n");
    const r = run("bash", [join(SLURM, "submit.sh"), plan, dir, work, "12"], {});
    expect(r.code).toBe(0);
    expect(r.calls).toHaveLength(2);
    const [array, merge] = r.calls as [string[], string[]];
    expect(array).toContain("--array=0-11");
    expect(array.at(-1)).toBe(sbatch);
    expect(merge).toContain("--dependency=afterok:4242");
    expect(merge.find((a) => a.startsWith("--export="))).toMatch(/SHARDS=12(,|$)/);
    expect(merge.at(-1)).toBe(mergeScript);
  });
});
