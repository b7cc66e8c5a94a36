/**
 * The files written beside the report from the results alone: the `results.json` text and the CSV
 * tables, one CSV per table, named after the table. Every column is declared once, with its header and
 * how to read its value. Units are fixed like the JSON: °C, kPa gauge, kg, normal m³, %; column names
 * carry their unit. Empty cells mean "no value" (a month without preflights). The CSV text itself (RFC 4180
 * quoting, text neutralised for spreadsheets) is `csv.ts`.
 *
 * Like `report/`, this folder reads only the `Results` types of `plan/results.ts`: cli → output →
 * plan/results (types), never the engine, the climate or the physics code.
 */
import type {
  AircraftAction,
  BaseResult,
  ColdestReturnLevels,
  MonthConfidence,
  NitrogenBase,
  NitrogenFleet,
  NitrogenFlows,
  ProfileResult,
  Results,
  StationResult,
  StayResult,
} from "../plan/results.js";
import { shownText, unitSystem } from "../units/index.js";
import type { Cell, Table } from "./csv.js";
import { designTables } from "./designTables.js";
import { machineJson, machineJsonPieces } from "./json.js";

export { type Cell, type Table, toCsv } from "./csv.js";
export { machineJson } from "./json.js";

/** A column: its CSV header (unit in the name) and how to read its cell from a row's source. */
export type Column<T> = [header: string, value: (row: T) => Cell];

export function table<T>(name: string, rows: T[], columns: Column<T>[]): Table {
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

/** The confidence columns of a share (interval and spread across years), named after it in snake_case. */
function confidenceColumns<T>(
  name: "shortPctOne" | "shortPctTwo" | "belowBandPct" | "aboveBandPct" | "outOfBandPct",
  snake: string,
  get: (row: T) => Partial<MonthConfidence>,
): Column<T>[] {
  const parts = [
    ["Lo90", "lo90"],
    ["Hi90", "hi90"],
    ["YearMin", "year_min"],
    ["YearMedian", "year_median"],
    ["YearMax", "year_max"],
  ] as const;
  return parts.map(([suffix, col]) => [
    `${snake}_${col}`,
    (row: T) => get(row)[`${name}${suffix}` as keyof MonthConfidence] ?? null,
  ]);
}

/** The columns naming a stay: aircraft, base, arrive, depart. */
function stayColumns<T>(
  get: (row: T) => Pick<StayResult, "aircraft" | "base" | "arrive" | "depart">,
): Column<T>[] {
  return [
    ["aircraft", (row) => get(row).aircraft],
    ["base", (row) => get(row).base],
    ["arrive", (row) => get(row).arrive],
    ["depart", (row) => get(row).depart],
  ];
}

/** The coldest mornings of a place: the coldest, the 1-in-10 and 1-in-30-year values with their 90 % intervals. */
export function coldestColumns<T>(get: (row: T) => ColdestMornings): Column<T>[] {
  return [
    ["coldest_morning_c", (row) => get(row).coldestMorningC],
    ["coldest_1in10_c", (row) => get(row).coldest1in10C],
    ["coldest_1in10_c_lo90", (row) => get(row).coldest1in10CLo90],
    ["coldest_1in10_c_hi90", (row) => get(row).coldest1in10CHi90],
    ["coldest_1in30_c", (row) => get(row).coldest1in30C],
    ["coldest_1in30_c_lo90", (row) => get(row).coldest1in30CLo90],
    ["coldest_1in30_c_hi90", (row) => get(row).coldest1in30CHi90],
  ];
}

/** The columns of a station: identity, coverage of its record and its quality-control counts. */
export function stationColumns<T>(get: (row: T) => StationResult): Column<T>[] {
  return [
    ["station", (row) => get(row).id],
    ["name", (row) => get(row).name],
    ["lat", (row) => get(row).lat],
    ["lon", (row) => get(row).lon],
    ["elevation_m", (row) => get(row).elevationM],
    ["time_zone", (row) => get(row).timeZone],
    ["first_utc", (row) => get(row).firstUtc],
    ["last_utc", (row) => get(row).lastUtc],
    ["hours", (row) => get(row).hours],
    ["filled_hours", (row) => get(row).filledHours],
    ["completeness", (row) => get(row).completeness],
    ["qc_read", (row) => get(row).qc.read],
    ["qc_kept", (row) => get(row).qc.kept],
    ["qc_malformed", (row) => get(row).qc.dropped.malformed],
    ["qc_summary", (row) => get(row).qc.dropped.summary],
    ["qc_other_site", (row) => get(row).qc.dropped.otherSite],
    ["qc_missing", (row) => get(row).qc.dropped.missing],
    ["qc_range", (row) => get(row).qc.dropped.range],
    ["qc_erroneous", (row) => get(row).qc.dropped.erroneous],
    ["qc_suspect", (row) => get(row).qc.dropped.suspect],
    ["qc_duplicate", (row) => get(row).qc.dropped.duplicate],
  ];
}

/** The flows of the one nitrogen vocabulary, in order, as columns `<flow>_kg_mean`. */
const FLOWS: [keyof NitrogenFlows, string][] = [
  ["drawn", "drawn"],
  ["added", "added"],
  ["addedServicing", "added_servicing"],
  ["addedUnscheduled", "added_unscheduled"],
  ["hoseVented", "hose_vented"],
  ["otherUse", "other_use"],
  ["released", "released"],
];

function flowColumns<T>(flows: (row: T) => NitrogenFlows): Column<T>[] {
  return FLOWS.map(([key, name]) => [`${name}_kg_mean`, (row: T) => flows(row)[key]]);
}

/** What the coldest-morning columns read. */
type ColdestMornings = Pick<BaseResult, "coldestMorningC"> & ColdestReturnLevels;

/** One row of nitrogen_fleet.csv: a base, or the fleet (its cylinders and carts sum the bases'). */
interface FleetRow {
  scope: "base" | "fleet";
  base: string | null;
  n: NitrogenBase | NitrogenFleet;
  stock: NitrogenBase["stock"] | null;
}

function nitrogenFleetRows(r: Results): FleetRow[] {
  return [
    ...r.bases.map(
      (b): FleetRow => ({ scope: "base", base: b.name, n: b.nitrogen, stock: b.nitrogen.stock }),
    ),
    { scope: "fleet", base: null, n: r.nitrogenFleet, stock: null },
  ];
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
      ...coldestColumns((b: BaseResult) => b),
      ["nitrogen_kg_p50", (b) => b.nitrogen.kgP50],
      ["nitrogen_kg_p90", (b) => b.nitrogen.kgP90],
      ["nitrogen_kg_p95", (b) => b.nitrogen.kgP95],
      ["cylinders_p50", (b) => b.nitrogen.cylindersP50],
      ["cylinders_p90", (b) => b.nitrogen.cylindersP90],
      ["cylinders_p95", (b) => b.nitrogen.cylindersP95],
      ["carts_p95", (b) => b.nitrogen.cartsP95],
      ["nitrogen_kg_added_p50", (b) => b.nitrogen.kgAddedP50],
      ["nitrogen_kg_hose_vented_p50", (b) => b.nitrogen.kgHoseVentedP50],
      ["nitrogen_kg_released_p50", (b) => b.nitrogen.kgReleasedP50],
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
        ["out_of_band_pct", ({ x }) => x.outOfBandPct],
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>("shortPctOne", "short_pct_one", ({ x }) => x),
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>("shortPctTwo", "short_pct_two", ({ x }) => x),
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>("belowBandPct", "below_band_pct", ({ x }) => x),
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>("aboveBandPct", "above_band_pct", ({ x }) => x),
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>(
          "outOfBandPct",
          "out_of_band_pct",
          ({ x }) => x,
        ),
        ["out_of_band_worst_hours", ({ x }) => x.outOfBandWorstHours.join(" ")],
        ["status", ({ x }) => x.status],
        ["status_years", ({ x }) => x.statusYears],
        ["low_confidence", ({ x }) => x.lowConfidence],
        ["part_no_data", ({ x }) => x.partNoData],
        ["status_aircraft", ({ x }) => x.statusAircraft.join(" ")],
        ["status_pct", ({ x }) => x.statusPct],
        ["status_pct_lo90", ({ x }) => x.statusPctLo90],
        ["status_pct_hi90", ({ x }) => x.statusPctHi90],
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
        ["aircraft", ({ x }) => x.aircraft.join(" ")],
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
        ["kg_hose_vented_p50", ({ x }) => x.kgHoseVentedP50],
        ["kg_released_p50", ({ x }) => x.kgReleasedP50],
        ["kg_p50", ({ x }) => x.kgP50],
        ["kg_p90", ({ x }) => x.kgP90],
        ["kg_p95", ({ x }) => x.kgP95],
        ["unscheduled_recharges_mean", ({ x }) => x.unscheduledRechargesMean],
        ...flowColumns<{ x: BaseResult["nitrogen"]["stays"][number] }>(({ x }) => x.meanKg),
      ],
    ),
    table("nitrogen_fleet", nitrogenFleetRows(r), [
      ["scope", (x) => x.scope],
      ["base", (x) => x.base],
      ["drawn_kg_p50", (x) => x.n.kgP50],
      ["drawn_kg_p90", (x) => x.n.kgP90],
      ["drawn_kg_p95", (x) => x.n.kgP95],
      ["drawn_normal_m3_p50", (x) => x.n.normalM3P50],
      ["drawn_normal_m3_p90", (x) => x.n.normalM3P90],
      ["drawn_normal_m3_p95", (x) => x.n.normalM3P95],
      ["cylinders_p50", (x) => x.n.cylindersP50],
      ["cylinders_p90", (x) => x.n.cylindersP90],
      ["cylinders_p95", (x) => x.n.cylindersP95],
      ["carts_p50", (x) => x.n.cartsP50],
      ["carts_p90", (x) => x.n.cartsP90],
      ["carts_p95", (x) => x.n.cartsP95],
      ["unscheduled_recharges_mean", (x) => x.n.unscheduledRechargesMean],
      ...flowColumns<FleetRow>((x) => x.n.meanKg),
      ["stock_cylinders", (x) => x.stock?.cylinders ?? null],
      ["resupply_every_d", (x) => x.stock?.resupplyEveryDays ?? null],
      ["stock_usable_kg_at_mean", (x) => x.stock?.usableKgAtMean ?? null],
      ["stock_out_p90", (x) => x.stock?.stockOutP90 ?? null],
    ]),
    table(
      "nitrogen_timeline",
      perBase(r, (b) => b.nitrogen.timeline),
      [
        baseName,
        ["date", ({ x }) => x.date],
        ["site_temp_c", ({ x }) => x.siteTempC],
        ["drawn_kg_p50", ({ x }) => x.drawnKgP50],
        ["drawn_kg_p90", ({ x }) => x.drawnKgP90],
        ["since_resupply_kg_p50", ({ x }) => x.sinceResupplyKgP50],
        ["since_resupply_kg_p90", ({ x }) => x.sinceResupplyKgP90],
        ["stock_usable_kg", ({ x }) => x.stockUsableKg],
      ],
    ),
    table(
      "nitrogen_cylinder_gas",
      perBase(r, (b) => b.nitrogen.usableGas),
      [
        baseName,
        ["at", ({ x }) => x.at],
        ["temp_c", ({ x }) => x.tempC],
        ["full_kpa_gauge", ({ x }) => x.fullKPaGauge],
        ["residual_kpa_gauge", ({ x }) => x.residualKPaGauge],
        ["full_kg", ({ x }) => x.fullKg],
        ["residual_kg", ({ x }) => x.residualKg],
        ["usable_kg", ({ x }) => x.usableKg],
        ["usable_pct", ({ x }) => x.usablePct],
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
      [baseName, ...stationColumns(({ x }: { x: StationResult }) => x)],
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
      ...stayColumns((s: StayResult) => s),
      ["profile", (s) => s.profile],
      ["cold_start_option", (s) => s.coldStartOption],
      ["years_used", (s) => s.yearsUsed.join(" ")],
      ["years_skipped", (s) => s.yearsSkipped.map((y) => y.year).join(" ")],
      ["no_data_months", (s) => s.noData?.months.join(" ") ?? null],
      ["no_data_files", (s) => s.noData?.files.join(" ") ?? null],
    ]),
    table(
      "stay_months",
      r.stays.flatMap((s) => s.months.map((x) => ({ s, x }))),
      [
        ...stayColumns(({ s }: { s: StayResult }) => s),
        ["cold_start_option", ({ s }) => s.coldStartOption],
        ["month", ({ x }) => x.month],
        ["real_month", ({ x }) => x.realMonth],
        ["preflights", ({ x }) => x.preflights],
        ["starts", ({ x }) => x.starts],
        ["short_pct_one", ({ x }) => x.shortPctOne],
        ["short_pct_two", ({ x }) => x.shortPctTwo],
        ["out_of_band_pct", ({ x }) => x.outOfBandPct],
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>("shortPctOne", "short_pct_one", ({ x }) => x),
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>("shortPctTwo", "short_pct_two", ({ x }) => x),
        ...confidenceColumns<{ x: Partial<MonthConfidence> }>(
          "outOfBandPct",
          "out_of_band_pct",
          ({ x }) => x,
        ),
      ],
    ),
    table("aircraft_actions", r.actions, [
      ...stayColumns((a: AircraftAction) => a),
      ["cold_start_option", (a) => a.coldStartOption],
      ["action", (a) => a.action],
      ["needed_from", (a) => a.neededFrom],
      ["not_needed_from", (a) => a.notNeededFrom],
      ["still_short_with_option", (a) => a.stillShortWithOption],
      ["months_above", (a) => a.monthsAbove.join(" ")],
      ["worst_month", (a) => a.worstMonth],
      ["short_pct_one", (a) => a.shortPctOne],
      ["short_pct_one_lo90", (a) => a.shortPctOneLo90],
      ["short_pct_one_hi90", (a) => a.shortPctOneHi90],
      ["short_pct_two", (a) => a.shortPctTwo],
      ["short_pct_two_lo90", (a) => a.shortPctTwoLo90],
      ["short_pct_two_hi90", (a) => a.shortPctTwoHi90],
      ["years", (a) => a.years],
      ["low_confidence", (a) => a.lowConfidence],
      ["text", (a) => a.text],
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
    ...designTables(r),
  ];
}

/** results.json text: fixed key order (as built), numbers with at most 6 decimals, no wall-clock time. */
export function resultsJson(r: Results): string {
  return machineJson(r);
}

/** The results.json text in pieces (`machineJsonPieces`): what a large plan's file is written from. */
export function resultsJsonPieces(r: Results): Generator<string> {
  return machineJsonPieces(r);
}
