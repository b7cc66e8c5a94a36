/**
 * Precharge line, tolerance lines and reading band against temperature, real gas and ideal
 * (product brief §3), for `results.profiles` and the `coldsoak band` command.
 */
import { gasAmountMol, prechargePressureAbsPa, readingBand } from "../physics/accumulator.js";
import { idealGas, realGas } from "../physics/nitrogen.js";
import { absPa, gaugePa } from "./context.js";
import type { ProfileInput } from "./planFile.js";

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
  const v0 = profile.accumulator.gasVolumeEmpty;
  const geometry = { v0M3: v0, vminM3: profile.accumulator.gasVolumeFull };
  const ref = profile.precharge.reference;
  const refAbs = absPa(ref.pressure, atmPa);
  const tol = profile.precharge.tolerance;
  const band = {
    refGaugePa: gaugePa(ref.pressure, atmPa),
    refTempK: ref.tempK,
    tolerancePa: tol,
    systemLowGaugePa: gaugePa(profile.system.low, atmPa),
    systemNominalGaugePa: gaugePa(profile.system.nominal, atmPa),
    systemHighGaugePa: gaugePa(profile.system.high, atmPa),
    atmPa,
  };
  const amounts = (model: typeof realGas) => ({
    nominal: gasAmountMol(model, refAbs, ref.tempK, v0),
    low: gasAmountMol(model, Math.max(refAbs - tol, 1), ref.tempK, v0),
    high: gasAmountMol(model, refAbs + tol, ref.tempK, v0),
  });
  const real = amounts(realGas);
  const ideal = amounts(idealGas);
  const kPaG = (abs: number) => (abs - atmPa) / 1000;
  return tempsK.map((t) => {
    const b = readingBand(realGas, geometry, band, t);
    const bi = readingBand(idealGas, geometry, band, t);
    return {
      tempC: t - 273.15,
      prechargeKPaGauge: kPaG(prechargePressureAbsPa(realGas, real.nominal, t, v0)),
      prechargeLowKPaGauge: kPaG(prechargePressureAbsPa(realGas, real.low, t, v0)),
      prechargeHighKPaGauge: kPaG(prechargePressureAbsPa(realGas, real.high, t, v0)),
      idealPrechargeKPaGauge: kPaG(prechargePressureAbsPa(idealGas, ideal.nominal, t, v0)),
      readingLowPct: b.lowPct,
      readingNominalPct: b.nominalPct,
      readingHighPct: b.highPct,
      idealReadingNominalPct: bi.nominalPct,
    };
  });
}
