/**
 * The two display systems. `results.json` is always in °C, kPa gauge, L, kg and J; whatever shows a
 * value to a person (report, terminal summaries) converts at that moment into the plan's units — US:
 * psig, °F, in³, lb, scf; SI: bar gauge, °C, L, kg, normal m³ — and formats it with `formatDisplay`.
 * Gauge stays gauge: a gauge pressure converts by the scale factor alone.
 */
import {
  cToF,
  FAHRENHEIT_PER_KELVIN,
  KG_PER_LB,
  M_PER_FT,
  M3_PER_FT3,
  M3_PER_IN3,
  M3_PER_LITRE,
  M3_PER_US_GALLON,
  N2_NORMAL_DENSITY_KG_M3,
  N2_SCF_DENSITY_KG_M3,
  PA_PER_BAR,
  PA_PER_KPA,
  PA_PER_PSI,
  S_PER_HOUR,
  S_PER_MIN,
} from "./factors.js";
import { formatDisplay } from "./format.js";
import type { QuantityData, QuantityKind } from "./kinds.js";

/** The plan's choice of display units. */
export type Units = "us" | "si";

/** One display quantity: its unit label, the conversion from the JSON unit, and its display decimals. */
export interface Quantity {
  unit: string;
  convert: (jsonValue: number) => number;
  digits: number;
}

/** The display quantities, one per kind of value shown. */
export interface DisplayQuantities {
  /** Gauge pressure from kPa gauge (its unit says gauge: psig, bar gauge). */
  pressure: Quantity;
  /** Absolute pressure from kPa absolute (psia, bara). */
  pressureAbs: Quantity;
  /** A pressure difference from kPa (psi, bar: no gauge/absolute). */
  pressureDelta: Quantity;
  /** A pressure change per month from kPa per month. */
  pressureRate: Quantity;
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
  /** An energy from J. */
  energy: Quantity;
  /** A flow from L/s. */
  flow: Quantity;
  /** A volumetric expansion coefficient from 1/K. */
  expansion: Quantity;
}

/** Everything needed to show a value in the plan's units. */
export interface UnitSystem extends DisplayQuantities {
  id: Units;
  name: string;
  /** Conversion notes with their sources, listed in the methods section. */
  notes: string[];
}

const q = (unit: string, convert: (jsonValue: number) => number, digits: number): Quantity => ({
  unit,
  convert,
  digits,
});
const kPaTo = (paPerUnit: number) => (kPa: number) => (kPa * PA_PER_KPA) / paPerUnit;
const litreTo = (m3PerUnit: number) => (l: number) => (l * M3_PER_LITRE) / m3PerUnit;
const asIs = (x: number) => x;

/** Each display quantity in the two systems, side by side: [US customary, SI]. */
const DISPLAY: { [K in keyof DisplayQuantities]: [us: Quantity, si: Quantity] } = {
  pressure: [q("psig", kPaTo(PA_PER_PSI), 0), q("bar gauge", kPaTo(PA_PER_BAR), 1)],
  pressureAbs: [q("psia", kPaTo(PA_PER_PSI), 1), q("bara", kPaTo(PA_PER_BAR), 2)],
  pressureDelta: [q("psi", kPaTo(PA_PER_PSI), 0), q("bar", kPaTo(PA_PER_BAR), 2)],
  pressureRate: [q("psi/month", kPaTo(PA_PER_PSI), 1), q("bar/month", kPaTo(PA_PER_BAR), 3)],
  temp: [q("°F", cToF, 1), q("°C", asIs, 1)],
  // A temperature difference scales by 9/5 alone (no offset).
  tempDelta: [q("°F", (c) => (c * 9) / 5, 1), q("°C", asIs, 1)],
  volume: [q("in³", litreTo(M3_PER_IN3), 0), q("L", asIs, 2)],
  mass: [q("lb", (kg) => kg / KG_PER_LB, 2), q("kg", asIs, 2)],
  gasVolume: [
    q("scf", (kg) => kg / N2_SCF_DENSITY_KG_M3 / M3_PER_FT3, 1),
    q("normal m³", (kg) => kg / N2_NORMAL_DENSITY_KG_M3, 2),
  ],
  length: [q("ft", (m) => m / M_PER_FT, 0), q("m", asIs, 0)],
  energy: [q("kJ", (j) => j / 1e3, 2), q("kJ", (j) => j / 1e3, 2)],
  flow: [
    q("gpm", (lS) => (lS * M3_PER_LITRE * S_PER_MIN) / M3_PER_US_GALLON, 3),
    q("L/min", (lS) => lS * S_PER_MIN, 3),
  ],
  expansion: [q("/°F", (perK) => perK / FAHRENHEIT_PER_KELVIN, 6), q("/K", asIs, 6)],
};

/** One display system: the column of `DISPLAY` with its id, name and conversion notes. */
function displaySystem(column: 0 | 1, id: Units, name: string, notes: string[]): UnitSystem {
  const entries = Object.entries(DISPLAY).map(([k, pair]) => [k, pair[column]]);
  return { id, name, ...(Object.fromEntries(entries) as unknown as DisplayQuantities), notes };
}

export const US_UNITS = displaySystem(0, "us", "US customary", [
  "1 psi = 6.894757 kPa (NIST SP 811, appendix B); psig is gauge pressure.",
  "°F = °C × 9/5 + 32; a temperature difference in °F is the difference in °C × 9/5 (NIST SP 811).",
  "1 in³ = 16.387064 cm³ exactly (NIST SP 811).",
  "1 lb = 0.45359237 kg exactly (NIST SP 811).",
  "1 ft = 0.3048 m exactly (NIST SP 811).",
  `scf: nitrogen at 70 °F and 14.696 psia, ${N2_SCF_DENSITY_KG_M3} kg/m³ (reference equation of state, Span et al. 2000), ${formatDisplay(KG_PER_LB / N2_SCF_DENSITY_KG_M3 / M3_PER_FT3, 2)} scf per lb.`,
]);

export const SI_UNITS = displaySystem(1, "si", "SI", [
  "Pressures in bar gauge: 1 bar = 100 kPa exactly (SI brochure).",
  `normal m³: nitrogen at 0 °C and 101.325 kPa, ${N2_NORMAL_DENSITY_KG_M3} kg/m³ (reference equation of state, Span et al. 2000).`,
]);

export function unitSystem(units: Units): UnitSystem {
  return units === "us" ? US_UNITS : SI_UNITS;
}

/** Converts and formats one JSON value in a display quantity (no unit suffix). */
export function show(q: Quantity, jsonValue: number | null | undefined): string {
  if (jsonValue === null || jsonValue === undefined) return "–";
  return formatDisplay(q.convert(jsonValue), q.digits);
}

/** Converts and formats one JSON value with its unit: "1,450 psig" ("–" alone for no value). */
export function showWithUnit(q: Quantity, jsonValue: number | null | undefined): string {
  return jsonValue === null || jsonValue === undefined ? "–" : `${show(q, jsonValue)} ${q.unit}`;
}

/** The display quantity of each dimensional kind of plan quantity. */
const DISPLAY_OF_KIND: Partial<Record<QuantityKind, keyof DisplayQuantities>> = {
  pressureGauge: "pressure",
  pressureAbsolute: "pressureAbs",
  pressureDifference: "pressureDelta",
  pressureRate: "pressureRate",
  temperature: "temp",
  temperatureDifference: "tempDelta",
  volume: "volume",
  mass: "mass",
  energy: "energy",
  flow: "flow",
  expansion: "expansion",
};

/** Kinds whose value is a plain number, stored and shown as it is (with what it counts, if anything). */
const PLAIN_NUMBER_KINDS: ReadonlySet<QuantityKind> = new Set([
  "percent",
  "fraction",
  "number",
  "count",
  "year",
]);

const withUnit = (text: string, unit: string) => (unit === "" ? text : `${text} ${unit}`);

/** A duration (s) in h, min or s, whichever is the largest unit it reaches. */
function formatDuration(s: number): string {
  const [size, unit] = s >= S_PER_HOUR ? [S_PER_HOUR, "h"] : s >= S_PER_MIN ? [S_PER_MIN, "min"] : [1, "s"];
  const x = s / size;
  return `${formatDisplay(x, Number.isInteger(x) ? 0 : 2)} ${unit}`;
}

/**
 * A plan quantity's value (in its JSON unit) formatted in the plan's units, with its unit:
 * "1,450 psig @ 70.0 °F", "3 h", "out/cache/climate".
 */
export function formatQuantity(q: Omit<QuantityData, "text">, u: UnitSystem): string {
  const { kind, value } = q;
  if (Array.isArray(value)) return value.join(", ");
  if (typeof value === "string") return value;
  const name = DISPLAY_OF_KIND[kind];
  if (name !== undefined) {
    const main = showWithUnit(u[name], value);
    return q.atTempC === undefined ? main : `${main} @ ${showWithUnit(u.temp, q.atTempC)}`;
  }
  if (kind === "duration") return formatDuration(value);
  return withUnit(String(value), q.unit);
}

/**
 * What a person sees of a plan quantity: the text exactly as written (a bare number followed by what
 * it counts: "3 h"), or, for a default, the value formatted in the plan's units.
 */
export function shownText(q: QuantityData, u: UnitSystem): string {
  if (q.text === null) return formatQuantity(q, u);
  return PLAIN_NUMBER_KINDS.has(q.kind) ? withUnit(q.text, q.unit) : q.text;
}
