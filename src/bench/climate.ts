/**
 * Benchmark of the climate reader: the full pipeline (gunzip, parse, quality control, site rule,
 * hourly grid, gap filling) on ≥ 50 MB of ISD text built from the real samples, against decompression
 * alone of the same file through the same stream setup and chunk size; then several files on worker
 * threads against the same single-stream decompression. A warm-up round, then 5 rounds in which every
 * job runs once; each figure is the median and range over the rounds (ratios taken round by round).
 * A file this large is parsed on a worker thread while the main thread decompresses it (source.ts),
 * so the reader's time is about the decompression's plus the build (QC, site rule, grid) after it.
 *
 * Run: npx tsc -p tsconfig.build.json && node -e "import('./dist/bench/climate.js').then(m=>m.benchClimate())"
 * The samples are read from ../shared/isd-samples beside the checkout, or from $COLDSOAK_ISD_SAMPLES.
 */
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gunzipSync, gzipSync } from "node:zlib";
import { buildStations } from "../climate/build.js";
import { readFilesInWorkers, workersAvailable } from "../climate/pool.js";
import { readChunks, readClimateFile } from "../climate/source.js";
import { type Figure, figureOf, REPEATS } from "./harness.js";

const TARGET_BYTES = 50 * 1024 * 1024;
const PARALLEL_FILES = 4;
const THREADS = 2;

function samplesDir(): string {
  return (
    process.env.COLDSOAK_ISD_SAMPLES ??
    fileURLToPath(new URL("../../../shared/isd-samples/", import.meta.url))
  );
}

/**
 * ISD text from the real samples, repeated with the year (POS 16-19) moved back one year per copy so that
 * every copy is a new station-year, until at least `target` bytes. Returns one text per copy.
 */
function buildCopies(target: number): string[] {
  const dir = samplesDir();
  if (!existsSync(dir)) throw new Error(`benchmark needs the ISD samples: ${dir} is absent`);
  const texts = readdirSync(dir)
    .filter((n) => n.endsWith(".gz"))
    .sort()
    .map((n) => gunzipSync(readFileSync(join(dir, n))).toString("latin1"));
  const base = texts.map((t) => (t.endsWith("\n") ? t : `${t}\n`)).join("");
  const copies: string[] = [];
  let size = 0;
  for (let k = 0; size < target; k++) {
    const shifted = base.replace(
      /^(.{15})(\d{4})/gm,
      (_, head: string, year: string) => head + String(+year - k),
    );
    copies.push(shifted);
    size += shifted.length;
  }
  return copies;
}

function median(xs: number[]): number {
  return figureOf(xs).median;
}

/**
 * Runs each job once to warm up, then REPEATS rounds in which every job runs once (interleaved, so
 * that a change in machine load touches all of them alike); returns each job's seconds, round by round.
 */
async function timeInterleaved(jobs: (() => Promise<unknown>)[]): Promise<number[][]> {
  for (const job of jobs) await job();
  const times: number[][] = jobs.map(() => []);
  for (let r = 0; r < REPEATS; r++)
    for (let j = 0; j < jobs.length; j++) {
      const t0 = process.hrtime.bigint();
      await jobs[j]!();
      times[j]!.push(Number(process.hrtime.bigint() - t0) / 1e9);
    }
  return times;
}

async function decompressOnly(path: string): Promise<number> {
  let n = 0;
  for await (const chunk of readChunks(path)) n += chunk.length;
  return n;
}

export async function benchClimate(): Promise<Record<string, Figure>> {
  const dir = mkdtempSync(join(tmpdir(), "coldsoak-bench-climate-"));
  try {
    const copies = buildCopies(TARGET_BYTES);
    const all = copies.join("");
    const textBytes = Buffer.byteLength(all, "latin1");
    const single = join(dir, "one.isd.gz");
    writeFileSync(single, gzipSync(Buffer.from(all, "latin1")));
    const parts: string[] = [];
    for (let p = 0; p < PARALLEL_FILES; p++) {
      const text = copies.filter((_, k) => k % PARALLEL_FILES === p).join("");
      const path = join(dir, `part-${p}.isd.gz`);
      writeFileSync(path, gzipSync(Buffer.from(text, "latin1")));
      parts.push(path);
    }
    const mb = textBytes / 1e6;
    console.log(
      `climate reader benchmark: ${mb.toFixed(1)} MB of ISD text (${copies.length} copies of the samples)`,
    );

    const parallel = workersAvailable();
    // The reader's time split into reading (gunzip + parse) and building (QC, site rule, hourly grid).
    const readMs: number[] = [];
    const buildMs: number[] = [];
    const jobs: (() => Promise<unknown>)[] = [
      () => decompressOnly(single),
      async () => {
        const t0 = performance.now();
        const file = await readClimateFile(single);
        const t1 = performance.now();
        buildStations([file], 3);
        readMs.push(t1 - t0);
        buildMs.push(performance.now() - t1);
      },
    ];
    if (parallel) jobs.push(async () => buildStations(await readFilesInWorkers(parts, {}, THREADS), 3));
    const [tDecompress, tReader, tParallel] = await timeInterleaved(jobs);
    const rate = (ts: number[]) => figureOf(ts.map((t) => mb / t));
    const decompressMBps = rate(tDecompress!);
    const readerMBps = rate(tReader!);
    // Throughput ratios round by round: the reader's MB/s over decompression's in the same round.
    const vsDecompress = (ts: number[]) => figureOf(ts.map((t, r) => tDecompress![r]! / t));
    const readerVsDecompress = vsDecompress(tReader!);
    const show = (f: Figure, digits = 1) =>
      `${f.median.toFixed(digits)} (${f.min.toFixed(digits)}–${f.max.toFixed(digits)})`;
    console.log(`  gunzip only          ${show(decompressMBps)} MB/s (median and range of ${REPEATS})`);
    console.log(
      `  reader, one file     ${show(readerMBps)} MB/s (gunzip + parse + QC + site rule + hourly grid)`,
    );
    console.log(
      `    of which read ${median(readMs.slice(1)).toFixed(0)} ms, build ${median(buildMs.slice(1)).toFixed(0)} ms; gunzip alone ${(decompressMBps.median > 0 ? (mb / decompressMBps.median) * 1000 : 0).toFixed(0)} ms (medians)`,
    );
    console.log(`  reader / gunzip      ${show(readerVsDecompress, 2)} (target >= 0.7)`);
    const figures: Record<string, Figure> = {
      textMB: figureOf([mb]),
      readerMBps,
      decompressMBps,
      readerVsDecompress,
    };
    if (parallel) {
      figures["parallelMBps"] = rate(tParallel!);
      figures["parallelVsDecompress"] = vsDecompress(tParallel!);
      console.log(
        `  reader, ${PARALLEL_FILES} files on ${THREADS} worker threads ${show(figures["parallelMBps"]!)} MB/s; / single gunzip ${show(figures["parallelVsDecompress"]!, 2)}`,
      );
    } else console.log("  parallel run skipped: the compiled worker (dist/climate/worker.js) is not present");
    return figures;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
