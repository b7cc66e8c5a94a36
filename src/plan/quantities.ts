/**
 * Values formatted in the plan's output units for the terminal summary and the band command.
 */
import { cToK, fToK, KG_PER_LB, kToC, kToF, type Units } from "../units/index.js";

/** Temperature in the output unit: °F (us) or °C (si). */
export function formatTemp(tempK: number, units: Units): string {
  const v = Number(tempFromK(tempK, units).toFixed(1));
  return `${(Object.is(v, -0) ? 0 : v).toFixed(1)} ${units === "us" ? "°F" : "°C"}`;
}
export function tempFromK(tempK: number, units: Units): number {
  return units === "us" ? kToF(tempK) : kToC(tempK);
}
export function tempToK(value: number, units: Units): number {
  return units === "us" ? fToK(value) : cToK(value);
}
/** Mass of gas in the output unit: lb (us) or kg (si). */
export function formatMass(kg: number, units: Units): string {
  return units === "us" ? `${(kg / KG_PER_LB).toFixed(2)} lb` : `${kg.toFixed(2)} kg`;
}
