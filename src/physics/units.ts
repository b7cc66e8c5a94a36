/**
 * Unit conversions at the edges of the program. Inside everything is SI: Pa absolute, K, m³, mol, kg.
 * Gauge and absolute pressures are always explicit: in user text `psig`, `bar`, `kPa` and `MPa` mean gauge,
 * `psia`, `bara`, `kPaa` and `MPaa` mean absolute (product brief, section 3).
 */
import { InputError } from "../errors.js";
import { N2_GAS_CONSTANT_J_MOLK, N2_MOLAR_MASS_KG_MOL } from "./nitrogen.js";

/** 1 psi in Pa: 1 lbf/in² = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² (exact by definition). */
export const PA_PER_PSI = (0.45359237 * 9.80665) / (0.0254 * 0.0254);
export const PA_PER_BAR = 1e5;
export const PA_PER_KPA = 1e3;
export const PA_PER_MPA = 1e6;
/** Standard sea-level pressure, Pa (ISO 2533). */
export const STANDARD_ATMOSPHERE_PA = 101325;
/** 1 in³ in m³ (exact). */
export const M3_PER_IN3 = 0.0254 ** 3;
export const M3_PER_LITRE = 1e-3;
/** 1 ft³ in m³ (exact). */
export const M3_PER_FT3 = 0.3048 ** 3;
/** 1 lb in kg (exact). */
export const KG_PER_LB = 0.45359237;
/** 1 US gallon in m³ (exact: 231 in³). */
export const M3_PER_US_GALLON = 231 * M3_PER_IN3;

export const psiToPa = (psi: number): number => psi * PA_PER_PSI;
export const paToPsi = (pa: number): number => pa / PA_PER_PSI;
export const barToPa = (bar: number): number => bar * PA_PER_BAR;
export const paToBar = (pa: number): number => pa / PA_PER_BAR;
export const kPaToPa = (kPa: number): number => kPa * PA_PER_KPA;
export const paToKPa = (pa: number): number => pa / PA_PER_KPA;
export const mPaToPa = (mPa: number): number => mPa * PA_PER_MPA;
export const paToMPa = (pa: number): number => pa / PA_PER_MPA;

export const cToK = (c: number): number => c + 273.15;
export const kToC = (k: number): number => k - 273.15;
export const fToK = (f: number): number => ((f - 32) * 5) / 9 + 273.15;
export const kToF = (k: number): number => ((k - 273.15) * 9) / 5 + 32;
/** Temperature differences: 1 K = 1.8 °F. */
export const deltaKToDeltaF = (dk: number): number => dk * 1.8;

export const in3ToM3 = (in3: number): number => in3 * M3_PER_IN3;
export const m3ToIn3 = (m3: number): number => m3 / M3_PER_IN3;
export const litreToM3 = (l: number): number => l * M3_PER_LITRE;
export const m3ToLitre = (m3: number): number => m3 / M3_PER_LITRE;
export const lbToKg = (lb: number): number => lb * KG_PER_LB;
export const kgToLb = (kg: number): number => kg / KG_PER_LB;
export const molToKg = (mol: number): number => mol * N2_MOLAR_MASS_KG_MOL;
export const kgToMol = (kg: number): number => kg / N2_MOLAR_MASS_KG_MOL;

/**
 * Standard volumes are ideal-gas volumes at the stated reference conditions (the usual convention of
 * gas trade units; nitrogen's compressibility there differs from 1 by about 0.02 %).
 * scf: 70 °F and 14.696 psia; normal m³: 0 °C and 101.325 kPa.
 */
export const SCF_REF_TEMP_K = fToK(70);
export const SCF_REF_PRESSURE_PA = psiToPa(14.696);
export const NORMAL_M3_REF_TEMP_K = 273.15;
export const NORMAL_M3_REF_PRESSURE_PA = 101325;
/** Moles in one standard cubic foot (ideal gas at 70 °F, 14.696 psia). */
export const MOL_PER_SCF = (SCF_REF_PRESSURE_PA * M3_PER_FT3) / (N2_GAS_CONSTANT_J_MOLK * SCF_REF_TEMP_K);
/** Moles in one normal cubic metre (ideal gas at 0 °C, 101.325 kPa). */
export const MOL_PER_NORMAL_M3 = NORMAL_M3_REF_PRESSURE_PA / (N2_GAS_CONSTANT_J_MOLK * NORMAL_M3_REF_TEMP_K);
export const molToScf = (mol: number): number => mol / MOL_PER_SCF;
export const scfToMol = (scf: number): number => scf * MOL_PER_SCF;
export const molToNormalM3 = (mol: number): number => mol / MOL_PER_NORMAL_M3;
export const normalM3ToMol = (nm3: number): number => nm3 * MOL_PER_NORMAL_M3;

/**
 * Atmospheric pressure at an elevation by the ISO 2533 standard atmosphere, troposphere layer:
 * P = P₀·(1 − L·H/T₀)^(g₀·M/(R*·L)) with H the geopotential height H = r·h/(r + h), r = 6 356 766 m,
 * T₀ = 288.15 K, L = 0.0065 K/m, P₀ = 101 325 Pa, g₀·M/(R*·L) = 5.255 877.
 */
export function standardAtmospherePa(elevationM: number): number {
  if (!(elevationM >= -1000 && elevationM <= 11000)) {
    throw new InputError(
      `elevationM: ${elevationM} m is outside the standard atmosphere's troposphere (expected −1000 to 11000 m)`,
    );
  }
  const r = 6356766;
  const h = (r * elevationM) / (r + elevationM);
  const t0 = 288.15;
  const lapse = 0.0065;
  const exponent = (9.80665 * 0.0289644) / (8.31432 * lapse);
  return STANDARD_ATMOSPHERE_PA * (1 - (lapse * h) / t0) ** exponent;
}

function checkAtm(atmPa: number): void {
  if (!(atmPa > 0 && atmPa < 2e5)) throw new InputError(`atmPa: ${atmPa} Pa is not an atmospheric pressure`);
}
/** Absolute pressure from gauge pressure and local atmospheric pressure. */
export function gaugeToAbsPa(gaugePa: number, atmPa: number): number {
  checkAtm(atmPa);
  return gaugePa + atmPa;
}
/** Gauge pressure from absolute pressure and local atmospheric pressure. */
export function absToGaugePa(absPa: number, atmPa: number): number {
  checkAtm(atmPa);
  return absPa - atmPa;
}

const NUMBER = String.raw`([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)`;
const PRESSURE_RE = new RegExp(`^\\s*${NUMBER}\\s*(psig|psia|bara|bar|kpaa|kpa|mpaa|mpa)\\s*$`, "i");
const TEMPERATURE_RE = new RegExp(`^\\s*${NUMBER}\\s*(?:°|deg)?\\s*(f|c|k)\\s*$`, "i");

export const PRESSURE_EXAMPLE = "1450psig, 100bar, 2000kPaa";
export const TEMPERATURE_EXAMPLE = "70F, 21C, 294K";

/**
 * Parses a pressure with its unit: `psig`/`psia`, `bar`/`bara`, `kPa`/`kPaa`, `MPa`/`MPaa` (case-insensitive).
 * Returns the value in Pa and whether it is gauge (`psig`, `bar`, `kPa`, `MPa`) or absolute.
 */
export function parsePressure(text: string): { pa: number; isGauge: boolean } {
  const m = PRESSURE_RE.exec(text);
  if (!m) {
    throw new InputError(
      `"${text}" is not a pressure: expected <number><psig|psia|bar|bara|kPa|kPaa|MPa|MPaa>, e.g. ${PRESSURE_EXAMPLE}`,
    );
  }
  const value = Number(m[1]);
  const unit = m[2]!.toLowerCase();
  const isGauge = unit === "psig" || unit === "bar" || unit === "kpa" || unit === "mpa";
  const perUnit = unit.startsWith("psi")
    ? PA_PER_PSI
    : unit.startsWith("bar")
      ? PA_PER_BAR
      : unit.startsWith("kpa")
        ? PA_PER_KPA
        : PA_PER_MPA;
  return { pa: value * perUnit, isGauge };
}

/** Parses a temperature `<number><F|C|K>` (also `°F`, `°C`) into kelvin. */
export function parseTemperature(text: string): number {
  const m = TEMPERATURE_RE.exec(text);
  if (!m) {
    throw new InputError(
      `"${text}" is not a temperature: expected <number><F|C|K>, e.g. ${TEMPERATURE_EXAMPLE}`,
    );
  }
  const value = Number(m[1]);
  const unit = m[2]!.toLowerCase();
  const tempK = unit === "f" ? fToK(value) : unit === "c" ? cToK(value) : value;
  if (!(tempK > 0)) throw new InputError(`"${text}" is below absolute zero`);
  return tempK;
}
