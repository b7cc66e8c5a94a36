/**
 * The engineer's tables beside the report: break-even temperatures, energy curves, the design point
 * worksheets, the climate design temperatures and the what-if variants. Same conventions as
 * `tables.ts` (fixed units in the column names, empty cells for no value); reads only the `Results`
 * types.
 */
import type {
  BaseResult,
  BreakEvenRow,
  DesignMargin,
  DesignRecharge,
  DesignWorksheet,
  Results,
} from "../plan/results.js";
import { type Column, type Table, table } from "./tables.js";

/** One row of break_even.csv: a case of a profile, at equilibrium or after a base's drop. */
interface BreakEvenLine {
  scope: "profile" | "base";
  base: string | null;
  profile: string;
  atmosphereKPaAbsolute: number;
  drop: "none" | "typical" | "p90";
  dropC: number | null;
  x: BreakEvenRow;
}

function breakEvenLines(r: Results): BreakEvenLine[] {
  const out: BreakEvenLine[] = [];
  for (const p of r.profiles) {
    for (const x of p.breakEven) {
      const at = p.atmosphereKPaAbsolute;
      out.push({
        scope: "profile",
        base: null,
        profile: p.name,
        atmosphereKPaAbsolute: at,
        drop: "none",
        dropC: null,
        x,
      });
    }
  }
  for (const b of r.bases) {
    const at = b.atmosphere.pressureKPaAbsolute;
    for (const p of b.profileCurves)
      for (const x of p.breakEven)
        out.push({
          scope: "base",
          base: b.name,
          profile: p.name,
          atmosphereKPaAbsolute: at,
          drop: "none",
          dropC: null,
          x,
        });
    for (const x of b.designPoint)
      out.push({
        scope: "base",
        base: b.name,
        profile: x.profile,
        atmosphereKPaAbsolute: at,
        drop: x.drop,
        dropC: x.dropC,
        x,
      });
  }
  return out;
}

const margin = (w: DesignWorksheet, units: 1 | 2, drop: DesignMargin["drop"]) =>
  w.margins.find((m) => m.units === units && m.drop === drop)?.marginPct ?? null;
const refill = (w: DesignWorksheet, units: 1 | 2): DesignRecharge | null =>
  w.recharge.find((x) => x.units === units) ?? null;

/** Every base's items paired with the base. */
function perBase<T>(r: Results, items: (b: BaseResult) => T[]): { b: BaseResult; x: T }[] {
  return r.bases.flatMap((b) => items(b).map((x) => ({ b, x })));
}

/** The tables of break-even temperatures, energy curves, design points, design temperatures and what-if. */
export function designTables(r: Results): Table[] {
  const base: Column<{ b: BaseResult }> = ["base", ({ b }) => b.name];
  const worksheets = perBase(r, (b) => b.designWorksheets);
  const tables = [
    table("break_even", breakEvenLines(r), [
      ["scope", (l) => l.scope],
      ["base", (l) => l.base],
      ["profile", (l) => l.profile],
      ["atmosphere_kpa_absolute", (l) => l.atmosphereKPaAbsolute],
      ["drop", (l) => l.drop],
      ["drop_c", (l) => l.dropC],
      ["units", (l) => l.x.units],
      ["count", (l) => l.x.count],
      ["precharge", (l) => l.x.precharge],
      ["system", (l) => l.x.system],
      ["ambient_c", (l) => l.x.ambientC],
      ["reason", (l) => l.x.reason],
    ]),
    table(
      "energy_curve",
      worksheets.flatMap(({ b, x }) => x.curve.map((c) => ({ b, w: x, c }))),
      [
        base,
        ["profile", ({ w }) => w.profile],
        ["temp_c", ({ c }) => c.tempC],
        ["required_j", ({ c }) => c.requiredJ],
        ["one_low_j", ({ c }) => c.oneLowJ],
        ["one_nominal_j", ({ c }) => c.oneNominalJ],
        ["one_high_j", ({ c }) => c.oneHighJ],
        ["two_low_j", ({ c }) => c.twoLowJ],
        ["two_nominal_j", ({ c }) => c.twoNominalJ],
        ["two_high_j", ({ c }) => c.twoHighJ],
        ["one_typical_drop_j", ({ c }) => c.oneTypicalDropJ],
        ["one_p90_drop_j", ({ c }) => c.oneP90DropJ],
        ["two_typical_drop_j", ({ c }) => c.twoTypicalDropJ],
        ["two_p90_drop_j", ({ c }) => c.twoP90DropJ],
      ],
    ),
    table("design_point", worksheets, [
      base,
      ["profile", ({ x }) => x.profile],
      ["design_temp_c", ({ x }) => x.designTempC],
      ["drop_typical_c", ({ x }) => x.dropTypicalC],
      ["drop_p90_c", ({ x }) => x.dropP90C],
      ["precharge_kpa_gauge", ({ x }) => x.prechargeKPaGauge],
      ["precharge_low_kpa_gauge", ({ x }) => x.prechargeLowKPaGauge],
      ["precharge_high_kpa_gauge", ({ x }) => x.prechargeHighKPaGauge],
      ["precharge_ratio", ({ x }) => x.prechargeRatio],
      ["gas_volume_empty_l", ({ x }) => x.gasVolumeEmptyL],
      ["gas_volume_full_l", ({ x }) => x.gasVolumeFullL],
      ["gas_volume_charged_l", ({ x }) => x.gasVolumeChargedL],
      ["gas_volume_end_l", ({ x }) => x.gasVolumeEndL],
      ["reading_pct", ({ x }) => x.readingPct],
      ["required_j", ({ x }) => x.requiredJ],
      ["margin_one_pct", ({ x }) => margin(x, 1, "none")],
      ["margin_one_typical_drop_pct", ({ x }) => margin(x, 1, "typical")],
      ["margin_one_p90_drop_pct", ({ x }) => margin(x, 1, "p90")],
      ["margin_two_pct", ({ x }) => margin(x, 2, "none")],
      ["margin_two_typical_drop_pct", ({ x }) => margin(x, 2, "typical")],
      ["margin_two_p90_drop_pct", ({ x }) => margin(x, 2, "p90")],
      ["peak_trapped_kpa_gauge", ({ x }) => x.peakTrappedKPaGauge],
      ["system_high_kpa_gauge", ({ x }) => x.systemHighKPaGauge],
      ["relief_kpa_gauge", ({ x }) => x.reliefKPaGauge],
      ["recharge_one_s", ({ x }) => refill(x, 1)?.timeS ?? null],
      ["timer_one_s", ({ x }) => refill(x, 1)?.timerS ?? null],
      ["recharge_one_reached", ({ x }) => refill(x, 1)?.reachedSystem ?? null],
      ["recharge_two_s", ({ x }) => refill(x, 2)?.timeS ?? null],
      ["timer_two_s", ({ x }) => refill(x, 2)?.timerS ?? null],
      ["recharge_two_reached", ({ x }) => refill(x, 2)?.reachedSystem ?? null],
    ]),
    table("design_temperatures", r.bases, [
      ["base", (b) => b.name],
      ["years", (b) => b.designTemperatures.years.join(" ")],
      ["years_skipped", (b) => b.designTemperatures.yearsSkipped.map((y) => y.year).join(" ")],
      ["annual_996_c", (b) => b.designTemperatures.annual996C],
      ["annual_99_c", (b) => b.designTemperatures.annual99C],
      ["reason", (b) => b.designTemperatures.reason],
      ["coldest_month", (b) => b.designTemperatures.coldestMonth?.month ?? null],
      ["coldest_month_p1_c", (b) => b.designTemperatures.coldestMonth?.p1C ?? null],
      ["coldest_month_mean_c", (b) => b.designTemperatures.coldestMonth?.meanC ?? null],
      ["coldest_hour_mean_c", (b) => b.designTemperatures.coldestHour.meanC],
      ["coldest_hour_1in10_c", (b) => b.designTemperatures.coldestHour.oneIn10C],
      ["coldest_hour_1in10_c_lo90", (b) => b.designTemperatures.coldestHour.oneIn10CLo90],
      ["coldest_hour_1in10_c_hi90", (b) => b.designTemperatures.coldestHour.oneIn10CHi90],
      ["coldest_hour_1in30_c", (b) => b.designTemperatures.coldestHour.oneIn30C],
      ["coldest_hour_1in30_c_lo90", (b) => b.designTemperatures.coldestHour.oneIn30CLo90],
      ["coldest_hour_1in30_c_hi90", (b) => b.designTemperatures.coldestHour.oneIn30CHi90],
      ["coldest_morning_mean_c", (b) => b.designTemperatures.coldestMorningMeanC],
    ]),
    table(
      "design_months",
      perBase(r, (b) => b.designTemperatures.months),
      [
        base,
        ["month", ({ x }) => x.month],
        ["years", ({ x }) => x.years.join(" ")],
        ["mean_c", ({ x }) => x.meanC],
        ["p1_c", ({ x }) => x.p1C],
        ["reason", ({ x }) => x.reason],
      ],
    ),
    table(
      "hours_below",
      perBase(r, (b) => b.designTemperatures.hoursBelow),
      [
        base,
        ["threshold_c", ({ x }) => x.thresholdC],
        ["hours_per_year", ({ x }) => x.hoursPerYear],
        ["longest_spell_h", ({ x }) => x.longestSpellH],
      ],
    ),
  ];
  if (r.whatIf === null) return tables;
  const variants = perBase(r, (b) => {
    const w = b.whatIf;
    if (w === null) return [];
    const baseline = {
      name: "baseline",
      label: "As planned",
      ...w.baseline,
      shortPctOneChange: w.baseline.shortPctOne === null ? null : 0,
      shortPctTwoChange: w.baseline.shortPctTwo === null ? null : 0,
      outOfBandPctChange: w.baseline.outOfBandPct === null ? null : 0,
    };
    return [baseline, ...w.variants].map((v) => ({ month: w.month, reason: w.reason, v }));
  });
  tables.push(
    table("what_if", variants, [
      base,
      ["month", ({ x }) => x.month],
      ["variant", ({ x }) => x.v.name],
      ["label", ({ x }) => x.v.label],
      ["short_pct_one", ({ x }) => x.v.shortPctOne],
      ["short_pct_two", ({ x }) => x.v.shortPctTwo],
      ["out_of_band_pct", ({ x }) => x.v.outOfBandPct],
      ["short_pct_one_change", ({ x }) => x.v.shortPctOneChange],
      ["short_pct_two_change", ({ x }) => x.v.shortPctTwoChange],
      ["out_of_band_pct_change", ({ x }) => x.v.outOfBandPctChange],
      ["reason", ({ x }) => x.reason],
    ]),
  );
  return tables;
}
