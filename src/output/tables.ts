/**
 * The files written beside the report from the results alone: the `results.json` text and the CSV
 * tables, one CSV per table, named after the table. Every column is declared once, with its header and
 * how to read its value. Units are fixed like the JSON: °C, kPa gauge, kg, %; column names carry their
 * unit. Empty cells mean "no value" (a month without preflights). Quoting follows RFC 4180.
 *
 * Like `report/`, this folder reads only the `Results` types of `plan/results.ts`: cli → output →
 * plan/results (types), never the engine, the climate or the physics code.
 */
import type { BaseResult, ProfileResult, Results } from "../plan/results.js";
import { formatMachine, shownText, unitSystem } from "../units/index.js";

export type Cell = string | number | boolean | null;
export interface Table {
  name: string;
  columns: string[];
  rows: Cell[][];
}

function cell(c: Cell): string {
  if (c === null) return "";
  if (typeof c === "number") return Number.isFinite(c) ? formatMachine(c) : "";
  if (typeof c === "boolean") return c ? "yes" : "no";
  // A text that a spreadsheet would read as a formula (= + - @ tab CR first, e.g. a plan's "-40 F")
  // gets a leading apostrophe (OWASP, "CSV Injection").
  const text = /^[=+\-@\t\r]/.test(c) ? `'${c}` : c;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(t: Table): string {
  return `${[t.columns, ...t.rows].map((r) => r.map(cell).join(",")).join("\r\n")}\r\n`;
}

/** A column: its CSV header (unit in the name) and how to read its cell from a row's source. */
type Column<T> = [header: string, value: (row: T) => Cell];

function table<T>(name: string, rows: T[], columns: Column<T>[]): Table {
  return { name, columns: columns.map((c) => c[0]), rows: rows.map((row) => columns.map((c) => c[1](row))) };
}

/** Rows of every base's items, each paired with its base. */
function perBase<T>(r: Results, items: (b: BaseResult) => T[]): { b: BaseResult; x: T }[] {
  return r.bases.flatMap((b) => items(b).map((x) => ({ b, x })));
}

/** Rows of every profile's items, each paired with its profile. */
function perProfile<T>(r: Results, items: (p: ProfileResult) => T[]): { p: ProfileResult; x: T }[] {
  return r.profiles.flatMap((p) => items(p).map((x) => ({ p, x })));
}

/** Every table of the results, in a fixed order. */
export function resultTables(r: Results): Table[] {
  const baseName: Column<{ b: BaseResult }> = ["base", ({ b }) => b.name];
  const profileName: Column<{ p: ProfileResult }> = ["profile", ({ p }) => p.name];
  const traces = r.bases.flatMap((b) =>
    (["typical", "worst"] as const).flatMap((kind) => {
      const t = b.traces[kind];
      return t === null ? [] : t.points.map((x) => ({ b, kind, t, x }));
    }),
  );
  return [
    table("bases", r.bases, [
      ["base", (b) => b.name],
      ["stations", (b) => b.stations.map((s) => s.id).join(" ")],
      ["time_zone", (b) => b.timeZone],
      ["years_used", (b) => b.yearsUsed.join(" ")],
      ["years_skipped", (b) => b.yearsSkipped.map((y) => y.year).join(" ")],
      ["coldest_morning_c", (b) => b.coldestMorningC],
      ["coldest_1in10_c", (b) => b.coldest1in10C],
      ["nitrogen_kg_p50", (b) => b.nitrogen.kgP50],
      ["nitrogen_kg_p90", (b) => b.nitrogen.kgP90],
      ["nitrogen_kg_p95", (b) => b.nitrogen.kgP95],
      ["cylinders_p50", (b) => b.nitrogen.cylindersP50],
      ["cylinders_p90", (b) => b.nitrogen.cylindersP90],
      ["cylinders_p95", (b) => b.nitrogen.cylindersP95],
      ["carts_p95", (b) => b.nitrogen.cartsP95],
      ["nitrogen_kg_added_p50", (b) => b.nitrogen.kgAddedP50],
      ["nitrogen_kg_vented_p50", (b) => b.nitrogen.kgVentedP50],
      ["servicing_events_p50", (b) => b.nitrogen.servicingEventsP50],
      ["carts_p50", (b) => b.nitrogen.cartsP50],
      ["carts_p90", (b) => b.nitrogen.cartsP90],
    ]),
    table(
      "months",
      perBase(r, (b) => b.months),
      [
        baseName,
        ["month", ({ x }) => x.month],
        ["preflights", ({ x }) => x.preflights],
        ["below_band_pct", ({ x }) => x.belowBandPct],
        ["above_band_pct", ({ x }) => x.aboveBandPct],
        ["starts", ({ x }) => x.starts],
        ["short_pct_one", ({ x }) => x.shortPctOne],
        ["short_pct_two", ({ x }) => x.shortPctTwo],
        ["energy_margin_one_p10_pct", ({ x }) => x.energyMarginOneP10Pct],
        ["energy_margin_one_p50_pct", ({ x }) => x.energyMarginOneP50Pct],
        ["energy_margin_two_p10_pct", ({ x }) => x.energyMarginTwoP10Pct],
        ["energy_margin_two_p50_pct", ({ x }) => x.energyMarginTwoP50Pct],
        ["morning_kpa_gauge_p10", ({ x }) => x.morningKPaGaugeP10],
        ["morning_kpa_gauge_p50", ({ x }) => x.morningKPaGaugeP50],
        ["morning_kpa_gauge_p90", ({ x }) => x.morningKPaGaugeP90],
        ["morning_reading_pct_p10", ({ x }) => x.morningReadingPctP10],
        ["morning_reading_pct_p50", ({ x }) => x.morningReadingPctP50],
        ["morning_reading_pct_p90", ({ x }) => x.morningReadingPctP90],
        ["overnight_drop_temp_mean_c", ({ x }) => x.overnightDropTempMeanC],
        ["overnight_drop_temp_p90_c", ({ x }) => x.overnightDropTempP90C],
        ["overnight_drop_kpa_mean", ({ x }) => x.overnightDropKPaMean],
        ["overnight_drop_kpa_p90", ({ x }) => x.overnightDropKPaP90],
        ["overnight_drop_reading_mean_pct", ({ x }) => x.overnightDropReadingMeanPct],
        ["overnight_drop_reading_p90_pct", ({ x }) => x.overnightDropReadingP90Pct],
        ["daily_range_mean_c", ({ x }) => x.dailyRangeMeanC],
        ["daily_range_p90_c", ({ x }) => x.dailyRangeP90C],
      ],
    ),
    table(
      "advice",
      perBase(r, (b) => b.advice),
      [
        baseName,
        ["month", ({ x }) => x.month],
        ["fit_cold_start_option", ({ x }) => x.fitColdStartOption],
        ["short_pct_one", ({ x }) => x.shortPctOne],
        ["short_pct_two", ({ x }) => x.shortPctTwo],
        ["improvement_pct", ({ x }) => x.improvementPct],
      ],
    ),
    table(
      "trapped_charge",
      perBase(r, (b) => b.trappedCharge),
      [
        baseName,
        ["month", ({ x }) => x.month],
        ["peak_trapped_kpa_gauge", ({ x }) => x.peakTrappedKPaGauge],
        ["relief_events", ({ x }) => x.reliefEvents],
        ["relief_events_per_year", ({ x }) => x.reliefEventsPerYear],
        ["relieved_l", ({ x }) => x.relievedL],
        ["relieved_l_per_year", ({ x }) => x.relievedLPerYear],
      ],
    ),
    table(
      "out_of_band_by_hour",
      perBase(r, (b) => b.outOfBandByHour),
      [
        baseName,
        ["local_hour", ({ x }) => x.hour],
        ["hourly_readings", ({ x }) => x.preflights],
        ["out_of_band_pct", ({ x }) => x.outOfBandPct],
      ],
    ),
    table(
      "coldest_mornings",
      perBase(r, (b) => b.coldestMorningByYear),
      [baseName, ["year", ({ x }) => x.year], ["coldest_preflight_ambient_c", ({ x }) => x.tempC]],
    ),
    table(
      "climate_months",
      perBase(r, (b) => b.climateMonths),
      [
        baseName,
        ["month", ({ x }) => x.month],
        ["min_c", ({ x }) => x.minC],
        ["mean_c", ({ x }) => x.meanC],
        ["max_c", ({ x }) => x.maxC],
        ["mean_daily_range_c", ({ x }) => x.meanDailyRangeC],
        ["p90_daily_range_c", ({ x }) => x.p90DailyRangeC],
      ],
    ),
    table(
      "daily_range_histogram",
      perBase(r, (b) => b.dailyRangeHistogram),
      [
        baseName,
        ["range_low_c", ({ x }) => x.lowC],
        ["range_high_c", ({ x }) => x.highC],
        ["days", ({ x }) => x.days],
      ],
    ),
    table(
      "nitrogen_stays",
      perBase(r, (b) => b.nitrogen.stays),
      [
        baseName,
        ["aircraft", ({ x }) => x.aircraft],
        ["arrive", ({ x }) => x.arrive],
        ["depart", ({ x }) => x.depart],
        ["profile", ({ x }) => x.profile],
        ["cold_start_option", ({ x }) => x.coldStartOption],
        ["servicing_events_p50", ({ x }) => x.servicingEventsP50],
        ["precharge_checks_p50", ({ x }) => x.prechargeChecksP50],
        ["hand_pump_strokes_p50", ({ x }) => x.handPumpStrokesP50],
        ["kg_added_p50", ({ x }) => x.kgAddedP50],
        ["kg_vented_p50", ({ x }) => x.kgVentedP50],
        ["kg_p50", ({ x }) => x.kgP50],
        ["kg_p90", ({ x }) => x.kgP90],
        ["kg_p95", ({ x }) => x.kgP95],
      ],
    ),
    table("traces", traces, [
      baseName,
      ["trace", ({ kind }) => kind],
      ["year", ({ t }) => t.year],
      ["hour", ({ x }) => x.hour],
      ["local_time", ({ x }) => x.localTime],
      ["ambient_c", ({ x }) => x.ambientC],
      ["accumulator_c", ({ x }) => x.accumulatorC],
      ["gas_kpa_gauge", ({ x }) => x.gasKPaGauge],
      ["reading_pct", ({ x }) => x.readingPct],
      ["band_low_pct", ({ x }) => x.bandLowPct],
      ["band_high_pct", ({ x }) => x.bandHighPct],
    ]),
    table(
      "stations",
      perBase(r, (b) => b.stations),
      [
        baseName,
        ["station", ({ x }) => x.id],
        ["name", ({ x }) => x.name],
        ["lat", ({ x }) => x.lat],
        ["lon", ({ x }) => x.lon],
        ["elevation_m", ({ x }) => x.elevationM],
        ["time_zone", ({ x }) => x.timeZone],
        ["first_utc", ({ x }) => x.firstUtc],
        ["last_utc", ({ x }) => x.lastUtc],
        ["hours", ({ x }) => x.hours],
        ["filled_hours", ({ x }) => x.filledHours],
        ["completeness", ({ x }) => x.completeness],
        ["qc_read", ({ x }) => x.qc.read],
        ["qc_kept", ({ x }) => x.qc.kept],
        ["qc_malformed", ({ x }) => x.qc.dropped.malformed],
        ["qc_summary", ({ x }) => x.qc.dropped.summary],
        ["qc_other_site", ({ x }) => x.qc.dropped.otherSite],
        ["qc_missing", ({ x }) => x.qc.dropped.missing],
        ["qc_range", ({ x }) => x.qc.dropped.range],
        ["qc_erroneous", ({ x }) => x.qc.dropped.erroneous],
        ["qc_suspect", ({ x }) => x.qc.dropped.suspect],
        ["qc_duplicate", ({ x }) => x.qc.dropped.duplicate],
      ],
    ),
    table("atmosphere", r.bases, [
      ["base", (b) => b.name],
      ["station", (b) => b.atmosphere.station],
      ["elevation_m", (b) => b.atmosphere.elevationM],
      ["atmosphere_kpa_absolute", (b) => b.atmosphere.pressureKPaAbsolute],
      ["source", (b) => b.atmosphere.source],
    ]),
    table(
      "base_curves",
      r.bases.flatMap((b) =>
        b.profileCurves.flatMap((p) => p.prechargeLine.map((x, i) => ({ b, p, x, band: p.band[i] ?? null }))),
      ),
      [
        baseName,
        ["profile", ({ p }) => p.name],
        ["atmosphere_kpa_absolute", ({ p }) => p.atmosphereKPaAbsolute],
        ["temp_c", ({ x }) => x.tempC],
        ["precharge_kpa_gauge", ({ x }) => x.prechargeKPaGauge],
        ["precharge_low_kpa_gauge", ({ x }) => x.prechargeLowKPaGauge],
        ["precharge_high_kpa_gauge", ({ x }) => x.prechargeHighKPaGauge],
        ["ideal_precharge_kpa_gauge", ({ x }) => x.idealPrechargeKPaGauge],
        ["reading_low_pct", ({ band }) => band?.readingLowPct ?? null],
        ["reading_nominal_pct", ({ band }) => band?.readingNominalPct ?? null],
        ["reading_high_pct", ({ band }) => band?.readingHighPct ?? null],
        ["ideal_reading_nominal_pct", ({ band }) => band?.idealReadingNominalPct ?? null],
      ],
    ),
    table(
      "precharge_line",
      perProfile(r, (p) => p.prechargeLine),
      [
        profileName,
        ["temp_c", ({ x }) => x.tempC],
        ["precharge_kpa_gauge", ({ x }) => x.prechargeKPaGauge],
        ["precharge_low_kpa_gauge", ({ x }) => x.prechargeLowKPaGauge],
        ["precharge_high_kpa_gauge", ({ x }) => x.prechargeHighKPaGauge],
        ["ideal_precharge_kpa_gauge", ({ x }) => x.idealPrechargeKPaGauge],
      ],
    ),
    table(
      "band",
      perProfile(r, (p) => p.band),
      [
        profileName,
        ["temp_c", ({ x }) => x.tempC],
        ["reading_low_pct", ({ x }) => x.readingLowPct],
        ["reading_nominal_pct", ({ x }) => x.readingNominalPct],
        ["reading_high_pct", ({ x }) => x.readingHighPct],
        ["ideal_reading_nominal_pct", ({ x }) => x.idealReadingNominalPct],
      ],
    ),
    table("stays", r.stays, [
      ["aircraft", (s) => s.aircraft],
      ["base", (s) => s.base],
      ["arrive", (s) => s.arrive],
      ["depart", (s) => s.depart],
      ["profile", (s) => s.profile],
      ["cold_start_option", (s) => s.coldStartOption],
    ]),
    table("assumptions", r.assumptions, [
      ["key", (a) => a.key],
      ["label", (a) => a.label],
      ["shown", (a) => shownText(a, unitSystem(r.units))],
      ["kind", (a) => a.kind],
      ["value", (a) => (Array.isArray(a.value) ? a.value.join("; ") : a.value)],
      ["unit", (a) => a.unit],
      ["at_temp_c", (a) => a.atTempC ?? null],
      ["origin", (a) => a.origin],
    ]),
  ];
}

/** results.json text: fixed key order (as built), numbers with at most 6 decimals, no wall-clock time. */
export function resultsJson(r: Results): string {
  return `${JSON.stringify(
    r,
    (_k, v) =>
      typeof v === "number" && !Number.isInteger(v) && Number.isFinite(v) ? Number(formatMachine(v)) : v,
    2,
  )}\n`;
}
