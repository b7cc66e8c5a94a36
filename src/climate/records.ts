/**
 * Column store of the records read from one climate file: growable typed arrays, one slot per line,
 * so the readers never build an object (or a string per field) per line. Typed arrays are also what a
 * worker thread can hand back without copying.
 */

/** Record kinds: how a record takes part in the hourly series (docs/methods.md §4). */
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
/** Special (non-routine) report types: used only where no routine report exists (docs/methods.md §4). */
export const SPECIAL_TYPES = new Set(["FM-16", "SAOSP"]);

export function kindOfReportType(type: string): number {
  if (SUMMARY_TYPES.has(type)) return KIND_SUMMARY;
  if (SPECIAL_TYPES.has(type)) return KIND_SPECIAL;
  return KIND_ROUTINE;
}

/** Gives each station of a file its index, creating it on first sight. */
export function stationIndex(file: ParsedFile, id: string): number {
  let i = file.stations.indexOf(id);
  if (i < 0) {
    i = file.stations.length;
    file.stations.push(id);
    file.stationNames.push(null);
    file.callLetters.push(new Map());
  }
  return i;
}

export function reportTypeIndex(file: ParsedFile, type: string): number {
  let i = file.reportTypes.indexOf(type);
  if (i < 0) {
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
