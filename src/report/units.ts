/**
 * Display units for the report. `results.json` is always in °C, kPa gauge, L, kg and J; the report
 * converts at render time into the plan's units (US: psig, °F, in³, lb, scf; SI: bar gauge, °C, L, kg,
 * normal m³). Gauge stays gauge: a gauge pressure converts by the scale factor alone.
 *
 * Conversion factors (exact unless noted), from NIST Special Publication 811 (2008), appendix B:
 * 1 psi = 6.894757 kPa (6.894757293168 kPa to 13 digits); 1 bar = 100 kPa (exact);
 * °F = °C × 9/5 + 32 (a temperature difference scales by 9/5 alone); 1 in³ = 16.387064 cm³ (exact);
 * 1 lb = 0.45359237 kg (exact); 1 ft = 0.3048 m (exact); 1 ft³ = 0.028316846592 m³ (exact).
 *
 * Gas volumes at standard conditions use the density of nitrogen at those conditions:
 * - normal m³ at 0 °C and 101.325 kPa: 1.2504 kg/m³;
 * - standard ft³ (scf) at 70 °F and 14.696 psia: 1.1604 kg/m³ (0.07244 lb/ft³, 13.80 scf/lb).
 * Both are the ideal-gas density p·M/(R·T) with M = 28.0134 g/mol and R = 8.314462618 J/(mol·K)
 * (CODATA 2018), divided by the compressibility factor Z = 1 + B·p/(R·T) with the second virial
 * coefficient of nitrogen B ≈ −10.5 cm³/mol at 273 K and ≈ −5 cm³/mol at 294 K (from memory; the
 * correction is below 0.05 %).
 */
import type { Units } from "../plan/results.js";

/** 1 psi in kPa (NIST SP 811, appendix B). */
export const KPA_PER_PSI = 6.894757293168;
/** 1 bar in kPa (exact, SI brochure). */
export const KPA_PER_BAR = 100;
/** 1 in³ in L (exact: 16.387064 cm³, NIST SP 811). */
export const L_PER_IN3 = 0.016387064;
/** 1 lb in kg (exact, NIST SP 811). */
export const KG_PER_LB = 0.45359237;
/** 1 ft in m (exact, NIST SP 811). */
export const M_PER_FT = 0.3048;
/** 1 ft³ in m³ (exact, NIST SP 811). */
export const M3_PER_FT3 = 0.028316846592;
/** Density of nitrogen at 0 °C, 101.325 kPa, kg/m³ (see the file comment for the derivation). */
export const N2_KG_PER_NORMAL_M3 = 1.2504;
/** Density of nitrogen at 70 °F, 14.696 psia, kg/m³ (see the file comment for the derivation). */
export const N2_KG_PER_STD_M3_70F = 1.1604;

/** One display quantity: its unit label, the conversion from the JSON unit, and its display decimals. */
export interface Quantity {
  unit: string;
  convert: (jsonValue: number) => number;
  digits: number;
}

/** Everything the report needs to show a value in the plan's units. */
export interface UnitSystem {
  id: Units;
  name: string;
  /** Gauge pressure from kPa gauge (its unit says gauge: psig, bar gauge). */
  pressure: Quantity;
  /** A pressure difference from kPa (psi, bar: no gauge/absolute). */
  pressureDelta: Quantity;
  /** A temperature from °C. */
  temp: Quantity;
  /** A temperature difference from °C. */
  tempDelta: Quantity;
  /** A liquid or gas volume from L. */
  volume: Quantity;
  /** A mass from kg. */
  mass: Quantity;
  /** A nitrogen mass from kg, as volume at standard conditions. */
  gasVolume: Quantity;
  /** A length (station elevation) from m. */
  length: Quantity;
  /** Conversion notes with their sources, listed in the methods section. */
  notes: string[];
}

export const US_UNITS: UnitSystem = {
  id: "us",
  name: "US customary",
  pressure: { unit: "psig", convert: (kPa) => kPa / KPA_PER_PSI, digits: 0 },
  pressureDelta: { unit: "psi", convert: (kPa) => kPa / KPA_PER_PSI, digits: 0 },
  temp: { unit: "°F", convert: (c) => (c * 9) / 5 + 32, digits: 1 },
  tempDelta: { unit: "°F", convert: (c) => (c * 9) / 5, digits: 1 },
  volume: { unit: "in³", convert: (l) => l / L_PER_IN3, digits: 0 },
  mass: { unit: "lb", convert: (kg) => kg / KG_PER_LB, digits: 2 },
  gasVolume: { unit: "scf", convert: (kg) => kg / N2_KG_PER_STD_M3_70F / M3_PER_FT3, digits: 1 },
  length: { unit: "ft", convert: (m) => m / M_PER_FT, digits: 0 },
  notes: [
    "1 psi = 6.894757 kPa (NIST SP 811, appendix B); psig is gauge pressure.",
    "°F = °C × 9/5 + 32; a temperature difference in °F is the difference in °C × 9/5 (NIST SP 811).",
    "1 in³ = 16.387064 cm³ exactly (NIST SP 811).",
    "1 lb = 0.45359237 kg exactly (NIST SP 811).",
    "1 ft = 0.3048 m exactly (NIST SP 811).",
    "scf: nitrogen at 70 °F and 14.696 psia, 1.1604 kg/m³ (ideal gas with CODATA 2018 constants and a second-virial correction), about 13.80 scf per lb.",
  ],
};

export const SI_UNITS: UnitSystem = {
  id: "si",
  name: "SI",
  pressure: { unit: "bar gauge", convert: (kPa) => kPa / KPA_PER_BAR, digits: 1 },
  pressureDelta: { unit: "bar", convert: (kPa) => kPa / KPA_PER_BAR, digits: 2 },
  temp: { unit: "°C", convert: (c) => c, digits: 1 },
  tempDelta: { unit: "°C", convert: (c) => c, digits: 1 },
  volume: { unit: "L", convert: (l) => l, digits: 2 },
  mass: { unit: "kg", convert: (kg) => kg, digits: 2 },
  gasVolume: { unit: "normal m³", convert: (kg) => kg / N2_KG_PER_NORMAL_M3, digits: 2 },
  length: { unit: "m", convert: (m) => m, digits: 0 },
  notes: [
    "Pressures in bar gauge: 1 bar = 100 kPa exactly (SI brochure).",
    "normal m³: nitrogen at 0 °C and 101.325 kPa, 1.2504 kg/m³ (ideal gas with CODATA 2018 constants and a second-virial correction).",
  ],
};

export function unitSystem(units: Units): UnitSystem {
  return units === "us" ? US_UNITS : SI_UNITS;
}

/**
 * Formats a number for display with fixed decimals, thousands grouped by commas, a true minus sign
 * (U+2212, as on the chart axes), and "–" for null or non-finite values. Negative zero prints as 0.
 */
export function formatNumber(value: number | null | undefined, digits: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  let text = value.toFixed(digits);
  if (/^-0(\.0*)?$/.test(text)) text = text.slice(1);
  const [whole = "", frac] = text.split(".");
  const sign = whole.startsWith("-") ? "-" : "";
  const digitsOnly = sign ? whole.slice(1) : whole;
  const grouped = digitsOnly.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const minus = sign ? "\u2212" : "";
  return frac === undefined ? `${minus}${grouped}` : `${minus}${grouped}.${frac}`;
}

/** Converts and formats one JSON value in a display quantity (no unit suffix). */
export function show(q: Quantity, jsonValue: number | null | undefined): string {
  if (jsonValue === null || jsonValue === undefined) return "–";
  return formatNumber(q.convert(jsonValue), q.digits);
}

/** Formats a percentage (0–100) with one decimal. */
export function pct(value: number | null | undefined): string {
  return formatNumber(value, 1);
}
