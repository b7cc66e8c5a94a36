/**
 * Reader for the ISD full archive format ("ISD format document", NOAA NCEI): the control and
 * mandatory sections are read by position straight from the bytes of a line; the additional data
 * section is searched only for the MA1 group (station pressure). Positions below are 0-based
 * (the document's POS minus one).
 */
import {
  daysFromCivil,
  isValidDate,
  kindOfReportType,
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

function sameBytes(a: Uint8Array, b: Uint8Array, i: number, n: number): boolean {
  for (let k = 0; k < n; k++) if (a[k] !== b[i + k]) return false;
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
 * Reader state for one file: the station and report type of the previous line, compared byte by
 * byte so that strings are only built when they change.
 */
export interface IsdLineState {
  file: ParsedFile;
  lastId: Uint8Array; // 11 bytes USAF+WBAN
  lastStation: number;
  lastType: Uint8Array; // 5 bytes
  lastTypeIdx: number;
  lastKind: number;
  lastCall: Uint8Array; // 5 bytes
  lastCallText: string | null;
  lineEnd: number; // end of the line being read
  callRun: number; // lines since the call letters or station last changed
}

export function createIsdLineState(file: ParsedFile): IsdLineState {
  return {
    file,
    lastId: new Uint8Array(11),
    lastStation: -1,
    lastType: new Uint8Array(5),
    lastTypeIdx: -1,
    lastKind: 0,
    lastCall: new Uint8Array(5),
    lastCallText: null,
    lineEnd: 0,
    callRun: 0,
  };
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
  if (st.lastStation >= 0 && sameBytes(st.lastId, b, s + 4, 11)) station = st.lastStation;
  else if (st.lineEnd >= s + 15 && printable(b, s + 4, 11)) {
    const known = st.file.stations.indexOf(`${ascii(b, s + 4, 6)}-${ascii(b, s + 10, 5)}`);
    if (known >= 0) station = known;
  }
  pushMalformed(st.file.records, station, lineNo);
  noteMalformed(st.file, lineNo, field, why);
}

/**
 * Parses one line b[s..e) (without its line break) into the file's record columns; a line that
 * breaks the format is stored as a malformed record and noted with its line number.
 */
export function parseIsdLine(st: IsdLineState, b: Uint8Array, s: number, e: number, lineNo: number): void {
  const len = e - s;
  st.lineEnd = e;
  if (len < ISD_FIXED_LENGTH) {
    malformed(st, b, s, lineNo, "length", `line has ${len} characters, the fixed part needs 105`);
    return;
  }
  const varChars = digits(b, s, 4);
  if (varChars < 0) {
    malformed(st, b, s, lineNo, "TOTAL-VARIABLE-CHARACTERS", "expected 4 digits at positions 1-4");
    return;
  }
  if (len !== ISD_FIXED_LENGTH + varChars) {
    malformed(
      st,
      b,
      s,
      lineNo,
      "length",
      `line has ${len} characters, positions 1-4 announce ${ISD_FIXED_LENGTH + varChars}`,
    );
    return;
  }
  if (digits(b, s + 10, 5) < 0) {
    malformed(st, b, s, lineNo, "WBAN", "expected 5 digits at positions 11-15");
    return;
  }
  // Date and time (POS 16-23, 24-27), UTC.
  const year = digits(b, s + 15, 4);
  const month = digits(b, s + 19, 2);
  const day = digits(b, s + 21, 2);
  const hour = digits(b, s + 23, 2);
  const minute = digits(b, s + 25, 2);
  if (year < 0 || !isValidDate(year, month, day)) {
    malformed(st, b, s, lineNo, "date", "expected a calendar date YYYYMMDD at positions 16-23");
    return;
  }
  if (hour < 0 || hour > 23 || minute < 0 || minute > 59) {
    malformed(st, b, s, lineNo, "time", "expected HHMM (00-23, 00-59) at positions 24-27");
    return;
  }
  const lat = signed(b, s + 28, 5);
  const lon = signed(b, s + 34, 6);
  const elev = signed(b, s + 46, 4);
  if (Number.isNaN(lat) || Number.isNaN(lon) || Number.isNaN(elev)) {
    malformed(st, b, s, lineNo, "position", "expected signed latitude, longitude and elevation (POS 29-51)");
    return;
  }
  if ((lat !== MISSING_LAT && Math.abs(lat) > 90_000) || (lon !== MISSING_LON && Math.abs(lon) > 180_000)) {
    malformed(st, b, s, lineNo, "position", "latitude or longitude outside ±90°/±180°");
    return;
  }
  const temp = signed(b, s + 87, 4);
  const tempQ = b[s + 92]!;
  if (Number.isNaN(temp)) {
    malformed(st, b, s, lineNo, "TMP", "expected a sign and 4 digits at positions 88-92");
    return;
  }
  if (VALID_TEMP_Q[tempQ] !== 1) {
    malformed(st, b, s, lineNo, "TMP quality", `unknown quality code "${String.fromCharCode(tempQ)}"`);
    return;
  }
  const dew = signed(b, s + 93, 4);
  const slp = digits(b, s + 99, 5);
  if (Number.isNaN(dew) || slp < 0) {
    malformed(st, b, s, lineNo, "DEW/SLP", "expected dew point and sea-level pressure digits (POS 94-104)");
    return;
  }
  // Text fields become strings only when they differ from the line before; they must be printable.
  if (!printable(b, s + 4, 6) || !printable(b, s + 41, 5) || !printable(b, s + 51, 5)) {
    malformed(st, b, s, lineNo, "characters", "non-printable bytes in the station, type or call letters");
    return;
  }
  // Station: USAF (POS 5-10) + WBAN (POS 11-15), created only once a line of it reads well.
  let station = st.lastStation;
  if (station < 0 || !sameBytes(st.lastId, b, s + 4, 11)) {
    flushCalls(st);
    station = stationIndex(st.file, `${ascii(b, s + 4, 6)}-${ascii(b, s + 10, 5)}`);
    st.lastId.set(b.subarray(s + 4, s + 15));
    st.lastStation = station;
    st.lastCallText = null;
  }
  // Report type (POS 42-46).
  if (st.lastTypeIdx < 0 || !sameBytes(st.lastType, b, s + 41, 5)) {
    const type = ascii(b, s + 41, 5).trim();
    st.lastTypeIdx = reportTypeIndex(st.file, type);
    st.lastKind = kindOfReportType(type);
    st.lastType.set(b.subarray(s + 41, s + 46));
  }
  // Call letters (POS 52-56), counted per station (by runs) to find the usual ones.
  if (st.lastCallText === null || !sameBytes(st.lastCall, b, s + 51, 5)) {
    flushCalls(st);
    st.lastCall.set(b.subarray(s + 51, s + 56));
    st.lastCallText = ascii(b, s + 51, 5).trim();
  }
  st.callRun++;

  const c = st.file.records;
  const i = nextSlot(c);
  c.station[i] = station;
  c.timeMin[i] = daysFromCivil(year, month, day) * 1440 + hour * 60 + minute;
  c.tempTenths[i] = temp;
  c.tempQ[i] = tempQ;
  c.dewTenths[i] = dew;
  c.slpTenths[i] = slp;
  c.stationPresTenths[i] =
    len > ISD_FIXED_LENGTH ? stationPressure(b, s + ISD_FIXED_LENGTH, e) : MISSING_PRESSURE;
  c.kind[i] = st.lastKind;
  c.type[i] = st.lastTypeIdx;
  c.source[i] = b[s + 27]!;
  c.latMilli[i] = lat;
  c.lonMilli[i] = lon;
  c.elevM[i] = elev;
  c.line[i] = lineNo;
}

const M = 77;
const A = 65;
const ONE = 49;
const R = 82;
const E = 69;

/**
 * Station pressure ×10 hPa from the MA1 group of the additional data section b[s..e) (which starts
 * with "ADD"), or MISSING_PRESSURE when absent, missing (99999) or not of good quality. The section is
 * scanned up to the remarks ("REM"); a match must be followed by the group's 12 characters
 * (altimeter 5 digits, quality, station pressure 5 digits, quality).
 */
export function stationPressure(b: Uint8Array, s: number, e: number): number {
  if (b[s] !== A || b[s + 1] !== 68 || b[s + 2] !== 68) return MISSING_PRESSURE; // "ADD"
  for (let i = s + 3; i + 15 <= e; i++) {
    const c = b[i];
    if (c === R && b[i + 1] === E && b[i + 2] === M) return MISSING_PRESSURE; // "REM": remarks begin
    if (c === M && b[i + 1] === A && b[i + 2] === ONE) {
      if (digits(b, i + 3, 5) < 0) continue;
      const p = digits(b, i + 9, 5);
      const q = b[i + 14]!;
      if (p < 0) continue;
      if (p === MISSING_PRESSURE || GOOD_PRESSURE_Q[q] !== 1) return MISSING_PRESSURE;
      if (p < 4500 || p > 10900) return MISSING_PRESSURE; // format document limits, 450.0-1090.0 hPa
      return p;
    }
  }
  return MISSING_PRESSURE;
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
