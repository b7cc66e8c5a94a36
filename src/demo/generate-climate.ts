#!/usr/bin/env node
/**
 * Regenerates the demo's climate files: `npm run demo:climate` (or `node dist/demo/generate-climate.js
 * [folder]`). Writes one gzipped ISD full-format file per invented station and year into
 * sample-data/climate/ (or the folder given). A file whose content is already right is left untouched,
 * so a regeneration leaves the committed files byte-identical.
 */
import { readFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { isMainModule } from "../entry.js";
import { writeFileAtomic } from "../fsutil.js";
import { generateStationYears, gzipHoldsText, gzipText, type YearStats } from "./climateFiles.js";
import { DEMO_FIRST_YEAR, DEMO_LAST_YEAR, DEMO_SEED, DEMO_STATIONS, stationId } from "./stations.js";

/** The committed folder: sample-data/climate/ at the project root (two levels above src/demo or dist/demo). */
export const DEMO_CLIMATE_DIR = fileURLToPath(new URL("../../sample-data/climate/", import.meta.url));

export interface WrittenFile {
  path: string;
  bytes: number;
  changed: boolean;
  stats: YearStats;
}

/** Writes every station-year file into `folder`; returns what was written. */
export async function writeDemoClimate(folder: string, seed = DEMO_SEED): Promise<WrittenFile[]> {
  const written: WrittenFile[] = [];
  for (const station of DEMO_STATIONS) {
    for (const file of generateStationYears(station, seed, DEMO_FIRST_YEAR, DEMO_LAST_YEAR)) {
      const path = join(folder, file.fileName);
      const existing = await readFile(path).catch(() => null);
      if (existing !== null && gzipHoldsText(existing, file.text)) {
        written.push({ path, bytes: existing.length, changed: false, stats: file.stats });
        continue;
      }
      const bytes = gzipText(file.text);
      await writeFileAtomic(path, bytes);
      written.push({ path, bytes: bytes.length, changed: true, stats: file.stats });
    }
  }
  return written;
}

async function run(argv: string[]): Promise<void> {
  const folder = resolve(argv[0] ?? DEMO_CLIMATE_DIR);
  const files = await writeDemoClimate(folder);
  let total = 0;
  for (const station of DEMO_STATIONS) {
    const mine = files.filter((f) => f.path.includes(stationId(station)));
    const bytes = mine.reduce((s, f) => s + f.bytes, 0);
    const records = mine.reduce((s, f) => s + f.stats.records, 0);
    total += bytes;
    process.stdout.write(
      `${stationId(station)} ${station.name.padEnd(15)} ${mine.length} files, ${records} records, ${(bytes / 1024).toFixed(0)} KiB\n`,
    );
  }
  const changed = files.filter((f) => f.changed).length;
  process.stdout.write(
    `${files.length} files in ${folder}: ${changed} written, ${files.length - changed} already up to date; ${(total / 1048576).toFixed(2)} MiB\n`,
  );
}

if (isMainModule(import.meta.url)) {
  run(process.argv.slice(2)).catch((err: unknown) => {
    process.stderr.write(`generate-climate: ${err instanceof Error ? err.message : String(err)}\n`);
    process.exitCode = 1;
  });
}
