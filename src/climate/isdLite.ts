/**
 * Reader for ISD-Lite (NOAA NCEI's hourly subset of ISD): one line per UTC hour, 12 whitespace-separated
 * integers: year, month, day, hour, air temperature ×10 °C, dew point ×10 °C, sea-level pressure ×10 hPa,
 * wind direction, wind speed ×10 m/s, sky cover, 1-h and 6-h precipitation ×10 mm; −9999 = missing
 * (NOAA NCEI ISD-Lite format). The layout carries no station, position or quality code: the station
 * comes from the file name (USAF-WBAN-YEAR) or an option, the position from another file of the same
 * station or the station-history CSV, and values are treated as having passed the gross limits check.
 */
import {
  daysFromCivil,
  isRecordYear,
  isValidDate,
  KIND_ROUTINE,
  MISSING_ELEV,
  MISSING_LAT,
  MISSING_LON,
  MISSING_PRESSURE,
  MISSING_TEMP,
  nextSlot,
  noteMalformed,
  type ParsedFile,
  pushMalformed,
  recordDateProblem,
  reportTypeIndex,
} from "./records.js";

export const LITE_FIELDS = 12;
const LITE_MISSING = -9999;
/** Quality code given to ISD-Lite values: "9", passed gross limits check (ISD format document). */
const LITE_QUALITY = "9".charCodeAt(0);

const fields = new Float64Array(LITE_FIELDS + 1);

/** Splits b[s..e) on spaces and tabs into integers; returns the count, or -1 on a non-integer token. */
function splitInts(b: Uint8Array, s: number, e: number, out: Float64Array): number {
  let n = 0;
  let i = s;
  while (i < e) {
    while (i < e && (b[i] === 32 || b[i] === 9)) i++;
    if (i >= e) break;
    let neg = false;
    if (b[i] === 45 || b[i] === 43) {
      neg = b[i] === 45;
      i++;
    }
    let v = 0;
    let nd = 0;
    while (i < e && b[i] !== 32 && b[i] !== 9) {
      const d = b[i]! - 48;
      if (d < 0 || d > 9) return -1;
      v = v * 10 + d;
      nd++;
      i++;
    }
    if (nd === 0 || nd > 6) return -1;
    if (n < out.length) out[n] = neg ? -v : v;
    n++;
  }
  return n;
}

/** True when a line reads as an ISD-Lite hour (format detection). */
export function looksLikeLiteLine(b: Uint8Array, s: number, e: number): boolean {
  const n = splitInts(b, s, e, fields);
  return n === LITE_FIELDS && fields[0]! >= 1000 && isValidDate(fields[0]!, fields[1]!, fields[2]!);
}

/** A file name `USAF-WBAN[-YEAR][.ext...]`, as NOAA NCEI names the files of one station(-year). */
const STATION_FILE_NAME = /^([0-9A-Z]{6})-(\d{5})(?:-(\d{4}))?(?:\.|$)/;

/** "USAF-WBAN" from a file name such as `725300-94846-2014` or `725300-94846-2014.gz`. */
export function stationIdFromFileName(name: string): string | null {
  const m = STATION_FILE_NAME.exec(name);
  return m ? `${m[1]}-${m[2]}` : null;
}

/** The UTC year a file name `USAF-WBAN-YEAR[.ext...]` gives, or null when the name gives none. */
export function yearFromFileName(name: string): number | null {
  const y = STATION_FILE_NAME.exec(name)?.[3];
  return y === undefined ? null : Number(y);
}

export function parseLiteLine(
  file: ParsedFile,
  station: number,
  b: Uint8Array,
  s: number,
  e: number,
  lineNo: number,
): void {
  const n = splitInts(b, s, e, fields);
  if (n !== LITE_FIELDS) {
    pushMalformed(file.records, station, lineNo);
    noteMalformed(
      file,
      lineNo,
      n < 0 ? "integers" : "fields",
      n < 0 ? "expected whitespace-separated integers" : `expected ${LITE_FIELDS} fields, found ${n}`,
    );
    return;
  }
  const year = fields[0]!;
  const month = fields[1]!;
  const day = fields[2]!;
  const hour = fields[3]!;
  if (!isValidDate(year, month, day) || hour < 0 || hour > 23 || !isRecordYear(year)) {
    pushMalformed(file.records, station, lineNo);
    noteMalformed(
      file,
      lineNo,
      "date",
      isRecordYear(year)
        ? "expected year, month, day and hour (0-23) of a real date"
        : recordDateProblem(year),
    );
    return;
  }
  const temp = fields[4]!;
  const dew = fields[5]!;
  const slp = fields[6]!;
  if (Math.abs(temp) > 9999 || Math.abs(dew) > 9999) {
    pushMalformed(file.records, station, lineNo);
    noteMalformed(file, lineNo, "temperature", "expected tenths of °C within ±9999");
    return;
  }
  const c = file.records;
  const i = nextSlot(c);
  c.station[i] = station;
  c.timeMin[i] = daysFromCivil(year, month, day) * 1440 + hour * 60;
  c.tempTenths[i] = temp === LITE_MISSING ? MISSING_TEMP : temp;
  c.tempQ[i] = LITE_QUALITY;
  c.dewTenths[i] = dew === LITE_MISSING ? MISSING_TEMP : dew;
  c.slpTenths[i] = slp === LITE_MISSING || slp < 0 ? MISSING_PRESSURE : slp;
  c.stationPresTenths[i] = MISSING_PRESSURE;
  c.kind[i] = KIND_ROUTINE;
  c.type[i] = reportTypeIndex(file, "LITE");
  c.source[i] = 57; // "9": missing data source flag
  c.latMilli[i] = MISSING_LAT;
  c.lonMilli[i] = MISSING_LON;
  c.elevM[i] = MISSING_ELEV;
  c.line[i] = lineNo;
}
