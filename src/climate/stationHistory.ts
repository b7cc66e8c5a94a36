/**
 * Optional station-history CSV supplied by the user (NOAA's station list layout): columns USAF, WBAN,
 * STATION NAME, CTRY, STATE, ICAO, LAT, LON, ELEV(M), BEGIN, END. It gives station names (the full
 * format carries none) and positions for files that carry none (ISD-Lite).
 */
import { parse } from "csv-parse/sync";
import { inputError } from "../errors.js";
import { readInputText } from "../fsutil.js";

/** Largest station-history CSV read (NOAA NCEI's list of every ISD station is about 3 MB). */
const MAX_HISTORY_BYTES = 64 * 1024 * 1024;

export interface HistoryEntry {
  name: string | null;
  icao: string | null;
  lat: number | null;
  lon: number | null;
  elevationM: number | null;
  end: string; // YYYYMMDD, to prefer the latest row of a station
}

const REQUIRED = ["USAF", "WBAN", "STATION NAME", "ICAO", "LAT", "LON", "ELEV(M)", "END"] as const;

function optionalNumber(
  path: string,
  line: number,
  field: string,
  cell: string | undefined,
  limit: number,
): number | null {
  const text = (cell ?? "").trim();
  if (text === "") return null;
  const v = Number(text);
  if (!Number.isFinite(v) || Math.abs(v) > limit)
    throw inputError(path, line, field, `expected a number within ±${limit}, found "${text}"`);
  return v;
}

/** Reads the station-history CSV into a map from "USAF-WBAN" to its latest row. */
export async function readStationHistory(path: string): Promise<Map<string, HistoryEntry>> {
  const text = await readInputText(path, "the station-history CSV", MAX_HISTORY_BYTES);
  let rows: string[][];
  try {
    rows = parse(text, { bom: true, relax_column_count: true, skip_empty_lines: true }) as string[][];
  } catch (err) {
    const e = err as { lines?: number; message: string };
    throw inputError(path, e.lines, undefined, `not a readable CSV: ${e.message}`);
  }
  const header = (rows[0] ?? []).map((h) => h.trim().toUpperCase());
  const col = Object.fromEntries(REQUIRED.map((name) => [name, header.indexOf(name)])) as Record<
    (typeof REQUIRED)[number],
    number
  >;
  for (const name of REQUIRED)
    if (col[name] < 0)
      throw inputError(
        path,
        1,
        name,
        "station-history header needs USAF, WBAN, STATION NAME, CTRY, STATE, ICAO, LAT, LON, ELEV(M), BEGIN, END",
      );
  const out = new Map<string, HistoryEntry>();
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r]!;
    const line = r + 1;
    const usaf = (row[col.USAF] ?? "").trim();
    const wban = (row[col.WBAN] ?? "").trim();
    if (!/^[0-9A-Z]{6}$/.test(usaf) || !/^\d{5}$/.test(wban))
      throw inputError(path, line, "USAF/WBAN", "expected a 6-character USAF and a 5-digit WBAN id");
    const entry: HistoryEntry = {
      name: (row[col["STATION NAME"]] ?? "").trim() || null,
      icao: (row[col.ICAO] ?? "").trim() || null,
      lat: optionalNumber(path, line, "LAT", row[col.LAT], 90),
      lon: optionalNumber(path, line, "LON", row[col.LON], 180),
      elevationM: optionalNumber(path, line, "ELEV(M)", row[col["ELEV(M)"]], 9000),
      end: (row[col.END] ?? "").trim(),
    };
    const id = `${usaf}-${wban}`;
    const prev = out.get(id);
    if (prev === undefined || entry.end >= prev.end) out.set(id, entry);
  }
  return out;
}
