/**
 * Column store of the records read from one climate file: growable typed arrays, one slot per line,
 * so the readers never build an object (or a string per field) per line. Typed arrays are also what a
 * worker thread can hand back without copying.
 */

/** Record kinds: how a record takes part in the hourly series (docs/methods.md, "Hourly series"). */
export const KIND_ROUTINE = 0;
export const KIND_SPECIAL = 1;
export const KIND_SUMMARY = 2;
export const KIND_MALFORMED = 3;

/** Missing-value markers, as in the ISD format document. */
export const MISSING_TEMP = 9999; // +9999, tenths of °C
export const MISSING_LAT = 99999; // +99999, thousandths of a degree
export const MISSING_LON = 999999; // +999999
export const MISSING_ELEV = 9999; // +9999 m
export const MISSING_PRESSURE = 99999; // 99999, tenths of hPa

/** Station index of a malformed line whose station could not be read yet. */
export const UNKNOWN_STATION = 0xffff;

export interface RecordColumns {
  count: number;
  station: Uint16Array; // index into ParsedFile.stations
  timeMin: Int32Array; // UTC minutes since 1970-01-01
  tempTenths: Int16Array; // air temperature ×10 °C (MISSING_TEMP = missing)
  tempQ: Uint8Array; // quality code character (ASCII)
  dewTenths: Int16Array; // dew point ×10 °C
  slpTenths: Int32Array; // sea-level pressure ×10 hPa
  stationPresTenths: Int32Array; // station pressure ×10 hPa (MA1), MISSING_PRESSURE when absent or not good
  kind: Uint8Array; // KIND_*
  type: Uint8Array; // index into ParsedFile.reportTypes
  source: Uint8Array; // data source flag character (ASCII)
  latMilli: Int32Array;
  lonMilli: Int32Array;
  elevM: Int16Array;
  line: Uint32Array; // 1-based line number in the file
}

const COLUMN_NAMES = [
  "station",
  "timeMin",
  "tempTenths",
  "tempQ",
  "dewTenths",
  "slpTenths",
  "stationPresTenths",
  "kind",
  "type",
  "source",
  "latMilli",
  "lonMilli",
  "elevM",
  "line",
] as const;
type ColumnName = (typeof COLUMN_NAMES)[number];

export function createColumns(capacity = 4096): RecordColumns {
  return {
    count: 0,
    station: new Uint16Array(capacity),
    timeMin: new Int32Array(capacity),
    tempTenths: new Int16Array(capacity),
    tempQ: new Uint8Array(capacity),
    dewTenths: new Int16Array(capacity),
    slpTenths: new Int32Array(capacity),
    stationPresTenths: new Int32Array(capacity),
    kind: new Uint8Array(capacity),
    type: new Uint8Array(capacity),
    source: new Uint8Array(capacity),
    latMilli: new Int32Array(capacity),
    lonMilli: new Int32Array(capacity),
    elevM: new Int16Array(capacity),
    line: new Uint32Array(capacity),
  };
}

/** Makes room for one more record (doubling) and returns its slot. */
export function nextSlot(c: RecordColumns): number {
  if (c.count === c.station.length) {
    const cap = c.station.length * 2;
    for (const name of COLUMN_NAMES) {
      const old = c[name];
      const grown = new (old.constructor as { new (n: number): typeof old })(cap);
      grown.set(old as never);
      (c as unknown as Record<ColumnName, typeof old>)[name] = grown;
    }
  }
  return c.count++;
}

/** Copies the used part of every column into arrays of exact length (before handing them to another thread). */
export function trimColumns(c: RecordColumns): RecordColumns {
  const out = { count: c.count } as RecordColumns;
  for (const name of COLUMN_NAMES) {
    (out as unknown as Record<ColumnName, unknown>)[name] = c[name].slice(0, c.count);
  }
  return out;
}

/** The buffers behind the columns, for `postMessage(..., transferList)`. */
export function columnBuffers(c: RecordColumns): ArrayBuffer[] {
  return COLUMN_NAMES.map((n) => c[n].buffer as ArrayBuffer);
}

/** Writes a malformed record (only its station and line matter). */
export function pushMalformed(c: RecordColumns, station: number, line: number): void {
  const i = nextSlot(c);
  c.station[i] = station;
  c.kind[i] = KIND_MALFORMED;
  c.line[i] = line;
  c.timeMin[i] = 0;
  c.tempTenths[i] = MISSING_TEMP;
  c.latMilli[i] = MISSING_LAT;
  c.lonMilli[i] = MISSING_LON;
  c.elevM[i] = MISSING_ELEV;
  c.stationPresTenths[i] = MISSING_PRESSURE;
}

/** Everything read from one file, before quality control. */
export interface ParsedFile {
  path: string;
  format: "isd" | "isd-lite" | "csv";
  /** Decompressed bytes read. */
  bytes: number;
  lines: number;
  stations: string[]; // "USAF-WBAN"
  stationNames: (string | null)[]; // from the CSV NAME column where present
  callLetters: Map<string, number>[]; // per station: call letters → records
  reportTypes: string[];
  records: RecordColumns;
  malformedExamples: string[];
}

/** Report types that are summaries, not observations (ISD format document, POS 42-46). */
export const SUMMARY_TYPES = new Set(["SOD", "SOM", "COOPD"]);
/** Special (non-routine) report types: used only where no routine report exists (docs/methods.md, "Hourly series"). */
export const SPECIAL_TYPES = new Set(["FM-16", "SAOSP"]);

export function kindOfReportType(type: string): number {
  if (SUMMARY_TYPES.has(type)) return KIND_SUMMARY;
  if (SPECIAL_TYPES.has(type)) return KIND_SPECIAL;
  return KIND_ROUTINE;
}

/**
 * Most stations one file may hold: station indices are 16-bit and 0xffff marks an unknown station.
 * Lines of further stations are malformed (see stationIndex).
 */
export const MAX_STATIONS_PER_FILE = UNKNOWN_STATION;

/** Index of each station id of a file, so that finding a station costs the same however many there are. */
const stationLookup = new WeakMap<ParsedFile, Map<string, number>>();

function lookupOf(file: ParsedFile): Map<string, number> {
  let m = stationLookup.get(file);
  if (m === undefined || m.size !== file.stations.length) {
    m = new Map(file.stations.map((id, i) => [id, i]));
    stationLookup.set(file, m);
  }
  return m;
}

/** Index of a station already seen in the file, or -1. */
export function knownStation(file: ParsedFile, id: string): number {
  return lookupOf(file).get(id) ?? -1;
}

/**
 * Gives each station of a file its index, creating it on first sight; UNKNOWN_STATION when the file
 * already holds MAX_STATIONS_PER_FILE stations (the caller stores the line as malformed).
 */
export function stationIndex(file: ParsedFile, id: string): number {
  const lookup = lookupOf(file);
  let i = lookup.get(id);
  if (i === undefined) {
    if (file.stations.length >= MAX_STATIONS_PER_FILE) return UNKNOWN_STATION;
    i = file.stations.length;
    file.stations.push(id);
    file.stationNames.push(null);
    file.callLetters.push(new Map());
    lookup.set(id, i);
  }
  return i;
}

/** Most report types one file may hold (their index is one byte). */
export const MAX_REPORT_TYPES = 256;

/** Index of a report type in the file, created on first sight; -1 when the file holds MAX_REPORT_TYPES already. */
export function reportTypeIndex(file: ParsedFile, type: string): number {
  let i = file.reportTypes.indexOf(type);
  if (i < 0) {
    if (file.reportTypes.length >= MAX_REPORT_TYPES) return -1;
    i = file.reportTypes.length;
    file.reportTypes.push(type);
  }
  return i;
}

/** A file with no records yet; `capacity` sizes its columns (they grow beyond it when needed). */
export function emptyParsedFile(path: string, format: ParsedFile["format"], capacity = 4096): ParsedFile {
  return {
    path,
    format,
    bytes: 0,
    lines: 0,
    stations: [],
    stationNames: [],
    callLetters: [],
    reportTypes: [],
    records: createColumns(Math.max(16, capacity)),
    malformedExamples: [],
  };
}

export const MAX_MALFORMED_EXAMPLES = 5;

export function noteMalformed(file: ParsedFile, line: number, field: string, reason: string): void {
  if (file.malformedExamples.length < MAX_MALFORMED_EXAMPLES)
    file.malformedExamples.push(`${file.path}:${line}:${field}: ${reason}`);
}

/**
 * Gives malformed lines whose station could not be read the station of the nearest earlier good line
 * of the same file (or, before the first good line, of the first good line), so that every line read
 * lands in exactly one station's counts.
 */
export function resolveUnknownStations(c: RecordColumns): void {
  if (c.station.subarray(0, c.count).indexOf(UNKNOWN_STATION) < 0) return; // none to resolve
  let first = UNKNOWN_STATION;
  for (let i = 0; i < c.count; i++)
    if (c.kind[i] !== KIND_MALFORMED && c.station[i] !== UNKNOWN_STATION) {
      first = c.station[i]!;
      break;
    }
  let last = first;
  for (let i = 0; i < c.count; i++) {
    if (c.station[i] === UNKNOWN_STATION) c.station[i] = last;
    else last = c.station[i]!;
  }
}

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** True when year-month-day is a real calendar date (proleptic Gregorian). */
export function isValidDate(year: number, month: number, day: number): boolean {
  if (month < 1 || month > 12 || day < 1) return false;
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const dim = month === 2 && leap ? 29 : DAYS_IN_MONTH[month - 1]!;
  return day <= dim;
}

/**
 * Years a climate record may carry (docs/methods.md, "Quality control"): the oldest hourly records in
 * ISD are from the 1890s; 2100 leaves room for every file to come. A fixed bound, so that a result
 * never depends on the date of the run; it also keeps minute counts since 1970 far inside 32 bits.
 */
export const FIRST_RECORD_YEAR = 1890;
export const LAST_RECORD_YEAR = 2100;

/** True when the year lies within FIRST_RECORD_YEAR … LAST_RECORD_YEAR. */
export function isRecordYear(year: number): boolean {
  return year >= FIRST_RECORD_YEAR && year <= LAST_RECORD_YEAR;
}

/** Why a record's date is refused: the message of a malformed "date" field. */
export function recordDateProblem(year: number): string {
  return isRecordYear(year)
    ? "expected a real calendar date"
    : `year ${year} outside ${FIRST_RECORD_YEAR}–${LAST_RECORD_YEAR}`;
}

/** The UTC year last asked for and its bounds in minutes (records come mostly in time order). */
export interface YearCache {
  lo: number;
  hi: number;
  year: number;
}

export function yearCache(): YearCache {
  return { lo: 0, hi: -1, year: 0 };
}

/** UTC year of a minute count since 1970. */
export function yearOfMinute(cache: YearCache, min: number): number {
  if (min >= cache.lo && min < cache.hi) return cache.year;
  const year = new Date(min * 60_000).getUTCFullYear();
  cache.year = year;
  cache.lo = Date.UTC(year, 0, 1) / 60_000;
  cache.hi = Date.UTC(year + 1, 0, 1) / 60_000;
  return year;
}

/** Days since 1970-01-01 of a civil date (H. Hinnant's days_from_civil algorithm). */
export function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}
