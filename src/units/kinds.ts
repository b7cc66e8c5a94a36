/**
 * Quantities as data: what kind of quantity a value is, and the fixed unit it has in results.json
 * whatever the plan's display units (°C, kPa gauge, L, kg, J; percentages 0–100; plain numbers as they
 * are). Formatting for people happens only where a value is shown (`display.ts`).
 */
import { kToC, M3_PER_LITRE, PA_PER_KPA, S_PER_MONTH } from "./factors.js";

/** The kinds of quantity a plan states. */
export type QuantityKind =
  | "pressureGauge"
  | "pressureAbsolute"
  | "pressureDifference"
  | "pressureRate"
  | "temperature"
  | "temperatureDifference"
  | "volume"
  | "mass"
  | "energy"
  | "duration"
  | "flow"
  | "expansion"
  | "percent"
  | "fraction"
  | "number"
  | "count"
  | "year"
  | "localTime"
  | "weekday"
  | "text";

/** A value in its JSON unit: a number, a text (names, choices, "HH:MM"), or a list of texts. */
export type QuantityValue = number | string | string[];

/** A quantity as data: its kind, its value in the JSON unit, and the text the user wrote for it. */
export interface QuantityData {
  kind: QuantityKind;
  value: QuantityValue;
  /** Unit of `value`: the kind's JSON unit; for a count, what it counts ("h", "d") or "". */
  unit: string;
  /** For a pressure stated at a temperature ("1450 psig @ 70 F"): that temperature, °C. */
  atTempC?: number;
  /** Exactly as written in the plan file; null where the plan leaves the value to its default. */
  text: string | null;
}

/**
 * JSON unit of each kind and the conversion into it from the SI value inside the program (Pa gauge,
 * Pa absolute, Pa, Pa/s, K, m³, kg, J, s, m³/s, 1/K); kinds without a conversion are stored as they are.
 */
export const JSON_UNITS: Record<QuantityKind, { unit: string; fromSi?: (si: number) => number }> = {
  pressureGauge: { unit: "kPa gauge", fromSi: (pa) => pa / PA_PER_KPA },
  pressureAbsolute: { unit: "kPa absolute", fromSi: (pa) => pa / PA_PER_KPA },
  pressureDifference: { unit: "kPa", fromSi: (pa) => pa / PA_PER_KPA },
  pressureRate: { unit: "kPa/month", fromSi: (paS) => (paS * S_PER_MONTH) / PA_PER_KPA },
  temperature: { unit: "°C", fromSi: kToC },
  temperatureDifference: { unit: "K" },
  volume: { unit: "L", fromSi: (m3) => m3 / M3_PER_LITRE },
  mass: { unit: "kg" },
  energy: { unit: "J" },
  duration: { unit: "s" },
  flow: { unit: "L/s", fromSi: (m3S) => m3S / M3_PER_LITRE },
  expansion: { unit: "1/K" },
  percent: { unit: "%" },
  fraction: { unit: "" },
  number: { unit: "" },
  count: { unit: "" },
  year: { unit: "" },
  localTime: { unit: "" },
  weekday: { unit: "" },
  text: { unit: "" },
};

/** An SI value in the JSON unit of its kind. */
export function toJsonUnit(kind: QuantityKind, si: number): number {
  const fromSi = JSON_UNITS[kind].fromSi;
  return fromSi === undefined ? si : fromSi(si);
}
