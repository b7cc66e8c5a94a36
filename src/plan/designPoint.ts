/**
 * The design point of each profile flown at a base (docs/methods.md, "Design point"): the base's
 * typical (median) and P90 overnight drop of the accumulator temperature from the simulated stays; the
 * break-even temperatures after those drops (charged at the afternoon temperature, trapped, cooled);
 * the start energy against the morning's temperature; and a short worksheet at the cold design point,
 * the base's 1-in-10-year coldest morning: the precharge there and its ratio to the system pressure,
 * the gas volumes, the margin with low-side precharge, the peak trapped pressure against the system's
 * high limit, and the recharge time against the pump's timer. Exact real-gas physics throughout.
 */
import { prechargePressureAbsPa, readingPct, recharge, startDischarge } from "../physics/accumulator.js";
import { realGas } from "../physics/nitrogen.js";
import { cToK, gaugePa, kToC, M3_PER_LITRE, PA_PER_KPA } from "../units/index.js";
import { curveTempsK } from "./bandCurves.js";
import {
  afterDropBreakEven,
  caseEnergyJ,
  defaultEnergyRangeK,
  type EnergyCase,
  type EnergyProfile,
  energyProfile,
  requiredEnergyJ,
} from "./breakEven.js";
import { pumpOf } from "./context.js";
import type { Plan, ProfileInput } from "./planFile.js";
import type {
  DesignMargin,
  DesignPointRow,
  DesignRecharge,
  DesignWorksheet,
  EnergyCurveRow,
  TrappedMonthRow,
} from "./results.js";
import type { BaseSamples } from "./samples.js";
import type { BaseOutcomes } from "./simulateSamples.js";
import { quantile } from "./stats.js";

/** The base's typical (median) and P90 overnight drop, K; null without a drop. */
interface Drops {
  typicalK: number | null;
  p90K: number | null;
}

/** Overnight drops of the accumulator temperature per profile (index of `plan.profiles`), each stay once. */
function dropsByProfile(plan: Plan, base: BaseSamples, outcomes: BaseOutcomes): Drops[] {
  const values = plan.profiles.map(() => [] as number[]);
  const d = outcomes.drops;
  for (const gi of base.groupOfStay) {
    const list = values[base.groups[gi]!.profileIndex]!;
    for (let yi = 0; yi < base.years.length; yi++) {
      const o = outcomes.slot(yi, gi);
      for (let i = d.at[o]!; i < d.at[o + 1]!; i++) list.push(d.tempC[i]!);
    }
  }
  return values.map((v) => ({ typicalK: quantile(v, 0.5), p90K: quantile(v, 0.9) }));
}

const NOMINAL: Omit<EnergyCase, "units"> = { precharge: "nominal", system: "nominal" };

/** Energy against the morning's temperature: equilibrium lines and the nominal line after each drop. */
function energyCurve(p: EnergyProfile, drops: Drops): EnergyCurveRow[] {
  const e = (units: 1 | 2, precharge: EnergyCase["precharge"], t: number, dropK = 0) =>
    caseEnergyJ(p, { units, precharge, system: "nominal" }, t, dropK);
  const after = (units: 1 | 2, t: number, dropK: number | null) =>
    dropK === null ? null : caseEnergyJ(p, { units, ...NOMINAL }, t, dropK);
  return curveTempsK().map((t) => ({
    tempC: kToC(t),
    requiredJ: requiredEnergyJ(p, t),
    oneLowJ: e(1, "low", t),
    oneNominalJ: e(1, "nominal", t),
    oneHighJ: e(1, "high", t),
    twoLowJ: e(2, "low", t),
    twoNominalJ: e(2, "nominal", t),
    twoHighJ: e(2, "high", t),
    oneTypicalDropJ: after(1, t, drops.typicalK),
    oneP90DropJ: after(1, t, drops.p90K),
    twoTypicalDropJ: after(2, t, drops.typicalK),
    twoP90DropJ: after(2, t, drops.p90K),
  }));
}

/** Margins at the design temperature with low-side precharge and nominal system pressure. */
function margins(p: EnergyProfile, tempK: number, drops: Drops): DesignMargin[] {
  const required = requiredEnergyJ(p, tempK);
  const cases = [
    ["none", 0],
    ["typical", drops.typicalK],
    ["p90", drops.p90K],
  ] as const;
  return ([1, 2] as const).flatMap((units) =>
    cases.flatMap(([drop, dropK]) => {
      if (dropK === null) return [];
      const energyJ = caseEnergyJ(p, { units, precharge: "low", system: "nominal" }, tempK, dropK);
      const marginPct = (100 * (energyJ - required)) / required;
      return [{ units, count: p.units[units].count, drop, energyJ, marginPct }];
    }),
  );
}

/** The worksheet of one profile at a base (null figures without a design temperature). */
function worksheet(
  profile: ProfileInput,
  atmPa: number,
  designTempC: number | null,
  drops: Drops,
  trapped: TrappedMonthRow[],
): DesignWorksheet {
  const p = energyProfile(profile, atmPa, realGas);
  const { geometry, starter } = p.units[1];
  const peaks = trapped.flatMap((m) => (m.peakTrappedKPaGauge === null ? [] : [m.peakTrappedKPaGauge]));
  const kPaG = (abs: number) => (abs - atmPa) / PA_PER_KPA;
  const sheet: DesignWorksheet = {
    profile: profile.name,
    designTempC,
    dropTypicalC: drops.typicalK,
    dropP90C: drops.p90K,
    prechargeKPaGauge: null,
    prechargeLowKPaGauge: null,
    prechargeHighKPaGauge: null,
    prechargeRatio: null,
    gasVolumeEmptyL: geometry.v0M3 / M3_PER_LITRE,
    gasVolumeFullL: geometry.vminM3 / M3_PER_LITRE,
    gasVolumeChargedL: null,
    gasVolumeEndL: null,
    readingPct: null,
    requiredJ: null,
    margins: [],
    peakTrappedKPaGauge: peaks.length > 0 ? Math.max(...peaks) : null,
    systemHighKPaGauge: gaugePa(profile.system.high, atmPa) / PA_PER_KPA,
    reliefKPaGauge:
      profile.reliefPressure === undefined ? null : gaugePa(profile.reliefPressure, atmPa) / PA_PER_KPA,
    recharge: [],
    curve: energyCurve(p, drops),
  };
  if (designTempC === null) return sheet;
  const t = cToK(designTempC);
  const line = (n: number) => prechargePressureAbsPa(realGas, n, t, geometry.v0M3);
  const n = p.amountMol.nominal;
  const sys = p.systemAbsPa.nominal;
  const charged = Math.min(geometry.v0M3, Math.max(geometry.vminM3, n / realGas.densityMolM3(sys, t)));
  const end = startDischarge(realGas, geometry, 1, n, t, charged, starter).end.gasVolumeM3;
  const timers = { 1: profile.pump.timer, 2: profile.coldStartOption.timer };
  const refill = ([1, 2] as const).map((units): DesignRecharge => {
    const { count } = p.units[units];
    const r = recharge(realGas, geometry, count, n, t, end, sys, pumpOf(profile, atmPa, timers[units]));
    return { units, count, timeS: r.timeS, timerS: timers[units], reachedSystem: r.reachedSystem };
  });
  return {
    ...sheet,
    prechargeKPaGauge: kPaG(line(n)),
    prechargeLowKPaGauge: kPaG(line(p.amountMol.low)),
    prechargeHighKPaGauge: kPaG(line(p.amountMol.high)),
    prechargeRatio: line(n) / sys,
    gasVolumeChargedL: charged / M3_PER_LITRE,
    gasVolumeEndL: end / M3_PER_LITRE,
    readingPct: readingPct(geometry, charged),
    requiredJ: requiredEnergyJ(p, t),
    margins: margins(p, t, drops),
    recharge: refill,
  };
}

/**
 * The design point of every profile flown at a base: the after-drop break-even rows
 * (`bases[].designPoint`) and the worksheets (`bases[].designWorksheets`).
 */
export function baseDesignPoint(
  plan: Plan,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  coldest1in10C: number | null,
  trapped: TrappedMonthRow[],
): { designPoint: DesignPointRow[]; designWorksheets: DesignWorksheet[] } {
  const drops = dropsByProfile(plan, base, outcomes);
  const flown = [...new Set(base.groups.map((g) => g.profileIndex))].sort((a, b) => a - b);
  const range = defaultEnergyRangeK(plan.units);
  const atmPa = base.climate.atmPa;
  const designPoint = flown.flatMap((i) => {
    const profile = plan.profiles[i]!;
    const d = drops[i]!;
    return (
      [
        ["typical", d.typicalK],
        ["p90", d.p90K],
      ] as const
    ).flatMap(([drop, dropK]) =>
      dropK === null ? [] : afterDropBreakEven(profile, atmPa, realGas, range, { drop, dropK }),
    );
  });
  const designWorksheets = flown.map((i) =>
    worksheet(plan.profiles[i]!, atmPa, coldest1in10C, drops[i]!, trapped),
  );
  return { designPoint, designWorksheets };
}
