/**
 * The CSV tables written beside `results.json` (product brief §6: one CSV per table, named after the
 * table). Units are fixed like the JSON: °C, kPa gauge, kg, %; column names carry their unit.
 * Empty cells mean "no value" (a month without preflights). RFC 4180 quoting.
 */
import type { Results } from "./results.js";

export type Cell = string | number | boolean | null;
export interface Table {
  name: string;
  columns: string[];
  rows: Cell[][];
}

/** Numbers are written with at most 6 decimals (stable text for byte-identical files). */
export function formatNumber(x: number): string {
  if (Number.isInteger(x)) return String(x);
  const r = Number(x.toFixed(6));
  return String(Object.is(r, -0) ? 0 : r);
}

function cell(c: Cell): string {
  if (c === null) return "";
  if (typeof c === "number") return Number.isFinite(c) ? formatNumber(c) : "";
  if (typeof c === "boolean") return c ? "yes" : "no";
  return /[",\r\n]/.test(c) || c !== c.trim() ? `"${c.replace(/"/g, '""')}"` : c;
}

export function toCsv(t: Table): string {
  return `${[t.columns, ...t.rows].map((r) => r.map(cell).join(",")).join("\r\n")}\r\n`;
}

/** Every table of the results, in a fixed order. */
export function resultTables(r: Results): Table[] {
  const tables: Table[] = [];
  tables.push({
    name: "bases",
    columns: [
      "base",
      "stations",
      "time_zone",
      "years_used",
      "years_skipped",
      "coldest_morning_c",
      "coldest_1in10_c",
      "nitrogen_kg_p50",
      "nitrogen_kg_p90",
      "nitrogen_kg_p95",
      "cylinders_p50",
      "cylinders_p90",
      "cylinders_p95",
      "carts_p95",
      "nitrogen_kg_added_p50",
      "nitrogen_kg_vented_p50",
      "servicing_events_p50",
      "carts_p50",
      "carts_p90",
    ],
    rows: r.bases.map((b) => [
      b.name,
      b.stations.map((s) => s.id).join(" "),
      b.timeZone,
      b.yearsUsed.join(" "),
      b.yearsSkipped.map((y) => y.year).join(" "),
      b.coldestMorningC,
      b.coldest1in10C,
      b.nitrogen.kgP50,
      b.nitrogen.kgP90,
      b.nitrogen.kgP95,
      b.nitrogen.cylindersP50,
      b.nitrogen.cylindersP90,
      b.nitrogen.cylindersP95,
      b.nitrogen.cartsP95,
      b.nitrogen.kgAddedP50 ?? null,
      b.nitrogen.kgVentedP50 ?? null,
      b.nitrogen.servicingEventsP50 ?? null,
      b.nitrogen.cartsP50 ?? null,
      b.nitrogen.cartsP90 ?? null,
    ]),
  });
  tables.push({
    name: "months",
    columns: [
      "base",
      "month",
      "preflights",
      "below_band_pct",
      "above_band_pct",
      "starts",
      "short_pct_one",
      "short_pct_two",
      "energy_margin_one_p10_pct",
      "energy_margin_one_p50_pct",
      "energy_margin_two_p10_pct",
      "energy_margin_two_p50_pct",
      "morning_kpa_gauge_p10",
      "morning_kpa_gauge_p50",
      "morning_kpa_gauge_p90",
      "morning_reading_pct_p10",
      "morning_reading_pct_p50",
      "morning_reading_pct_p90",
      "overnight_drop_temp_mean_c",
      "overnight_drop_temp_p90_c",
      "overnight_drop_kpa_mean",
      "overnight_drop_kpa_p90",
      "overnight_drop_reading_mean_pct",
      "overnight_drop_reading_p90_pct",
      "daily_range_mean_c",
      "daily_range_p90_c",
    ],
    rows: r.bases.flatMap((b) =>
      b.months.map((m) => [
        b.name,
        m.month,
        m.preflights,
        m.belowBandPct,
        m.aboveBandPct,
        m.starts,
        m.shortPctOne,
        m.shortPctTwo,
        m.energyMarginOneP10Pct,
        m.energyMarginOneP50Pct,
        m.energyMarginTwoP10Pct,
        m.energyMarginTwoP50Pct,
        m.morningKPaGaugeP10,
        m.morningKPaGaugeP50,
        m.morningKPaGaugeP90,
        m.morningReadingPctP10,
        m.morningReadingPctP50,
        m.morningReadingPctP90,
        m.overnightDropTempMeanC,
        m.overnightDropTempP90C,
        m.overnightDropKPaMean,
        m.overnightDropKPaP90,
        m.overnightDropReadingMeanPct,
        m.overnightDropReadingP90Pct,
        m.dailyRangeMeanC,
        m.dailyRangeP90C,
      ]),
    ),
  });
  tables.push({
    name: "advice",
    columns: ["base", "month", "fit_cold_start_option", "short_pct_one", "short_pct_two", "improvement_pct"],
    rows: r.bases.flatMap((b) =>
      b.advice.map((a) => [
        b.name,
        a.month,
        a.fitColdStartOption,
        a.shortPctOne,
        a.shortPctTwo,
        a.improvementPct,
      ]),
    ),
  });
  tables.push({
    name: "out_of_band_by_hour",
    columns: ["base", "local_hour", "hourly_readings", "out_of_band_pct"],
    rows: r.bases.flatMap((b) =>
      b.outOfBandByHour.map((h) => [b.name, h.hour, h.preflights, h.outOfBandPct]),
    ),
  });
  tables.push({
    name: "coldest_mornings",
    columns: ["base", "year", "coldest_preflight_ambient_c"],
    rows: r.bases.flatMap((b) => b.coldestMorningByYear.map((c) => [b.name, c.year, c.tempC])),
  });
  tables.push({
    name: "climate_months",
    columns: ["base", "month", "min_c", "mean_c", "max_c", "mean_daily_range_c", "p90_daily_range_c"],
    rows: r.bases.flatMap((b) =>
      b.climateMonths.map((m) => [
        b.name,
        m.month,
        m.minC,
        m.meanC,
        m.maxC,
        m.meanDailyRangeC,
        m.p90DailyRangeC,
      ]),
    ),
  });
  tables.push({
    name: "daily_range_histogram",
    columns: ["base", "range_low_c", "range_high_c", "days"],
    rows: r.bases.flatMap((b) => b.dailyRangeHistogram.map((h) => [b.name, h.lowC, h.highC, h.days])),
  });
  tables.push({
    name: "nitrogen_stays",
    columns: [
      "base",
      "aircraft",
      "arrive",
      "depart",
      "profile",
      "cold_start_option",
      "servicing_events_p50",
      "precharge_checks_p50",
      "hand_pump_strokes_p50",
      "kg_added_p50",
      "kg_vented_p50",
      "kg_p50",
      "kg_p90",
      "kg_p95",
    ],
    rows: r.bases.flatMap((b) =>
      b.nitrogen.stays.map((s) => [
        b.name,
        s.aircraft,
        s.arrive,
        s.depart,
        s.profile,
        s.coldStartOption,
        s.servicingEventsP50,
        s.prechargeChecksP50,
        s.handPumpStrokesP50,
        s.kgAddedP50,
        s.kgVentedP50,
        s.kgP50,
        s.kgP90,
        s.kgP95,
      ]),
    ),
  });
  tables.push({
    name: "traces",
    columns: [
      "base",
      "trace",
      "year",
      "hour",
      "local_time",
      "ambient_c",
      "accumulator_c",
      "gas_kpa_gauge",
      "reading_pct",
      "band_low_pct",
      "band_high_pct",
    ],
    rows: r.bases.flatMap((b) =>
      (["typical", "worst"] as const).flatMap((k) => {
        const t = b.traces[k];
        if (t === null) return [];
        return t.points.map((p) => [
          b.name,
          k,
          t.year,
          p.hour,
          p.localTime,
          p.ambientC,
          p.accumulatorC,
          p.gasKPaGauge,
          p.readingPct,
          p.bandLowPct,
          p.bandHighPct,
        ]);
      }),
    ),
  });
  tables.push({
    name: "stations",
    columns: [
      "base",
      "station",
      "name",
      "lat",
      "lon",
      "elevation_m",
      "time_zone",
      "first_utc",
      "last_utc",
      "hours",
      "filled_hours",
      "completeness",
      "qc_read",
      "qc_kept",
      "qc_malformed",
      "qc_summary",
      "qc_other_site",
      "qc_missing",
      "qc_range",
      "qc_erroneous",
      "qc_suspect",
      "qc_duplicate",
    ],
    rows: r.bases.flatMap((b) =>
      b.stations.map((s) => [
        b.name,
        s.id,
        s.name,
        s.lat,
        s.lon,
        s.elevationM,
        s.timeZone,
        s.firstUtc,
        s.lastUtc,
        s.hours,
        s.filledHours,
        s.completeness,
        s.qc.read,
        s.qc.kept,
        s.qc.dropped.malformed,
        s.qc.dropped.summary,
        s.qc.dropped.otherSite,
        s.qc.dropped.missing,
        s.qc.dropped.range,
        s.qc.dropped.erroneous,
        s.qc.dropped.suspect,
        s.qc.dropped.duplicate,
      ]),
    ),
  });
  tables.push({
    name: "precharge_line",
    columns: [
      "profile",
      "temp_c",
      "precharge_kpa_gauge",
      "precharge_low_kpa_gauge",
      "precharge_high_kpa_gauge",
      "ideal_precharge_kpa_gauge",
    ],
    rows: r.profiles.flatMap((p) =>
      p.prechargeLine.map((x) => [
        p.name,
        x.tempC,
        x.prechargeKPaGauge,
        x.prechargeLowKPaGauge,
        x.prechargeHighKPaGauge,
        x.idealPrechargeKPaGauge,
      ]),
    ),
  });
  tables.push({
    name: "band",
    columns: [
      "profile",
      "temp_c",
      "reading_low_pct",
      "reading_nominal_pct",
      "reading_high_pct",
      "ideal_reading_nominal_pct",
    ],
    rows: r.profiles.flatMap((p) =>
      p.band.map((x) => [
        p.name,
        x.tempC,
        x.readingLowPct,
        x.readingNominalPct,
        x.readingHighPct,
        x.idealReadingNominalPct,
      ]),
    ),
  });
  tables.push({
    name: "stays",
    columns: ["aircraft", "base", "arrive", "depart", "profile", "cold_start_option"],
    rows: r.stays.map((s) => [s.aircraft, s.base, s.arrive, s.depart, s.profile, s.coldStartOption]),
  });
  tables.push({
    name: "assumptions",
    columns: ["key", "label", "value", "unit", "origin"],
    rows: r.assumptions.map((a) => [a.key, a.label, a.value, a.unit, a.origin]),
  });
  return tables;
}

/** results.json text: fixed key order (as built), numbers with at most 6 decimals, no wall-clock time. */
export function resultsJson(r: Results): string {
  return `${JSON.stringify(
    r,
    (_k, v) =>
      typeof v === "number" && !Number.isInteger(v) && Number.isFinite(v) ? Number(formatNumber(v)) : v,
    2,
  )}\n`;
}
