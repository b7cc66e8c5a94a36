/**
 * The one grammar of quantities with units, for the plan file and the command line alike.
 *
 * A quantity is a number, optional spaces, and a unit: "1450 psig" or "1450psig", "4.9 L", "2 h",
 * "30 kJ", "1.2 L/min", "8e-4 /K", "5 psi/month"; a pressure at a temperature is
 * "<pressure> @ <temperature>", with or without spaces: "1450 psig @ 70 F", "100barg@20C". Unit names
 * are case-insensitive. Every parser returns SI (Pa, K, m³, s, J, m³/s, 1/K, Pa/s).
 *
 * Pressure conventions: a point pressure says gauge or absolute — `psig`/`psia`, `bar`/`barg`/`bara`,
 * `kPa`/`kPag`/`kPaa`, `MPa`/`MPag`/`MPaa` (plain `bar`, `kPa` and `MPa` are gauge). A pressure
 * DIFFERENCE (tolerance, transfer differential, loss rate, bulk modulus) is written `psi`, `ksi`, `Pa`,
 * `kPa`, `MPa`, `GPa` or `bar`. Temperatures are `F`, `C` or `K`, optionally written `°F`, `°C`.
 *
 * Errors are `QuantityError`s without a location: the plan reader adds `file:line:field`, the command
 * line the option name.
 */
import {
  cToK,
  FAHRENHEIT_PER_KELVIN,
  fToK,
  J_PER_FT_LBF,
  KG_PER_LB,
  kToC,
  kToF,
  M3_PER_FT3,
  M3_PER_IN3,
  M3_PER_LITRE,
  M3_PER_US_GALLON,
  N2_NORMAL_DENSITY_KG_M3,
  N2_SCF_DENSITY_KG_M3,
  PA_PER_BAR,
  PA_PER_GPA,
  PA_PER_KPA,
  PA_PER_MPA,
  PA_PER_PSI,
  S_PER_DAY,
  S_PER_HOUR,
  S_PER_MIN,
  S_PER_MONTH,
  S_PER_WEEK,
  S_PER_YEAR,
} from "./factors.js";

/** A malformed quantity; the caller adds where it was written (file, line and field, or the option). */
export class QuantityError extends Error {
  override name = "QuantityError";
}

const NUMBER_RE = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$/;

function splitNumber(text: string, expected: string): { value: number; unit: string } {
  const m = NUMBER_RE.exec(text);
  if (m === null) throw new QuantityError(`"${text}" is not a number with a unit; expected ${expected}`);
  const value = Number(m[1]);
  if (!Number.isFinite(value))
    throw new QuantityError(`"${text}": number out of range; expected ${expected}`);
  return { value, unit: (m[2] ?? "").trim() };
}

/** The unit of a quantity as written ("-150 C" → "C", "1450psig" → "psig"); "" when it has none. */
export function writtenUnit(text: string): string {
  return NUMBER_RE.exec(text)?.[2]?.trim() ?? "";
}

function lookup<T>(table: Record<string, T>, unit: string, text: string, expected: string): T {
  const key = Object.keys(table).find((k) => k.toLowerCase() === unit.toLowerCase());
  if (key === undefined || unit === "") {
    throw new QuantityError(`"${text}": unknown or missing unit "${unit}"; expected ${expected}`);
  }
  return table[key] as T;
}

/**
 * A parser of "<number> <unit>" whose unit is looked up (case-insensitive) in `table`, SI per unit:
 * `spelling` maps written variants onto the table's keys; `nonNegative` names what cannot be negative.
 */
function tableParser(
  table: Record<string, number>,
  expected: string,
  spelling: (unit: string) => string = (u) => u,
  nonNegative?: string,
): (text: string) => number {
  return (text) => {
    const { value, unit } = splitNumber(text, expected);
    const si = value * lookup(table, spelling(unit), text, expected);
    if (nonNegative !== undefined && si < 0)
      throw new QuantityError(`"${text}": ${nonNegative} cannot be negative`);
    return si;
  };
}

/** A point pressure: `pa` is gauge when `isGauge`, absolute otherwise. */
export interface PointPressure {
  pa: number;
  isGauge: boolean;
}

/** A point pressure as absolute Pa, at an atmosphere of `atmPa`. */
export function absPa(p: PointPressure, atmPa: number): number {
  return p.isGauge ? p.pa + atmPa : p.pa;
}

/** A point pressure as gauge Pa, at an atmosphere of `atmPa`. */
export function gaugePa(p: PointPressure, atmPa: number): number {
  return p.isGauge ? p.pa : p.pa - atmPa;
}

const POINT_PRESSURE_UNITS: Record<string, PointPressure> = {
  psig: { pa: PA_PER_PSI, isGauge: true },
  psia: { pa: PA_PER_PSI, isGauge: false },
  bar: { pa: PA_PER_BAR, isGauge: true },
  barg: { pa: PA_PER_BAR, isGauge: true },
  bara: { pa: PA_PER_BAR, isGauge: false },
  kPa: { pa: PA_PER_KPA, isGauge: true },
  kPag: { pa: PA_PER_KPA, isGauge: true },
  kPaa: { pa: PA_PER_KPA, isGauge: false },
  MPa: { pa: PA_PER_MPA, isGauge: true },
  MPag: { pa: PA_PER_MPA, isGauge: true },
  MPaa: { pa: PA_PER_MPA, isGauge: false },
};
const POINT_PRESSURE_EXPECTED =
  'a pressure such as "3000 psig", "207 bar" (gauge) or "2000 kPaa" (absolute); units psig psia bar barg bara kPa kPag kPaa MPa MPag MPaa';

/** "3000 psig" → 20.68 MPa gauge. */
export function parsePointPressure(text: string): PointPressure {
  const { value, unit } = splitNumber(text, POINT_PRESSURE_EXPECTED);
  if (unit.toLowerCase() === "psi") {
    throw new QuantityError(
      `"${text}": a bare "psi" is a pressure difference; say "psig" (gauge) or "psia" (absolute) for a pressure`,
    );
  }
  const u = lookup(POINT_PRESSURE_UNITS, unit, text, POINT_PRESSURE_EXPECTED);
  const pa = value * u.pa;
  if (!u.isGauge && pa < 0) throw new QuantityError(`"${text}": an absolute pressure cannot be negative`);
  return { pa, isGauge: u.isGauge };
}

const DIFF_PRESSURE_UNITS: Record<string, number> = {
  Pa: 1,
  kPa: PA_PER_KPA,
  MPa: PA_PER_MPA,
  GPa: PA_PER_GPA,
  bar: PA_PER_BAR,
  psi: PA_PER_PSI,
  ksi: 1e3 * PA_PER_PSI,
};
const DIFF_EXPECTED = 'a pressure difference such as "50 psi", "3.5 bar", "1.5 GPa"';

/** "50 psi" → 344738 Pa (a difference, neither gauge nor absolute). */
export const parsePressureDifference = tableParser(DIFF_PRESSURE_UNITS, DIFF_EXPECTED);

const TEMP_EXPECTED = 'a temperature such as "70 F", "21 C" or "294 K"';

/** The temperature unit letter of "F", "°F", "degF", "deg F" (upper case), or the unit as given. */
function temperatureUnit(unit: string): string {
  return unit
    .replace(/^(?:°|deg)\s*/i, "")
    .trim()
    .toUpperCase();
}

/** "70 F" → 294.261 K; also "70F", "70 °F", "21 C", "294 K". */
export function parseTemperatureK(text: string): number {
  const { value, unit } = splitNumber(text, TEMP_EXPECTED);
  const u = temperatureUnit(unit);
  let k: number;
  if (u === "F") k = fToK(value);
  else if (u === "C") k = cToK(value);
  else if (u === "K") k = value;
  else throw new QuantityError(`"${text}": unknown or missing unit "${unit}"; expected ${TEMP_EXPECTED}`);
  if (k <= 0) throw new QuantityError(`"${text}": below absolute zero`);
  return k;
}

const TEMP_DIFF_EXPECTED = 'a temperature difference such as "10 F", "5 C" or "5 K"';

/** A temperature difference: "18 F" → 10 K, "10 C" → 10 K. */
export function parseTemperatureDifferenceK(text: string): number {
  const { value, unit } = splitNumber(text, TEMP_DIFF_EXPECTED);
  const u = temperatureUnit(unit);
  if (u === "F") return value / FAHRENHEIT_PER_KELVIN;
  if (u === "C" || u === "K") return value;
  throw new QuantityError(`"${text}": unknown or missing unit "${unit}"; expected ${TEMP_DIFF_EXPECTED}`);
}

/** The temperature scale of bare numbers where a caller allows them (the plan's display unit). */
export type TemperatureScale = "F" | "C";

/**
 * A temperature as a value on `scale`: a bare number is already on it ("-40" → −40), a number with a
 * unit is converted ("-40 C" → −40 on the °F scale, "0 C" → 32).
 */
export function parseTemperatureOnScale(text: string, scale: TemperatureScale): number {
  const { value, unit } = splitNumber(text, TEMP_EXPECTED);
  if (unit === "") return value;
  const k = parseTemperatureK(text);
  return scale === "F" ? kToF(k) : kToC(k);
}

/** A temperature difference as a value on `scale`: a bare number is on it, "10 C" is 18 on the °F scale. */
export function parseTemperatureDifferenceOnScale(text: string, scale: TemperatureScale): number {
  const { value, unit } = splitNumber(text, TEMP_DIFF_EXPECTED);
  if (unit === "") return value;
  const k = parseTemperatureDifferenceK(text);
  return scale === "F" ? k * FAHRENHEIT_PER_KELVIN : k;
}

/** A pressure stated at a temperature. */
export interface PressureAt {
  pressure: PointPressure;
  tempK: number;
}

/** "1450 psig @ 70 F" (or "1450psig@70F"): a pressure at a stated temperature. */
export function parsePressureAt(text: string): PressureAt {
  const parts = text.split("@");
  if (parts.length !== 2) {
    throw new QuantityError(`"${text}": expected a pressure at a temperature such as "1450 psig @ 70 F"`);
  }
  return { pressure: parsePointPressure(parts[0]!.trim()), tempK: parseTemperatureK(parts[1]!.trim()) };
}

const VOLUME_UNITS: Record<string, number> = {
  m3: 1,
  L: M3_PER_LITRE,
  mL: 1e-6,
  cm3: 1e-6,
  in3: M3_PER_IN3,
  ft3: M3_PER_FT3,
  gal: M3_PER_US_GALLON,
};
const VOLUME_EXPECTED = 'a volume such as "300 in3", "4.9 L", "50 mL"';

/** "300 in3" → 4.916e-3 m³ (also "300in³"). */
export const parseVolumeM3 = tableParser(VOLUME_UNITS, VOLUME_EXPECTED, (u) => u.replace("³", "3"));

const TIME_UNITS: Record<string, number> = {
  s: 1,
  min: S_PER_MIN,
  h: S_PER_HOUR,
  d: S_PER_DAY,
  day: S_PER_DAY,
  days: S_PER_DAY,
  week: S_PER_WEEK,
  weeks: S_PER_WEEK,
  month: S_PER_MONTH,
  year: S_PER_YEAR,
};
const TIME_EXPECTED = 'a duration such as "90 s", "3 min", "2 h", "4 weeks"';

/** "2 h" → 7200 s. */
export const parseTimeS = tableParser(TIME_UNITS, TIME_EXPECTED, undefined, "a duration");

const GAS_AMOUNT_UNITS: Record<string, number> = {
  kg: 1,
  g: 1e-3,
  lb: KG_PER_LB,
  scf: N2_SCF_DENSITY_KG_M3 * M3_PER_FT3,
  Nm3: N2_NORMAL_DENSITY_KG_M3,
  "normal m3": N2_NORMAL_DENSITY_KG_M3,
};
const GAS_AMOUNT_EXPECTED =
  'an amount of nitrogen as a mass or a volume at standard conditions, such as "0.5 lb", "0.2 kg", "7 scf" or "0.2 Nm3"';

/**
 * An amount of nitrogen, kg: a mass (kg, g, lb) or a gas volume at the standard conditions of the scf
 * (70 °F, 14.696 psia) or of the normal m³ (0 °C, 101.325 kPa), through the reference densities of
 * `factors.ts`. "7 scf" → 0.230 kg.
 */
export const parseGasAmountKg = tableParser(
  GAS_AMOUNT_UNITS,
  GAS_AMOUNT_EXPECTED,
  (u) => u.replace(/³/g, "3").replace(/\s+/g, " "),
  "an amount of gas",
);

const ENERGY_UNITS: Record<string, number> = {
  J: 1,
  kJ: 1e3,
  MJ: 1e6,
  "ft-lbf": J_PER_FT_LBF,
  "ft lbf": J_PER_FT_LBF,
};
const ENERGY_EXPECTED = 'an energy such as "30 kJ", "2000 J" or "22000 ft-lbf"';

/** "30 kJ" → 30000 J. */
export const parseEnergyJ = tableParser(ENERGY_UNITS, ENERGY_EXPECTED, (u) => u.replace(/\s+/g, " "));

const FLOW_UNITS: Record<string, number> = {
  "m3/s": 1,
  "L/s": M3_PER_LITRE,
  "L/min": M3_PER_LITRE / S_PER_MIN,
  "in3/s": M3_PER_IN3,
  "in3/min": M3_PER_IN3 / S_PER_MIN,
  gpm: M3_PER_US_GALLON / S_PER_MIN,
  "gal/min": M3_PER_US_GALLON / S_PER_MIN,
};
const FLOW_EXPECTED = 'a flow such as "1.2 L/min", "0.3 gpm" or "5 in3/s"';

/** "1.2 L/min" → 2e-5 m³/s. */
export const parseFlowM3S = tableParser(
  FLOW_UNITS,
  FLOW_EXPECTED,
  (u) => u.replace(/\s+/g, "").replace(/³/g, "3"),
  "a flow",
);

const EXPANSION_EXPECTED = 'a volumetric expansion coefficient such as "8e-4 /K", "8e-4 /C" or "4.4e-4 /F"';

/** "8e-4 /K" → 8e-4 per kelvin; "/F" is per degree Fahrenheit (× 9/5). */
export function parseExpansionPerK(text: string): number {
  const { value, unit } = splitNumber(text, EXPANSION_EXPECTED);
  const u = unit.replace(/\s+/g, "").replace(/^1\//, "/").replace(/°/g, "").toUpperCase();
  if (u === "/K" || u === "/C") return value;
  if (u === "/F") return value * FAHRENHEIT_PER_KELVIN;
  throw new QuantityError(`"${text}": unknown or missing unit "${unit}"; expected ${EXPANSION_EXPECTED}`);
}

const RATE_EXPECTED = 'a pressure change per time such as "5 psi/month" or "0.2 bar/year"';

/** "5 psi/month" → Pa per second (a pressure difference at the precharge reference temperature). */
export function parsePressureRatePaS(text: string): number {
  const slash = text.lastIndexOf("/");
  if (slash < 0) throw new QuantityError(`"${text}": expected ${RATE_EXPECTED}`);
  const pa = parsePressureDifference(text.slice(0, slash));
  const unit = text.slice(slash + 1).trim();
  const s = lookup(TIME_UNITS, unit, text, RATE_EXPECTED);
  if (pa < 0) throw new QuantityError(`"${text}": a loss rate cannot be negative`);
  return pa / s;
}

/** "06:30" → minutes after local midnight. */
export function parseClockMinutes(text: string): number {
  const m = /^\s*(\d{1,2}):(\d{2})\s*$/.exec(text);
  if (m === null) throw new QuantityError(`"${text}" is not a local time; expected "HH:MM", e.g. "06:30"`);
  const h = Number(m[1]);
  const min = Number(m[2]);
  if (h > 23 || min > 59) throw new QuantityError(`"${text}": expected a time from 00:00 to 23:59`);
  return h * 60 + min;
}
