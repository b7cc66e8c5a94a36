/** Helpers of the climate tests: the real NOAA samples beside the checkout, and temporary files. */
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gunzipSync, gzipSync } from "node:zlib";

/** `../shared/isd-samples` relative to the repository (real, public-domain NOAA ISD files). */
export const SAMPLES_DIR = fileURLToPath(new URL("../../../shared/isd-samples/", import.meta.url));
export const HAVE_SAMPLES = existsSync(SAMPLES_DIR);
if (!HAVE_SAMPLES) console.warn(`climate tests on real data skipped: ${SAMPLES_DIR} is absent`);

export function sample(name: string): string {
  return join(SAMPLES_DIR, name);
}

/** The lines of a real gzipped sample (small files: fine to hold in a test). */
export function sampleLines(name: string): string[] {
  return gunzipSync(readFileSync(sample(name)))
    .toString("latin1")
    .split("\n")
    .filter((l) => l !== "");
}

export function tempDir(): { dir: string; cleanup: () => void } {
  const dir = mkdtempSync(join(tmpdir(), "coldsoak-climate-"));
  return { dir, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

export function writeLines(path: string, lines: string[], gzip = false): string {
  const text = `${lines.join("\n")}\n`;
  writeFileSync(path, gzip ? gzipSync(text) : text, "latin1");
  return path;
}

/** Replaces the character at 1-based position `pos` (as the ISD format document counts). */
export function setAt(line: string, pos: number, text: string): string {
  return line.slice(0, pos - 1) + text + line.slice(pos - 1 + text.length);
}

/** Sum of the dropped counts. */
export function droppedTotal(qc: { dropped: Record<string, number> }): number {
  return Object.values(qc.dropped).reduce((a, b) => a + b, 0);
}
