/**
 * The trapped charge of one base by local month (docs/methods.md §3, "Thermal relief"): the highest
 * trapped pressure, the openings of the thermal relief valve and the fluid they let out, pooled over
 * the stays at the base (each counted once) and its climate years; and one warning per base-month where
 * a profile without a relief valve sees a trapped pressure above 1.1 × its system high.
 */
import { gaugePa, M3_PER_LITRE, PA_PER_KPA, showWithUnit, unitSystem } from "../units/index.js";
import { MONTH_NAMES } from "./calendar.js";
import type { Plan } from "./planFile.js";
import type { TrappedMonthRow } from "./results.js";
import type { BaseSamples } from "./samples.js";
import type { BaseOutcomes } from "./simulateSamples.js";

/** A trapped pressure above this multiple of the system high, without a relief valve, is warned about. */
export const OVER_HIGH_WARNING_RATIO = 1.1;

/** Peak trapped pressure, relief openings and fluid relieved of a base by local month (1–12). */
export function trappedChargeMonths(
  plan: Plan,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  warnings: string[],
): TrappedMonthRow[] {
  const atmPa = base.climate.atmPa;
  const peakAbsPa = new Float64Array(13).fill(Number.NaN);
  const events = new Array<number>(13).fill(0);
  const relievedM3 = new Array<number>(13).fill(0);
  /** Per month, the worst excess over the warning limit of a profile without a relief valve. */
  const overLimit: ({ profile: string; peakAbsPa: number; limitAbsPa: number } | null)[] = new Array(13).fill(
    null,
  );
  for (const gi of base.groupOfStay) {
    const profile = plan.profiles[base.groups[gi]!.profileIndex]!;
    const limitAbsPa = atmPa + OVER_HIGH_WARNING_RATIO * gaugePa(profile.system.high, atmPa);
    for (let yi = 0; yi < base.years.length; yi++) {
      const o = outcomes.slot(yi, gi);
      for (const r of outcomes.reliefs(o)) {
        events[r.month]!++;
        relievedM3[r.month]! += r.relievedM3;
      }
      for (let m = 1; m <= 12; m++) {
        const p = outcomes.peakTrappedAbsPa(o, m);
        if (p > peakAbsPa[m]! || (Number.isNaN(peakAbsPa[m]!) && !Number.isNaN(p))) peakAbsPa[m] = p;
        const worst = overLimit[m] ?? null;
        if (profile.reliefPressure === undefined && p > limitAbsPa && (worst === null || p > worst.peakAbsPa))
          overLimit[m] = { profile: profile.name, peakAbsPa: p, limitAbsPa };
      }
    }
  }
  const u = unitSystem(plan.units);
  const name = plan.bases[base.baseIndex]!.name;
  const kPaGauge = (abs: number) => showWithUnit(u.pressure, (abs - atmPa) / PA_PER_KPA);
  overLimit.forEach((w, m) => {
    if (w === null) return;
    warnings.push(
      `base "${name}", ${MONTH_NAMES[m - 1]}: trapped pressure up to ${kPaGauge(w.peakAbsPa)}, above ${OVER_HIGH_WARNING_RATIO} × the system high (${kPaGauge(w.limitAbsPa)}) of profile "${w.profile}", which has no thermal relief valve (reliefPressure); a real system would relieve it and the next cold morning would read lower`,
    );
  });
  const years = Math.max(1, base.years.length);
  const rows: TrappedMonthRow[] = [];
  for (let m = 1; m <= 12; m++) {
    const litres = relievedM3[m]! / M3_PER_LITRE;
    rows.push({
      month: m,
      peakTrappedKPaGauge: Number.isNaN(peakAbsPa[m]!) ? null : (peakAbsPa[m]! - atmPa) / PA_PER_KPA,
      reliefEvents: events[m]!,
      reliefEventsPerYear: events[m]! / years,
      relievedL: litres,
      relievedLPerYear: litres / years,
    });
  }
  return rows;
}
