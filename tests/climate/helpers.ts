/** Helpers of the climate tests: the real NOAA samples beside the checkout, and temporary files. */
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gunzipSync, gzipSync } from "node:zlib";
import { afterAll } from "vitest";

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

/** Options of loadClimate for tests: the default gap length, no cache. */
export const noCache = { gapHours: 3, cacheDir: null };

export function tempDir(): { dir: string; cleanup: () => void } {
  const dir = mkdtempSync(join(tmpdir(), "coldsoak-climate-"));
  return { dir, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

/** A temporary folder for the tests of one file, removed after them. */
export function scratchDir(): { dir: string } {
  const tmp = tempDir();
  afterAll(() => tmp.cleanup());
  return tmp;
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

/** A full-format line as a global-hourly CSV row, field by field from the format document's positions. */
export function csvRow(l: string): string {
  const q = (s: string) => `"${s}"`;
  const date = `${l.slice(15, 19)}-${l.slice(19, 21)}-${l.slice(21, 23)}T${l.slice(23, 25)}:${l.slice(25, 27)}:00`;
  const ma1 = l.indexOf("MA1", 105);
  const ma1Cell =
    ma1 > 0 ? `${l.slice(ma1 + 3, ma1 + 8)},${l[ma1 + 8]},${l.slice(ma1 + 9, ma1 + 14)},${l[ma1 + 14]}` : "";
  return [
    q(l.slice(4, 15)),
    q(date),
    q(l[27]!),
    q((Number(l.slice(28, 34)) / 1000).toFixed(5)),
    q((Number(l.slice(34, 41)) / 1000).toFixed(5)),
    q(String(Number(l.slice(46, 51)))),
    q("CHICAGO O'HARE INTERNATIONAL AIRPORT, IL US"),
    q(l.slice(41, 46)),
    q(l.slice(51, 56)),
    q(`${l.slice(87, 92)},${l[92]}`),
    q(`${l.slice(93, 98)},${l[98]}`),
    q(`${l.slice(99, 104)},${l[104]}`),
    q(ma1Cell),
  ].join(",");
}
export const CSV_HEADER =
  '"STATION","DATE","SOURCE","LATITUDE","LONGITUDE","ELEVATION","NAME","REPORT_TYPE","CALL_SIGN","TMP","DEW","SLP","MA1"';

/** A station-history CSV listing the Chicago sample's station (for ISD-Lite files, which carry no position). */
export const CHICAGO_HISTORY =
  '"USAF","WBAN","STATION NAME","CTRY","STATE","ICAO","LAT","LON","ELEV(M)","BEGIN","END"\n' +
  // Position as in the sample's FM-15 records (real file); name from memory.
  '"725300","94846","CHICAGO O\'HARE INTERNATIONAL AIRPORT","US","IL","KORD","+41.995","-087.934","+0205.0","19461001","20250101"\n';
