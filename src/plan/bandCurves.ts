/**
 * Precharge line, tolerance lines and reading band against temperature, real gas and ideal
 * (docs/methods.md §3), for `results.profiles` and the `coldsoak band` command.
 */
import { prechargeLinesAbsPa, readingBand } from "../physics/accumulator.js";
import { idealGas, realGas } from "../physics/nitrogen.js";
import { kToC, PA_PER_KPA } from "../units/index.js";
import { bandInputsOf } from "./context.js";
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
