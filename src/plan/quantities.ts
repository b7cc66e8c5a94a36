/**
 * Values of the plan (SI) formatted in the plan's output units, for the assumptions table, the
 * terminal summary and the band command.
 */
import {
  cToK,
  fToK,
  KG_PER_LB,
  kToC,
  kToF,
  M3_PER_IN3,
  M3_PER_US_GALLON,
  PA_PER_PSI,
  S_PER_MONTH,
  type Units,
} from "../units/index.js";

function round(x: number, digits: number): string {
  const r = Number(x.toFixed(digits));
  return String(Object.is(r, -0) ? 0 : r);
}

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
export function formatPressureGauge(gaugePa: number, units: Units): string {
  return units === "us" ? `${round(gaugePa / PA_PER_PSI, 0)} psig` : `${round(gaugePa / 1e5, 2)} bar gauge`;
}
export function formatPressureAbs(absPa: number, units: Units): string {
  return units === "us" ? `${round(absPa / PA_PER_PSI, 1)} psia` : `${round(absPa / 1e5, 3)} bara`;
}
export function formatPressureDiff(pa: number, units: Units): string {
  return units === "us" ? `${round(pa / PA_PER_PSI, 1)} psi` : `${round(pa / 1e5, 3)} bar`;
}
export function formatVolume(m3: number, units: Units): string {
  return units === "us" ? `${round(m3 / M3_PER_IN3, 1)} in³` : `${round(m3 * 1e3, 3)} L`;
}
export function formatTime(s: number): string {
  if (s >= 3600) return `${round(s / 3600, 2)} h`;
  if (s >= 60) return `${round(s / 60, 2)} min`;
  return `${round(s, 1)} s`;
}
/** Mass of gas in the output unit: lb (us) or kg (si). */
export function formatMass(kg: number, units: Units): string {
  return units === "us" ? `${(kg / KG_PER_LB).toFixed(2)} lb` : `${kg.toFixed(2)} kg`;
}
export function formatEnergy(j: number): string {
  return `${round(j / 1e3, 2)} kJ`;
}
export function formatFlow(m3s: number, units: Units): string {
  return units === "us" ? `${round((m3s / M3_PER_US_GALLON) * 60, 3)} gpm` : `${round(m3s * 6e4, 3)} L/min`;
}
export function formatBulkModulus(pa: number, units: Units): string {
  return units === "us" ? `${round(pa / PA_PER_PSI, 0)} psi` : `${round(pa / 1e9, 3)} GPa`;
}
export function formatExpansion(perK: number, units: Units): string {
  return units === "us" ? `${(perK / 1.8).toExponential(3)} /°F` : `${perK.toExponential(3)} /K`;
}
export function formatRate(paS: number, units: Units): string {
  return `${formatPressureDiff(paS * S_PER_MONTH, units)}/month`;
}
