/**
 * Reader for the ISD full archive format ("ISD format document", NOAA NCEI): the control and
 * mandatory sections are read by position straight from the bytes of a line; the additional data
 * section is searched only for the MA1 group (station pressure). Positions below are 0-based
 * (the document's POS minus one).
 */
import {
  daysFromCivil,
  FIRST_RECORD_YEAR,
  isRecordYear,
  isValidDate,
  kindOfReportType,
  knownStation,
  LAST_RECORD_YEAR,
  MAX_REPORT_TYPES,
  MAX_STATIONS_PER_FILE,
  MISSING_LAT,
  MISSING_LON,
  MISSING_PRESSURE,
  nextSlot,
  noteMalformed,
  type ParsedFile,
  pushMalformed,
  reportTypeIndex,
  stationIndex,
  UNKNOWN_STATION,
} from "./records.js";

const C0 = 48; // "0"
const PLUS = 43;
const MINUS = 45;

/** Unsigned decimal of n digits at b[i..i+n), or -1 if any byte is not a digit. */
function digits(b: Uint8Array, i: number, n: number): number {
  let v = 0;
  for (let k = 0; k < n; k++) {
    const d = b[i + k]! - C0;
    if (d < 0 || d > 9) return -1;
    v = v * 10 + d;
  }
  return v;
}

/** Signed decimal: a sign byte then n digits; NaN if malformed. */
function signed(b: Uint8Array, i: number, n: number): number {
  const s = b[i];
  const v = digits(b, i + 1, n);
  if (v < 0 || (s !== PLUS && s !== MINUS)) return Number.NaN;
  return s === MINUS ? -v : v;
}

/** True when b[i..i+n) are printable ASCII (space to tilde). */
function printable(b: Uint8Array, i: number, n: number): boolean {
  for (let k = 0; k < n; k++) {
    const c = b[i + k]!;
    if (c < 32 || c > 126) return false;
  }
  return true;
}

function ascii(b: Uint8Array, i: number, n: number): string {
  let s = "";
  for (let k = 0; k < n; k++) s += String.fromCharCode(b[i + k]!);
  return s;
}

/** Air-temperature quality codes the format document defines (POS 93). */
const VALID_TEMP_Q = new Uint8Array(128);
for (const ch of "012345679ACIMPRU") VALID_TEMP_Q[ch.charCodeAt(0)] = 1;
/** Station-pressure quality codes accepted as good (MA1; suspect 2/6 and erroneous 3/7 refused). */
const GOOD_PRESSURE_Q = new Uint8Array(128);
for (const ch of "01459M") GOOD_PRESSURE_Q[ch.charCodeAt(0)] = 1;

/** Mandatory part of every record: control (60) + mandatory data (45) characters. */
export const ISD_FIXED_LENGTH = 105;

/**
 * Reader state for one file: the station, report type and call letters of the previous line, each
 * packed into a number from its bytes and compared as such, so that strings are only built when they
 * change (and looked up by their packed bytes when they come back).
 */
export interface IsdLineState {
  file: ParsedFile;
  lastUsaf: number; // POS 5-10 packed, -1 = none yet
  lastWban: number; // POS 11-15 packed
  lastStation: number;
  lastType: number; // POS 42-46 packed, -1 = none yet
  lastTypeIdx: number;
  lastKind: number;
  lastCall: number; // POS 52-56 packed, -1 = none yet
  lastCallText: string | null;
  /** Report types seen in this file, by packed bytes: index in file.reportTypes and kind. */
  types: Map<number, { index: number; kind: number }>;
  /** Call letters seen in this file, by packed bytes. */
  calls: Map<number, string>;
  lineEnd: number; // end of the line being read
  callRun: number; // lines since the call letters or station last changed
  /** Date (year × 10000 + month × 100 + day) of the last good line and its first minute since 1970. */
  lastDateKey: number;
  lastDayMin: number;
  /** Numeric fields of the line being read (F_* slots). */
  fields: Int32Array;
}

export function createIsdLineState(file: ParsedFile): IsdLineState {
  return {
    file,
    lastUsaf: -1,
    lastWban: -1,
    lastStation: -1,
    lastType: -1,
    lastTypeIdx: -1,
    lastKind: 0,
    lastCall: -1,
    lastCallText: null,
    types: new Map(),
    calls: new Map(),
    lineEnd: 0,
    callRun: 0,
    lastDateKey: -1,
    lastDayMin: 0,
    fields: new Int32Array(FIELD_COUNT),
  };
}

/** Bytes b[i..i+3) as one integer (24 bits). */
function pack3(b: Uint8Array, i: number): number {
  return (b[i]! << 16) | (b[i + 1]! << 8) | b[i + 2]!;
}

/** Text field of 5 bytes at b[i] as one number (40 bits, exact), to compare it without a string. */
function key5(b: Uint8Array, i: number): number {
  return pack3(b, i) * 65_536 + ((b[i + 3]! << 8) | b[i + 4]!);
}

/** Text field of 6 bytes at b[i] as one number (48 bits, exact). */
function key6(b: Uint8Array, i: number): number {
  return pack3(b, i) * 16_777_216 + pack3(b, i + 3);
}

/** Adds the current run of call letters to the station's counts (call at the end of a file too). */
export function flushCalls(st: IsdLineState): void {
  if (st.callRun > 0 && st.lastStation >= 0 && st.lastCallText !== null) {
    const calls = st.file.callLetters[st.lastStation]!;
    calls.set(st.lastCallText, (calls.get(st.lastCallText) ?? 0) + st.callRun);
  }
  st.callRun = 0;
}

function malformed(st: IsdLineState, b: Uint8Array, s: number, lineNo: number, field: string, why: string) {
  // Attribute the line to the station its positions 5-15 name, if that is a station of the file;
  // otherwise resolveUnknownStations gives it the station of the line before.
  let station = UNKNOWN_STATION;
  if (st.lastStation >= 0 && key6(b, s + 4) === st.lastUsaf && key5(b, s + 10) === st.lastWban)
    station = st.lastStation;
  else if (st.lineEnd >= s + 15 && printable(b, s + 4, 11)) {
    const known = knownStation(st.file, `${ascii(b, s + 4, 6)}-${ascii(b, s + 10, 5)}`);
    if (known >= 0) station = known;
  }
  pushMalformed(st.file.records, station, lineNo);
  noteMalformed(st.file, lineNo, field, why);
}

/** Slots of IsdLineState.fields: the numeric fields of the fixed part of the line being read. */
const F_VAR_CHARS = 0;
const F_YEAR = 1;
const F_MONTH = 2;
const F_DAY = 3;
const F_HOUR = 4;
const F_MINUTE = 5;
const F_LAT = 6;
const F_LON = 7;
const F_ELEV = 8;
const F_TEMP = 9;
const F_DEW = 10;
const F_SLP = 11;
const FIELD_COUNT = 12;

/**
 * Reads the numeric fields of the fixed part (POS 1-4, 11-27, 29-51, 88-104) into `f`; false when one
 * of them lacks a digit or its sign (the caller then asks fixedPartProblem which one).
 */
function readNumbers(b: Uint8Array, s: number, f: Int32Array): boolean {
  const varChars = digits(b, s, 4);
  const wban = digits(b, s + 10, 5);
  const year = digits(b, s + 15, 4);
  const month = digits(b, s + 19, 2);
  const day = digits(b, s + 21, 2);
  const hour = digits(b, s + 23, 2);
  const minute = digits(b, s + 25, 2);
  const slp = digits(b, s + 99, 5);
  const lat = signed(b, s + 28, 5);
  const lon = signed(b, s + 34, 6);
  const elev = signed(b, s + 46, 4);
  const temp = signed(b, s + 87, 4);
  const dew = signed(b, s + 93, 4);
  f[F_VAR_CHARS] = varChars;
  f[F_YEAR] = year;
  f[F_MONTH] = month;
  f[F_DAY] = day;
  f[F_HOUR] = hour;
  f[F_MINUTE] = minute;
  f[F_LAT] = lat;
  f[F_LON] = lon;
  f[F_ELEV] = elev;
  f[F_TEMP] = temp;
  f[F_DEW] = dew;
  f[F_SLP] = slp;
  return (
    (varChars | wban | year | month | day | hour | minute | slp) >= 0 &&
    !Number.isNaN(lat + lon + elev + temp + dew)
  );
}

/**
 * Why the fixed part of a line that failed the hot path's checks is malformed: the checks in the order
 * the fields come, the first failure as [field, message].
 */
function fixedPartProblem(b: Uint8Array, s: number, e: number): [string, string] {
  const len = e - s;
  if (len < ISD_FIXED_LENGTH) return ["length", `line has ${len} characters, the fixed part needs 105`];
  const varChars = digits(b, s, 4);
  if (varChars < 0) return ["TOTAL-VARIABLE-CHARACTERS", "expected 4 digits at positions 1-4"];
  if (len !== ISD_FIXED_LENGTH + varChars)
    return ["length", `line has ${len} characters, positions 1-4 announce ${ISD_FIXED_LENGTH + varChars}`];
  if (digits(b, s + 10, 5) < 0) return ["WBAN", "expected 5 digits at positions 11-15"];
  const year = digits(b, s + 15, 4);
  if (year < 0 || !isValidDate(year, digits(b, s + 19, 2), digits(b, s + 21, 2)))
    return ["date", "expected a calendar date YYYYMMDD at positions 16-23"];
  if (!isRecordYear(year))
    return ["date", `year ${year} at positions 16-19 outside ${FIRST_RECORD_YEAR}–${LAST_RECORD_YEAR}`];
  const hour = digits(b, s + 23, 2);
  const minute = digits(b, s + 25, 2);
  if (hour < 0 || hour > 23 || minute < 0 || minute > 59)
    return ["time", "expected HHMM (00-23, 00-59) at positions 24-27"];
  const lat = signed(b, s + 28, 5);
  const lon = signed(b, s + 34, 6);
  if (Number.isNaN(lat) || Number.isNaN(lon) || Number.isNaN(signed(b, s + 46, 4)))
    return ["position", "expected signed latitude, longitude and elevation (POS 29-51)"];
  if ((lat !== MISSING_LAT && Math.abs(lat) > 90_000) || (lon !== MISSING_LON && Math.abs(lon) > 180_000))
    return ["position", "latitude or longitude outside ±90°/±180°"];
  if (Number.isNaN(signed(b, s + 87, 4))) return ["TMP", "expected a sign and 4 digits at positions 88-92"];
  const tempQ = b[s + 92]!;
  if (VALID_TEMP_Q[tempQ] !== 1)
    return ["TMP quality", `unknown quality code "${String.fromCharCode(tempQ)}"`];
  if (Number.isNaN(signed(b, s + 93, 4)) || digits(b, s + 99, 5) < 0)
    return ["DEW/SLP", "expected dew point and sea-level pressure digits (POS 94-104)"];
  // Not reached: the hot path only asks when one of the checks above fails.
  return ["line", "unreadable fixed part"];
}

/** Stores a line whose fixed part failed the hot path's checks as malformed, saying why. */
function rejectLine(st: IsdLineState, b: Uint8Array, s: number, e: number, lineNo: number): void {
  const [field, why] = fixedPartProblem(b, s, e);
  malformed(st, b, s, lineNo, field, why);
}

/**
 * Parses one line b[s..e) (without its line break) into the file's record columns; a line that
 * breaks the format is stored as a malformed record and noted with its line number (see rejectLine).
 */
export function parseIsdLine(st: IsdLineState, b: Uint8Array, s: number, e: number, lineNo: number): void {
  const len = e - s;
  st.lineEnd = e;
  if (len < ISD_FIXED_LENGTH) {
    rejectLine(st, b, s, e, lineNo);
    return;
  }
  // Numeric fields; a date seen on the line before is known to be valid.
  const f = st.fields;
  const numbersOk = readNumbers(b, s, f);
  const year = f[F_YEAR]!;
  const month = f[F_MONTH]!;
  const day = f[F_DAY]!;
  const hour = f[F_HOUR]!;
  const minute = f[F_MINUTE]!;
  const lat = f[F_LAT]!;
  const lon = f[F_LON]!;
  const dateKey = year * 10_000 + month * 100 + day;
  const tempQ = b[s + 92]!;
  if (
    !numbersOk ||
    len !== ISD_FIXED_LENGTH + f[F_VAR_CHARS]! ||
    (dateKey !== st.lastDateKey && !(isRecordYear(year) && isValidDate(year, month, day))) ||
    hour > 23 ||
    minute > 59 ||
    (lat !== MISSING_LAT && Math.abs(lat) > 90_000) ||
    (lon !== MISSING_LON && Math.abs(lon) > 180_000) ||
    VALID_TEMP_Q[tempQ] !== 1
  ) {
    rejectLine(st, b, s, e, lineNo);
    return;
  }
  // Text fields: packed bytes compared with the line before; checked printable (and turned into
  // strings) only when they differ from it.
  const usaf = key6(b, s + 4);
  const wban = key5(b, s + 10);
  const typeKey = key5(b, s + 41);
  const callKey = key5(b, s + 51);
  const sameStation = usaf === st.lastUsaf && wban === st.lastWban;
  if (
    (!sameStation && !printable(b, s + 4, 6)) ||
    (typeKey !== st.lastType && !printable(b, s + 41, 5)) ||
    (callKey !== st.lastCall && !printable(b, s + 51, 5))
  ) {
    malformed(st, b, s, lineNo, "characters", "non-printable bytes in the station, type or call letters");
    return;
  }
  // Station: USAF (POS 5-10) + WBAN (POS 11-15), created only once a line of it reads well.
  let station = st.lastStation;
  if (station < 0 || !sameStation) {
    flushCalls(st);
    station = stationIndex(st.file, `${ascii(b, s + 4, 6)}-${ascii(b, s + 10, 5)}`);
    if (station === UNKNOWN_STATION) {
      malformed(st, b, s, lineNo, "station", `more than ${MAX_STATIONS_PER_FILE} stations in one file`);
      return;
    }
    st.lastUsaf = usaf;
    st.lastWban = wban;
    st.lastStation = station;
    st.lastCallText = null;
  }
  // Report type (POS 42-46).
  if (typeKey !== st.lastType) {
    let t = st.types.get(typeKey);
    if (t === undefined) {
      const type = ascii(b, s + 41, 5).trim();
      const index = reportTypeIndex(st.file, type);
      if (index < 0) {
        malformed(st, b, s, lineNo, "REPORT-TYPE", `more than ${MAX_REPORT_TYPES} report types in one file`);
        return;
      }
      t = { index, kind: kindOfReportType(type) };
      st.types.set(typeKey, t);
    }
    st.lastTypeIdx = t.index;
    st.lastKind = t.kind;
    st.lastType = typeKey;
  }
  // Call letters (POS 52-56), counted per station (by runs) to find the usual ones.
  if (st.lastCallText === null || callKey !== st.lastCall) {
    flushCalls(st);
    let text = st.calls.get(callKey);
    if (text === undefined) {
      text = ascii(b, s + 51, 5).trim();
      st.calls.set(callKey, text);
    }
    st.lastCall = callKey;
    st.lastCallText = text;
  }
  st.callRun++;
  if (dateKey !== st.lastDateKey) {
    st.lastDateKey = dateKey;
    st.lastDayMin = daysFromCivil(year, month, day) * 1440;
  }

  const c = st.file.records;
  const i = nextSlot(c);
  c.station[i] = station;
  c.timeMin[i] = st.lastDayMin + hour * 60 + minute;
  c.tempTenths[i] = f[F_TEMP]!;
  c.tempQ[i] = tempQ;
  c.dewTenths[i] = f[F_DEW]!;
  c.slpTenths[i] = f[F_SLP]!;
  c.stationPresTenths[i] =
    len > ISD_FIXED_LENGTH ? stationPressure(b, s + ISD_FIXED_LENGTH, e) : MISSING_PRESSURE;
  c.kind[i] = st.lastKind;
  c.type[i] = st.lastTypeIdx;
  c.source[i] = b[s + 27]!;
  c.latMilli[i] = lat;
  c.lonMilli[i] = lon;
  c.elevM[i] = f[F_ELEV]!;
  c.line[i] = lineNo;
}

const M = 77;
const A = 65;
const ONE = 49;
const R = 82;
const E = 69;

/**
 * How far the search for "MA1" or "REM" may move on, given the byte at the last position of the
 * current 3-byte window (Horspool's shift table for the two patterns together: R. N. Horspool,
 * "Practical fast searching in strings", Software: Practice and Experience 10, 1980). The window is
 * tested at every position where either pattern could start, in increasing order, so the first
 * occurrence is never skipped.
 */
const SHIFT = new Uint8Array(256).fill(3);
SHIFT[M] = 2; // "M" ends REM, starts MA1
SHIFT[R] = 2;
SHIFT[A] = 1;
SHIFT[E] = 1;

/**
 * Station pressure ×10 hPa from the MA1 group of the additional data section b[s..e) (which starts
 * with "ADD"), or MISSING_PRESSURE when absent, missing (99999) or not of good quality. The section is
 * searched up to the remarks ("REM"); a match must be followed by the group's 12 characters
 * (altimeter 5 digits, quality, station pressure 5 digits, quality).
 */
export function stationPressure(b: Uint8Array, s: number, e: number): number {
  if (b[s] !== A || b[s + 1] !== 68 || b[s + 2] !== 68) return MISSING_PRESSURE; // "ADD"
  for (let i = s + 3; i + 15 <= e; ) {
    const c = b[i + 2]!;
    if (c === ONE) {
      if (b[i] === M && b[i + 1] === A) {
        const p = ma1Pressure(b, i);
        if (p >= 0) return p;
      }
    } else if (c === M && b[i] === R && b[i + 1] === E) return MISSING_PRESSURE; // remarks begin
    i += SHIFT[c]!;
  }
  return MISSING_PRESSURE;
}

/**
 * The MA1 group at b[i..i+15): its station pressure ×10 hPa, MISSING_PRESSURE when missing, of
 * doubtful quality or out of range, or -1 when the group's digits are malformed (not a group).
 */
function ma1Pressure(b: Uint8Array, i: number): number {
  if (digits(b, i + 3, 5) < 0) return -1;
  const p = digits(b, i + 9, 5);
  if (p < 0) return -1;
  const q = b[i + 14]!;
  if (p === MISSING_PRESSURE || GOOD_PRESSURE_Q[q] !== 1) return MISSING_PRESSURE;
  if (p < 4500 || p > 10900) return MISSING_PRESSURE; // format document limits, 450.0-1090.0 hPa
  return p;
}

/** True when a line looks like an ISD full-format record (used to detect the format). */
export function looksLikeIsdLine(b: Uint8Array, s: number, e: number): boolean {
  if (e - s < ISD_FIXED_LENGTH) return false;
  const varChars = digits(b, s, 4);
  return (
    varChars >= 0 &&
    digits(b, s + 10, 5) >= 0 &&
    digits(b, s + 15, 12) >= 0 &&
    (b[s + 28] === PLUS || b[s + 28] === MINUS) &&
    (b[s + 87] === PLUS || b[s + 87] === MINUS)
  );
}
