/**
 * Writes one observation as a line of the ISD full archive format ("Federal Climate Complex Data
 * Documentation for Integrated Surface Data", reference/isd-format-document.txt):
 *   control data section, positions 1–60 (total variable characters, USAF and WBAN ids, date, time,
 *   source flag, latitude, longitude, report type, elevation, call letters, QC process);
 *   mandatory data section, positions 61–105 (wind, ceiling, visibility, air temperature, dew point,
 *   sea-level pressure, each with its quality code);
 *   additional data section: "ADD" then the MA1 group (altimeter setting and station pressure).
 * Positions 1–4 hold the number of characters after position 105, so the record length is 105 + that.
 */

export interface IsdObservation {
  usaf: string; // 6 characters
  wban: string; // 5 digits
  utcMs: number; // observation time, whole minutes
  reportType: "FM-15" | "FM-16";
  latDeg: number;
  lonDeg: number;
  elevationM: number;
  windDeg: number; // 0 = calm
  windMps: number;
  /** Ceiling height, m above ground; null = unlimited (written 22000). */
  ceilingM: number | null;
  visibilityM: number;
  /** null = missing (+9999). */
  tempC: number | null;
  tempQuality: string;
  dewPointC: number;
  seaLevelHpa: number;
  altimeterHpa: number;
  stationHpa: number;
  /** Quality code written on every other element. */
  quality: string;
}

/** Zero-padded unsigned integer of a given width. */
export function padUnsigned(value: number, width: number): string {
  const s = String(Math.round(value));
  if (s.length > width || value < 0) throw new RangeError(`${value} does not fit ${width} unsigned digits`);
  return s.padStart(width, "0");
}

/** Sign and zero-padded digits, e.g. (−26.7 °C ×10, 4) → "-0267"; zero is written "+0000". */
export function padSigned(scaled: number, digits: number): string {
  const r = Math.round(scaled);
  const sign = r < 0 ? "-" : "+";
  return sign + padUnsigned(Math.abs(r), digits);
}

function dateTimeFields(utcMs: number): string {
  const d = new Date(utcMs);
  return (
    padUnsigned(d.getUTCFullYear(), 4) +
    padUnsigned(d.getUTCMonth() + 1, 2) +
    padUnsigned(d.getUTCDate(), 2) +
    padUnsigned(d.getUTCHours(), 2) +
    padUnsigned(d.getUTCMinutes(), 2)
  );
}

/** Mandatory section, positions 61–105 (45 characters). */
function mandatorySection(o: IsdObservation): string {
  const q = o.quality;
  const calm = o.windDeg === 0 || o.windMps < 0.05;
  const wind = calm
    ? `9999C0000${q}`
    : `${padUnsigned(o.windDeg, 3)}${q}N${padUnsigned(o.windMps * 10, 4)}${q}`;
  const ceiling = o.ceilingM === null ? `22000${q}9N` : `${padUnsigned(o.ceilingM, 5)}${q}MN`;
  const visibility = `${padUnsigned(o.visibilityM, 6)}${q}N${q}`;
  const temp = o.tempC === null ? "+99999" : `${padSigned(o.tempC * 10, 4)}${o.tempQuality}`;
  const dew = `${padSigned(o.dewPointC * 10, 4)}${q}`;
  const slp = `${padUnsigned(o.seaLevelHpa * 10, 5)}${q}`;
  return wind + ceiling + visibility + temp + dew + slp;
}

/** Formats one full-format record (no line terminator). */
export function formatIsdLine(o: IsdObservation): string {
  const additional = `ADDMA1${padUnsigned(o.altimeterHpa * 10, 5)}${o.quality}${padUnsigned(o.stationHpa * 10, 5)}${o.quality}`;
  const control =
    padUnsigned(additional.length, 4) +
    o.usaf +
    o.wban +
    dateTimeFields(o.utcMs) +
    "4" + // data source flag: USAF surface hourly
    padSigned(o.latDeg * 1000, 5) +
    padSigned(o.lonDeg * 1000, 6) +
    o.reportType +
    padSigned(o.elevationM, 4) +
    "99999" + // call letters: missing (the invented stations have none)
    "V020";
  const line = control + mandatorySection(o) + additional;
  if (control.length !== 60 || line.length !== 105 + additional.length) {
    throw new Error(`internal: ISD line has the wrong layout (${line.length} characters)`);
  }
  return line;
}
