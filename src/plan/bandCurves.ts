/**
 * Precharge line, tolerance lines and reading band against temperature, real gas and ideal
 * (docs/methods.md §3), with the break-even temperatures (`breakEven.ts`), for `results.profiles` (at the standard atmosphere), each base's
 * `profileCurves` (at the base's atmosphere) and the `coldsoak band` command.
 */
import { prechargeLinesAbsPa, readingBand } from "../physics/accumulator.js";
import { idealGas, realGas } from "../physics/nitrogen.js";
import { ZERO_CELSIUS_K as K0, kToC, PA_PER_KPA, type Units } from "../units/index.js";
import { defaultEnergyRangeK, equilibriumBreakEven } from "./breakEven.js";
import { bandInputsOf } from "./context.js";
import type { ProfileInput } from "./planFile.js";
import type { ProfileResult } from "./results.js";

export interface BandCurveRow {
  tempC: number;
  prechargeKPaGauge: number;
  prechargeLowKPaGauge: number;
  prechargeHighKPaGauge: number;
  idealPrechargeKPaGauge: number;
  readingLowPct: number;
  readingNominalPct: number;
  readingHighPct: number;
  idealReadingNominalPct: number;
}

/** Rows at the given temperatures (K); gauge pressures relative to atmPa. */
export function bandCurves(profile: ProfileInput, tempsK: number[], atmPa: number): BandCurveRow[] {
  const geometry = { v0M3: profile.accumulator.gasVolumeEmpty, vminM3: profile.accumulator.gasVolumeFull };
  const band = bandInputsOf(profile, atmPa);
  const kPaG = (abs: number) => (abs - atmPa) / PA_PER_KPA;
  return tempsK.map((t) => {
    const line = prechargeLinesAbsPa(realGas, band, t);
    const idealLine = prechargeLinesAbsPa(idealGas, band, t);
    const b = readingBand(realGas, geometry, band, t);
    const bi = readingBand(idealGas, geometry, band, t);
    return {
      tempC: kToC(t),
      prechargeKPaGauge: kPaG(line.nominalAbsPa),
      prechargeLowKPaGauge: kPaG(line.lowAbsPa),
      prechargeHighKPaGauge: kPaG(line.highAbsPa),
      idealPrechargeKPaGauge: kPaG(idealLine.nominalAbsPa),
      readingLowPct: b.lowPct,
      readingNominalPct: b.nominalPct,
      readingHighPct: b.highPct,
      idealReadingNominalPct: bi.nominalPct,
    };
  });
}

/** Temperatures of the results' curves: −50 °C to 60 °C in steps of 2 K. */
export function curveTempsK(): number[] {
  const out: number[] = [];
  for (let c = -50; c <= 60; c += 2) out.push(c + K0);
  return out;
}

/**
 * A profile's precharge lines and reading band against temperature, gauge pressures relative to
 * atmPa, and its break-even temperatures at equilibrium over the band command's range in the plan's
 * units (real gas).
 */
export function profileCurves(profile: ProfileInput, atmPa: number, units: Units): ProfileResult {
  const rows = bandCurves(profile, curveTempsK(), atmPa);
  const range = defaultEnergyRangeK(units);
  return {
    name: profile.name,
    atmosphereKPaAbsolute: atmPa / PA_PER_KPA,
    prechargeLine: rows.map((r) => ({
      tempC: r.tempC,
      prechargeKPaGauge: r.prechargeKPaGauge,
      prechargeLowKPaGauge: r.prechargeLowKPaGauge,
      prechargeHighKPaGauge: r.prechargeHighKPaGauge,
      idealPrechargeKPaGauge: r.idealPrechargeKPaGauge,
    })),
    band: rows.map((r) => ({
      tempC: r.tempC,
      readingLowPct: r.readingLowPct,
      readingNominalPct: r.readingNominalPct,
      readingHighPct: r.readingHighPct,
      idealReadingNominalPct: r.idealReadingNominalPct,
    })),
    energyRangeC: { fromC: kToC(range.fromK), toC: kToC(range.toK) },
    breakEven: equilibriumBreakEven(profile, atmPa, realGas, range),
  };
}
