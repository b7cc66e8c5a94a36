/**
 * The year rules, applied to every file once it is read (docs/methods.md, "Quality control"). A
 * record's year is bounded by the readers (FIRST_RECORD_YEAR … LAST_RECORD_YEAR); here:
 * - in a file named `USAF-WBAN-YEAR` (NOAA NCEI's name for one station-year, by UTC year), a record
 *   of another UTC year is malformed;
 * - in any other file, a stray run of years is malformed: per station, a run of consecutive UTC years
 *   holding records, with none in the years just before and after it, that holds fewer than
 *   STRAY_YEARS_MAX_RECORDS records and less than STRAY_YEARS_MAX_SHARE of the station's records in
 *   the file (one damaged year digit, say). Files holding many years keep them all: each year of a
 *   real record holds thousands of records.
 * A malformed record takes no part in the hour grid, so the grid never spans a rejected year.
 */
import { basename } from "node:path";
import { yearFromFileName } from "./isdLite.js";
import {
  FIRST_RECORD_YEAR,
  isRecordYear,
  KIND_MALFORMED,
  LAST_RECORD_YEAR,
  noteMalformed,
  type ParsedFile,
  yearCache,
  yearOfMinute,
} from "./records.js";

/** A stray run of years holds fewer records than this (a year of hourly reports holds 8,760 or more). */
export const STRAY_YEARS_MAX_RECORDS = 100;
/** … and less than this share of the station's records in the file. */
export const STRAY_YEARS_MAX_SHARE = 0.05;

const YEARS = LAST_RECORD_YEAR - FIRST_RECORD_YEAR + 1;

/** Marks the records of a file that the year rules refuse as malformed, each noted with its reason. */
export function applyYearRules(file: ParsedFile): void {
  const nameYear = yearFromFileName(basename(file.path));
  if (nameYear !== null && isRecordYear(nameYear)) rejectOutsideYear(file, nameYear);
  else rejectStrayYears(file);
}

function reject(file: ParsedFile, i: number, why: string): void {
  file.records.kind[i] = KIND_MALFORMED;
  noteMalformed(file, file.records.line[i]!, "date", why);
}

/** Records of a file named for one UTC year that lie outside it. */
function rejectOutsideYear(file: ParsedFile, nameYear: number): void {
  const { count, kind, timeMin } = file.records;
  const years = yearCache();
  for (let i = 0; i < count; i++) {
    if (kind[i] === KIND_MALFORMED) continue;
    const y = yearOfMinute(years, timeMin[i]!);
    if (y !== nameYear) reject(file, i, `year ${y} outside ${nameYear}, the UTC year the file name gives`);
  }
}

/** Records of stray runs of years (see the module comment). */
function rejectStrayYears(file: ParsedFile): void {
  const { count, kind, timeMin, station } = file.records;
  // Year of each record as an offset from FIRST_RECORD_YEAR (the readers keep years within the bounds).
  const yearAt = new Uint8Array(count);
  const perStation = new Map<number, Uint32Array>();
  const years = yearCache();
  for (let i = 0; i < count; i++) {
    if (kind[i] === KIND_MALFORMED) continue;
    const y = yearOfMinute(years, timeMin[i]!) - FIRST_RECORD_YEAR;
    yearAt[i] = y;
    let counts = perStation.get(station[i]!);
    if (counts === undefined) {
      counts = new Uint32Array(YEARS);
      perStation.set(station[i]!, counts);
    }
    counts[y]!++;
  }
  const strayOf = new Map<number, Uint8Array>();
  for (const [st, counts] of perStation) {
    const stray = strayYears(counts);
    if (stray !== null) strayOf.set(st, stray);
  }
  if (strayOf.size === 0) return;
  for (let i = 0; i < count; i++) {
    if (kind[i] === KIND_MALFORMED) continue;
    const stray = strayOf.get(station[i]!);
    if (stray !== undefined && stray[yearAt[i]!] === 1)
      reject(
        file,
        i,
        `year ${FIRST_RECORD_YEAR + yearAt[i]!} stray: no records in the years next to it and too few of its own`,
      );
  }
}

/** 1 for each year (offset) of a stray run among a station's counts per year, or null when none is stray. */
export function strayYears(counts: Uint32Array): Uint8Array | null {
  let total = 0;
  for (const n of counts) total += n;
  let out: Uint8Array | null = null;
  for (let y = 0; y < counts.length; ) {
    if (counts[y] === 0) {
      y++;
      continue;
    }
    const from = y;
    let n = 0;
    for (; y < counts.length && counts[y]! > 0; y++) n += counts[y]!;
    if (n < STRAY_YEARS_MAX_RECORDS && n < STRAY_YEARS_MAX_SHARE * total) {
      out ??= new Uint8Array(counts.length);
      out.fill(1, from, y);
    }
  }
  return out;
}
