/**
 * The files of a region screen written beside its page, from `screen.json` alone: the JSON text and
 * `screen.csv`, one row per station and local month, the station's columns (identity, coverage and
 * quality-control counts, usable years, coldest mornings, the months needing the option, the
 * break-even margins and the design temperatures) repeated on each of its twelve rows. Units fixed as in the JSON.
 *
 * Like the rest of `output/`, reads only the contract types of the plan layer.
 */
import type {
  BreakEvenMargin,
  HoursBelow,
  MonthDesignTemperature,
  ScreenMonth,
  ScreenResults,
  ScreenStation,
} from "../plan/screenResults.js";
import { type Column, coldestColumns, machineJson, stationColumns, type Table, table } from "./tables.js";

/** screen.json (or a partial): key order as built, numbers with at most 6 decimals, no wall-clock time. */
export function screenJson(r: ScreenResults): string {
  return machineJson(r);
}

interface Row {
  s: ScreenStation;
  m: ScreenMonth;
}

const margin = (s: ScreenStation, units: 1 | 2): BreakEvenMargin | undefined =>
  s.breakEven.find((b) => b.units === units);

/** The hours below the break-even temperature of one or two accumulators, where that temperature exists. */
const below = (s: ScreenStation, units: 1 | 2): HoursBelow | undefined => {
  const at = margin(s, units)?.breakEvenC;
  return at === null || at === undefined ? undefined : s.design.hoursBelow.find((h) => h.thresholdC === at);
};

const designMonth = (s: ScreenStation, month: number): MonthDesignTemperature | undefined =>
  s.design.months.find((d) => d.month === month);

/** screen.csv: every station's twelve local months, stations in id order. */
export function screenTable(r: ScreenResults): Table {
  const station: Column<Row>[] = [
    ...stationColumns(({ s }: Row) => s.station),
    ["atmosphere_kpa_absolute", ({ s }) => s.atmosphere.pressureKPaAbsolute],
    ["atmosphere_source", ({ s }) => s.atmosphere.source],
    ["years_used", ({ s }) => s.yearsUsed.length],
    ["too_few_years", ({ s }) => s.tooFewYears],
    ["no_data_months", ({ s }) => s.noData?.months.join(" ") ?? null],
    ...coldestColumns(({ s }: Row) => s),
    ["months_needing_option", ({ s }) => s.monthsNeedingOption.join(" ")],
    ["fit_by_month", ({ s }) => s.fitBy],
    ["not_needed_after_month", ({ s }) => s.notNeededAfter],
    ["months_still_short", ({ s }) => s.monthsStillShort.join(" ")],
    ["break_even_one_c", ({ s }) => margin(s, 1)?.breakEvenC ?? null],
    ["break_even_margin_one_c", ({ s }) => margin(s, 1)?.marginC ?? null],
    ["break_even_two_c", ({ s }) => margin(s, 2)?.breakEvenC ?? null],
    ["break_even_margin_two_c", ({ s }) => margin(s, 2)?.marginC ?? null],
    ["design_years", ({ s }) => s.design.years.length],
    ["design_annual_996_c", ({ s }) => s.design.annual996C],
    ["design_annual_99_c", ({ s }) => s.design.annual99C],
    ["design_reason", ({ s }) => s.design.reason],
    ["design_coldest_month", ({ s }) => s.design.coldestMonth?.month ?? null],
    ["design_coldest_month_p1_c", ({ s }) => s.design.coldestMonth?.p1C ?? null],
    ["hours_below_break_even_one_per_year", ({ s }) => below(s, 1)?.hoursPerYear ?? null],
    ["longest_below_break_even_one_h", ({ s }) => below(s, 1)?.longestSpellH ?? null],
    ["hours_below_break_even_two_per_year", ({ s }) => below(s, 2)?.hoursPerYear ?? null],
    ["longest_below_break_even_two_h", ({ s }) => below(s, 2)?.longestSpellH ?? null],
  ];
  const month: Column<Row>[] = [
    ["month", ({ m }) => m.month],
    ["status", ({ m }) => m.status],
    ["status_with_option", ({ m }) => m.statusWithOption],
    ["low_confidence", ({ m }) => m.lowConfidence],
    ["needs_option", ({ m }) => m.needsOption],
    ["preflights", ({ m }) => m.preflights],
    ["starts", ({ m }) => m.starts],
    ["short_pct_one", ({ m }) => m.shortPctOne],
    ["short_pct_one_lo90", ({ m }) => m.shortPctOneLo90],
    ["short_pct_one_hi90", ({ m }) => m.shortPctOneHi90],
    ["short_pct_two", ({ m }) => m.shortPctTwo],
    ["short_pct_two_lo90", ({ m }) => m.shortPctTwoLo90],
    ["short_pct_two_hi90", ({ m }) => m.shortPctTwoHi90],
    ["out_of_band_pct", ({ m }) => m.outOfBandPct],
    ["out_of_band_pct_lo90", ({ m }) => m.outOfBandPctLo90],
    ["out_of_band_pct_hi90", ({ m }) => m.outOfBandPctHi90],
    ["out_of_band_pct_with_option", ({ m }) => m.outOfBandPctWithOption],
    ["month_coldest_morning_c", ({ m }) => m.coldestMorningC],
    ["month_coldest_1in10_c", ({ m }) => m.coldest1in10C],
    ["month_design_p1_c", ({ s, m }) => designMonth(s, m.month)?.p1C ?? null],
  ];
  const rows = r.stations.flatMap((s) => s.months.map((m) => ({ s, m })));
  return table("screen", rows, [...station, ...month]);
}
