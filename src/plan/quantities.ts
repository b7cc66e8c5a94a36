/**
 * Dimensional quantities of the plan file, parsed at the edge into SI (product brief §2 and §3).
 *
 * A quantity is a string: a number, optional spaces, a unit — "1450 psig", "4.9 L", "2 h", "30 kJ",
 * "1.2 L/min", "8e-4 /K", "5 psi/month", "1450 psig @ 70 F". The plan's `units` key does not affect
 * parsing; it only chooses the units of the report.
 *
 * Pressure conventions (brief §3): a point pressure must say gauge or absolute: `psig`/`psia`,
 * `bar`/`bara`, `kPa`/`kPaa`, `MPa`/`MPaa` (plain `bar`, `kPa` and `MPa` are gauge). A pressure
 * DIFFERENCE (tolerance, transfer differential, loss rate, bulk modulus) is written `psi`, `bar`, `kPa`,
 * `MPa`, `GPa`, `Pa` or `ksi`.
 *
 * Conversion factors are exact definitions (NIST SP 811, appendix B): psi = 6894.757293168 Pa,
 * in = 0.0254 m, lbf = 4.4482216152605 N, US gallon = 231 in³; °F → K by (F − 32)·5/9 + 273.15.
 */
import { SECONDS_PER_MONTH } from "../physics/accumulator.js";
import { KG_PER_LB, M3_PER_IN3, M3_PER_US_GALLON, PA_PER_PSI } from "../physics/units.js";

/** Thrown for a malformed quantity; the plan reader adds file, line and YAML path. */
export class QuantityError extends Error {
  override name = "QuantityError";
}

export const PSI_PA = PA_PER_PSI;
export const IN3_M3 = M3_PER_IN3;
const US_GALLON_M3 = M3_PER_US_GALLON;
const FT_LBF_J = 0.3048 * 4.4482216152605;
const YEAR_S = 12 * SECONDS_PER_MONTH;

const NUMBER_RE = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$/;

function splitNumber(text: string, expected: string): { value: number; unit: string } {
  const m = NUMBER_RE.exec(text);
  if (m === null) throw new QuantityError(`"${text}" is not a number with a unit; expected ${expected}`);
  const value = Number(m[1]);
  if (!Number.isFinite(value))
    throw new QuantityError(`"${text}": number out of range; expected ${expected}`);
  return { value, unit: (m[2] ?? "").replace(/°/g, "").trim() };
}

function lookup<T>(table: Record<string, T>, unit: string, text: string, expected: string): T {
  const key = Object.keys(table).find((k) => k.toLowerCase() === unit.toLowerCase());
  if (key === undefined || unit === "") {
    throw new QuantityError(`"${text}": unknown or missing unit "${unit}"; expected ${expected}`);
  }
  return table[key] as T;
}

/** A point pressure: `pa` is gauge when `isGauge`, absolute otherwise. */
export interface PointPressure {
  pa: number;
  isGauge: boolean;
}

const POINT_PRESSURE_UNITS: Record<string, PointPressure> = {
  psig: { pa: PSI_PA, isGauge: true },
  psia: { pa: PSI_PA, isGauge: false },
  bar: { pa: 1e5, isGauge: true },
  barg: { pa: 1e5, isGauge: true },
  bara: { pa: 1e5, isGauge: false },
  kPa: { pa: 1e3, isGauge: true },
  kPag: { pa: 1e3, isGauge: true },
  kPaa: { pa: 1e3, isGauge: false },
  MPa: { pa: 1e6, isGauge: true },
  MPag: { pa: 1e6, isGauge: true },
  MPaa: { pa: 1e6, isGauge: false },
};
const POINT_PRESSURE_EXPECTED = 'a pressure such as "3000 psig", "207 bar" (gauge) or "2000 kPaa" (absolute)';

/** "3000 psig" → 20.68 MPa gauge. */
export function parsePointPressure(text: string): PointPressure {
  const { value, unit } = splitNumber(text, POINT_PRESSURE_EXPECTED);
  if (unit.toLowerCase() === "psi") {
    throw new QuantityError(`"${text}": say "psig" (gauge) or "psia" (absolute) for a pressure`);
  }
  const u = lookup(POINT_PRESSURE_UNITS, unit, text, POINT_PRESSURE_EXPECTED);
  const pa = value * u.pa;
  if (!u.isGauge && pa < 0) throw new QuantityError(`"${text}": an absolute pressure cannot be negative`);
  return { pa, isGauge: u.isGauge };
}

const DIFF_PRESSURE_UNITS: Record<string, number> = {
  Pa: 1,
  kPa: 1e3,
  MPa: 1e6,
  GPa: 1e9,
  bar: 1e5,
  psi: PSI_PA,
  ksi: 1e3 * PSI_PA,
};
const DIFF_EXPECTED = 'a pressure difference such as "50 psi", "3.5 bar", "1.5 GPa"';

/** "50 psi" → 344738 Pa (a difference, neither gauge nor absolute). */
export function parsePressureDifference(text: string): number {
  const { value, unit } = splitNumber(text, DIFF_EXPECTED);
  return value * lookup(DIFF_PRESSURE_UNITS, unit, text, DIFF_EXPECTED);
}

const TEMP_EXPECTED = 'a temperature such as "70 F", "21 C" or "294 K"';

/** "70 F" → 294.261 K. */
export function parseTemperatureK(text: string): number {
  const { value, unit } = splitNumber(text, TEMP_EXPECTED);
  const u = unit.toUpperCase();
  let k: number;
  if (u === "F") k = ((value - 32) * 5) / 9 + 273.15;
  else if (u === "C") k = value + 273.15;
  else if (u === "K") k = value;
  else throw new QuantityError(`"${text}": unknown or missing unit "${unit}"; expected ${TEMP_EXPECTED}`);
  if (k <= 0) throw new QuantityError(`"${text}": below absolute zero`);
  return k;
}

/** "1450 psig @ 70 F": a pressure at a stated temperature. */
export function parsePressureAt(text: string): { pressure: PointPressure; tempK: number } {
  const parts = text.split("@");
  if (parts.length !== 2) {
    throw new QuantityError(`"${text}": expected "pressure @ temperature", e.g. "1450 psig @ 70 F"`);
  }
  return { pressure: parsePointPressure(parts[0]!.trim()), tempK: parseTemperatureK(parts[1]!.trim()) };
}

const VOLUME_UNITS: Record<string, number> = {
  m3: 1,
  L: 1e-3,
  mL: 1e-6,
  cm3: 1e-6,
  in3: IN3_M3,
  ft3: 0.3048 ** 3,
  gal: US_GALLON_M3,
};
const VOLUME_EXPECTED = 'a volume such as "300 in3", "4.9 L", "50 mL"';

/** "300 in3" → 4.916e-3 m³. */
export function parseVolumeM3(text: string): number {
  const { value, unit } = splitNumber(text, VOLUME_EXPECTED);
  return value * lookup(VOLUME_UNITS, unit.replace("³", "3"), text, VOLUME_EXPECTED);
}

const TIME_UNITS: Record<string, number> = {
  s: 1,
  min: 60,
  h: 3600,
  d: 86400,
  day: 86400,
  days: 86400,
  month: SECONDS_PER_MONTH,
  year: YEAR_S,
};
const TIME_EXPECTED = 'a duration such as "90 s", "3 min", "2 h"';

/** "2 h" → 7200 s. */
export function parseTimeS(text: string): number {
  const { value, unit } = splitNumber(text, TIME_EXPECTED);
  const s = value * lookup(TIME_UNITS, unit, text, TIME_EXPECTED);
  if (s < 0) throw new QuantityError(`"${text}": a duration cannot be negative`);
  return s;
}

const ENERGY_UNITS: Record<string, number> = {
  J: 1,
  kJ: 1e3,
  MJ: 1e6,
  "ft-lbf": FT_LBF_J,
  "ft lbf": FT_LBF_J,
};
const ENERGY_EXPECTED = 'an energy such as "30 kJ", "2000 J" or "22000 ft-lbf"';

/** "30 kJ" → 30000 J. */
export function parseEnergyJ(text: string): number {
  const { value, unit } = splitNumber(text, ENERGY_EXPECTED);
  return value * lookup(ENERGY_UNITS, unit.replace(/\s+/g, " "), text, ENERGY_EXPECTED);
}

const FLOW_UNITS: Record<string, number> = {
  "m3/s": 1,
  "L/s": 1e-3,
  "L/min": 1e-3 / 60,
  "in3/s": IN3_M3,
  "in3/min": IN3_M3 / 60,
  gpm: US_GALLON_M3 / 60,
  "gal/min": US_GALLON_M3 / 60,
};
const FLOW_EXPECTED = 'a flow such as "1.2 L/min", "0.3 gpm" or "5 in3/s"';

/** "1.2 L/min" → 2e-5 m³/s. */
export function parseFlowM3S(text: string): number {
  const { value, unit } = splitNumber(text, FLOW_EXPECTED);
  const f = value * lookup(FLOW_UNITS, unit.replace(/\s+/g, ""), text, FLOW_EXPECTED);
  if (f < 0) throw new QuantityError(`"${text}": a flow cannot be negative`);
  return f;
}

const EXPANSION_EXPECTED = 'a volumetric expansion coefficient such as "8e-4 /K", "8e-4 /C" or "4.4e-4 /F"';

/** "8e-4 /K" → 8e-4 per kelvin; "/F" is per degree Fahrenheit (× 9/5). */
export function parseExpansionPerK(text: string): number {
  const { value, unit } = splitNumber(text, EXPANSION_EXPECTED);
  const u = unit.replace(/\s+/g, "").replace(/^1\//, "/").toUpperCase();
  if (u === "/K" || u === "/C") return value;
  if (u === "/F") return value * 1.8;
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

// ---- formatting in the plan's output units (assumptions table, terminal, band command) ----

export type OutputUnits = "us" | "si";

function round(x: number, digits: number): string {
  const r = Number(x.toFixed(digits));
  return String(Object.is(r, -0) ? 0 : r);
}

/** Temperature in the output unit: °F (us) or °C (si). */
export function formatTemp(tempK: number, units: OutputUnits): string {
  const v = Number(tempFromK(tempK, units).toFixed(1));
  return `${(Object.is(v, -0) ? 0 : v).toFixed(1)} ${units === "us" ? "°F" : "°C"}`;
}
export function tempFromK(tempK: number, units: OutputUnits): number {
  return units === "us" ? ((tempK - 273.15) * 9) / 5 + 32 : tempK - 273.15;
}
export function tempToK(value: number, units: OutputUnits): number {
  return units === "us" ? ((value - 32) * 5) / 9 + 273.15 : value + 273.15;
}
export function formatPressureGauge(gaugePa: number, units: OutputUnits): string {
  return units === "us" ? `${round(gaugePa / PSI_PA, 0)} psig` : `${round(gaugePa / 1e5, 2)} bar gauge`;
}
export function formatPressureAbs(absPa: number, units: OutputUnits): string {
  return units === "us" ? `${round(absPa / PSI_PA, 1)} psia` : `${round(absPa / 1e5, 3)} bara`;
}
export function formatPressureDiff(pa: number, units: OutputUnits): string {
  return units === "us" ? `${round(pa / PSI_PA, 1)} psi` : `${round(pa / 1e5, 3)} bar`;
}
export function formatVolume(m3: number, units: OutputUnits): string {
  return units === "us" ? `${round(m3 / IN3_M3, 1)} in³` : `${round(m3 * 1e3, 3)} L`;
}
export function formatTime(s: number): string {
  if (s >= 3600) return `${round(s / 3600, 2)} h`;
  if (s >= 60) return `${round(s / 60, 2)} min`;
  return `${round(s, 1)} s`;
}
/** Mass of gas in the output unit: lb (us) or kg (si). */
export function formatMass(kg: number, units: OutputUnits): string {
  return units === "us" ? `${(kg / KG_PER_LB).toFixed(2)} lb` : `${kg.toFixed(2)} kg`;
}
export function formatEnergy(j: number): string {
  return `${round(j / 1e3, 2)} kJ`;
}
export function formatFlow(m3s: number, units: OutputUnits): string {
  return units === "us" ? `${round((m3s / US_GALLON_M3) * 60, 3)} gpm` : `${round(m3s * 6e4, 3)} L/min`;
}
export function formatBulkModulus(pa: number, units: OutputUnits): string {
  return units === "us" ? `${round(pa / PSI_PA, 0)} psi` : `${round(pa / 1e9, 3)} GPa`;
}
export function formatExpansion(perK: number, units: OutputUnits): string {
  return units === "us" ? `${(perK / 1.8).toExponential(3)} /°F` : `${perK.toExponential(3)} /K`;
}
export function formatRate(paS: number, units: OutputUnits): string {
  return `${formatPressureDiff(paS * SECONDS_PER_MONTH, units)}/month`;
}
