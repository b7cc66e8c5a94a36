/**
 * Reader for the comma-separated global-hourly layout (NOAA NCEI): a quoted header row;
 * `STATION` is the 11-character USAF+WBAN id, `DATE` an ISO UTC time, `LATITUDE`, `LONGITUDE`,
 * `ELEVATION`, `NAME`, `REPORT_TYPE`, `CALL_SIGN`, and each ISD element as its comma-joined sub-fields
 * (`TMP` = "-0267,5": value ×10 °C, quality code), with the codes of the full format.
 *
 * NOAA writes one record per line (no field holds a line break), so the file is read line by line like
 * the fixed layouts and each line split into its fields here: every line is exactly one record, read
 * or malformed, and a stray quote can never swallow the lines after it.
 */
import { inputError } from "../errors.js";
import {
  daysFromCivil,
  isRecordYear,
  isValidDate,
  kindOfReportType,
  MISSING_ELEV,
  MISSING_LAT,
  MISSING_LON,
  MISSING_PRESSURE,
  nextSlot,
  noteMalformed,
  type ParsedFile,
  pushMalformed,
  recordDateProblem,
  reportTypeIndex,
  stationIndex,
  UNKNOWN_STATION,
} from "./records.js";

export interface CsvColumns {
  count: number;
  station: number;
  date: number;
  tmp: number;
  latitude: number;
  longitude: number;
  elevation: number;
  name: number;
  reportType: number;
  callSign: number;
  source: number;
  dew: number;
  slp: number;
  ma1: number;
}

/** Column positions from the header row; STATION, DATE and TMP are required. */
export function csvColumns(header: string[], path: string, line = 1): CsvColumns {
  const at = (name: string) => header.findIndex((h) => h.trim().toUpperCase() === name);
  const cols: CsvColumns = {
    count: header.length,
    station: at("STATION"),
    date: at("DATE"),
    tmp: at("TMP"),
    latitude: at("LATITUDE"),
    longitude: at("LONGITUDE"),
    elevation: at("ELEVATION"),
    name: at("NAME"),
    reportType: at("REPORT_TYPE"),
    callSign: at("CALL_SIGN"),
    source: at("SOURCE"),
    dew: at("DEW"),
    slp: at("SLP"),
    ma1: at("MA1"),
  };
  for (const [key, name] of [
    ["station", "STATION"],
    ["date", "DATE"],
    ["tmp", "TMP"],
  ] as const)
    if (cols[key] < 0) throw inputError(path, line, name, `header row has no ${name} column`);
  return cols;
}

const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?Z?$/;
const SIGNED4_RE = /^[+-]\d{4}$/;
const TEMP_Q_RE = /^[012345679ACIMPRU]$/;

/** Decimal degrees or metres to an integer of `scale`; `missing` for an empty cell; NaN if not a number. */
function scaled(cell: string | undefined, scale: number, missing: number): number {
  if (cell === undefined || cell.trim() === "") return missing;
  const v = Number(cell);
  return Number.isFinite(v) ? Math.round(v * scale) : Number.NaN;
}

/** Stores one data row; returns false when the row is malformed (then stored as such). */
export function readCsvRecord(file: ParsedFile, cols: CsvColumns, row: string[], lineNo: number): boolean {
  const bad = (field: string, why: string, station = UNKNOWN_STATION): false => {
    pushMalformed(file.records, station, lineNo);
    noteMalformed(file, lineNo, field, why);
    return false;
  };
  if (row.length !== cols.count) return bad("columns", `expected ${cols.count} columns, found ${row.length}`);
  const stationCell = (row[cols.station] ?? "").trim();
  if (!/^[0-9A-Z]{6}\d{5}$/.test(stationCell))
    return bad("STATION", "expected the 11-character USAF+WBAN id");
  const station = stationIndex(file, `${stationCell.slice(0, 6)}-${stationCell.slice(6)}`);
  if (station === UNKNOWN_STATION) return bad("STATION", "more stations in one file than can be told apart");
  const m = DATE_RE.exec((row[cols.date] ?? "").trim());
  const year = Number(m?.[1]);
  const month = Number(m?.[2]);
  const day = Number(m?.[3]);
  const hour = Number(m?.[4]);
  const minute = Number(m?.[5]);
  if (!m || !isValidDate(year, month, day) || hour > 23 || minute > 59)
    return bad("DATE", "expected an ISO UTC time such as 2014-01-06T13:51:00", station);
  if (!isRecordYear(year)) return bad("DATE", recordDateProblem(year), station);
  const [tv, tq] = (row[cols.tmp] ?? "").split(",");
  if (tv === undefined || tq === undefined || !SIGNED4_RE.test(tv) || !TEMP_Q_RE.test(tq))
    return bad("TMP", 'expected value ×10 °C and quality code, e.g. "-0267,5"', station);
  const lat = scaled(row[cols.latitude], 1000, MISSING_LAT);
  const lon = scaled(row[cols.longitude], 1000, MISSING_LON);
  const elev = scaled(row[cols.elevation], 1, MISSING_ELEV);
  if (
    Number.isNaN(lat) ||
    Number.isNaN(lon) ||
    Number.isNaN(elev) ||
    (lat !== MISSING_LAT && Math.abs(lat) > 90_000) ||
    (lon !== MISSING_LON && Math.abs(lon) > 180_000) ||
    Math.abs(elev) > 9999
  )
    return bad("LATITUDE/LONGITUDE/ELEVATION", "expected decimal degrees and metres", station);
  const [dv] = (row[cols.dew] ?? "").split(",");
  const [sv] = (row[cols.slp] ?? "").split(",");
  const ma1 = (row[cols.ma1] ?? "").split(",");
  const type = (row[cols.reportType] ?? "").trim() || "CSV";
  const typeIdx = reportTypeIndex(file, type);
  if (typeIdx < 0) return bad("REPORT_TYPE", "more report types in one file than can be told apart", station);

  const name = (row[cols.name] ?? "").trim();
  if (name !== "" && file.stationNames[station] === null) file.stationNames[station] = name;
  const call = (row[cols.callSign] ?? "").trim();
  const calls = file.callLetters[station]!;
  calls.set(call, (calls.get(call) ?? 0) + 1);

  const c = file.records;
  const i = nextSlot(c);
  c.station[i] = station;
  c.timeMin[i] = daysFromCivil(year, month, day) * 1440 + hour * 60 + minute;
  c.tempTenths[i] = Number(tv);
  c.tempQ[i] = tq.charCodeAt(0);
  c.dewTenths[i] = dv !== undefined && SIGNED4_RE.test(dv) ? Number(dv) : 9999;
  c.slpTenths[i] = sv !== undefined && /^\d{5}$/.test(sv) ? Number(sv) : MISSING_PRESSURE;
  c.stationPresTenths[i] = stationPressureFromMa1(ma1);
  c.kind[i] = kindOfReportType(type);
  c.type[i] = typeIdx;
  const src = (row[cols.source] ?? "9").trim();
  c.source[i] = src.length === 1 ? src.charCodeAt(0) : 57;
  c.latMilli[i] = lat;
  c.lonMilli[i] = lon;
  c.elevM[i] = elev;
  c.line[i] = lineNo;
  return true;
}

/** MA1 sub-fields: altimeter, quality, station pressure ×10 hPa, quality (same rules as the full reader). */
function stationPressureFromMa1(ma1: string[]): number {
  const p = ma1[2];
  const q = ma1[3];
  if (p === undefined || q === undefined || !/^\d{5}$/.test(p) || !/^[01459M]$/.test(q))
    return MISSING_PRESSURE;
  const v = Number(p);
  return v >= 4500 && v <= 10900 ? v : MISSING_PRESSURE;
}

const QUOTE = 34;
const COMMA = 44;

/**
 * The fields of one CSV line (RFC 4180: fields separated by commas, a field in double quotes may hold
 * commas and doubled quotes), or null when its quotes are not well formed: a quoted field left open, a
 * quote inside an unquoted field, or text after a closing quote.
 */
export function splitCsvLine(line: string): string[] | null {
  const out: string[] = [];
  let i = 0;
  const n = line.length;
  for (;;) {
    if (line.charCodeAt(i) === QUOTE) {
      let field = "";
      let from = i + 1;
      for (;;) {
        const q = line.indexOf('"', from);
        if (q < 0) return null; // quoted field left open
        field += line.slice(from, q);
        if (line.charCodeAt(q + 1) === QUOTE) {
          field += '"';
          from = q + 2;
          continue;
        }
        i = q + 1;
        break;
      }
      out.push(field);
      if (i === n) return out;
      if (line.charCodeAt(i) !== COMMA) return null; // text after the closing quote
      i++;
    } else {
      let comma = line.indexOf(",", i);
      if (comma < 0) comma = n;
      const field = line.slice(i, comma);
      if (field.includes('"')) return null; // quote inside an unquoted field
      out.push(field);
      if (comma === n) return out;
      i = comma + 1;
    }
  }
}

/** The CSV reader's state: the header's columns once its first line is read. */
export interface CsvLineState {
  columns: CsvColumns | null;
}

const UTF8 = new TextDecoder();

/**
 * One line b[s..e) of a global-hourly CSV file: the header row first (a UTF-8 byte-order mark before
 * it is skipped), then one record per line, stored read or malformed.
 */
export function parseCsvLine(
  file: ParsedFile,
  st: CsvLineState,
  b: Uint8Array,
  s: number,
  e: number,
  lineNo: number,
): void {
  if (st.columns === null && b[s] === 0xef && b[s + 1] === 0xbb && b[s + 2] === 0xbf) s += 3;
  const row = splitCsvLine(UTF8.decode(b.subarray(s, e)));
  if (st.columns === null) {
    if (row === null) throw inputError(file.path, lineNo, undefined, "unreadable CSV header row (quotes?)");
    st.columns = csvColumns(row, file.path, lineNo);
  } else if (row === null) {
    pushMalformed(file.records, UNKNOWN_STATION, lineNo);
    noteMalformed(file, lineNo, "CSV", "unreadable CSV record (quotes?)");
  } else readCsvRecord(file, st.columns, row, lineNo);
}
