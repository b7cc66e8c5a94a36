/**
 * The `results.json` contract (README, Outputs). Everything the report shows comes from here;
 * the report never calls the climate or physics code. Units are fixed whatever the plan says:
 * °C, kPa gauge (`…KPaGauge`), L, kg, J; percentages 0–100; `null` where a month has no preflights.
 * No wall-clock time is stored, so two runs on the same inputs give byte-identical files.
 */
import type { DesignTemperatures } from "../climate/designTemps.js";
import type { QuantityData, Units } from "../units/index.js";

export type { Units };

/** Quality-control counts for one station (docs/methods.md §4). read = kept + Σ dropped. */
export interface QcCounts {
  read: number;
  kept: number;
  dropped: {
    malformed: number;
    summary: number;
    otherSite: number;
    missing: number;
    range: number;
    erroneous: number;
    suspect: number;
    duplicate: number;
  };
}

export interface StationResult {
  id: string; // "USAF-WBAN"
  name: string | null;
  lat: number;
  lon: number;
  elevationM: number;
  timeZone: string;
  firstUtc: string;
  lastUtc: string;
  hours: number;
  filledHours: number;
  completeness: number; // 0–1
  qc: QcCounts;
}

/**
 * One plan parameter as data (the report's assumptions table and assumptions.csv show it):
 * - `key`: its YAML path with names for list items, e.g. "profiles.main.precharge.reference";
 * - `kind`: the quantity kind ("pressureGauge", "pressureAbsolute", "pressureDifference",
 *   "pressureRate", "temperature", "temperatureDifference", "volume", "energy", "duration", "flow", "expansion", "percent",
 *   "fraction", "number", "count", "year", "localTime", "weekday", "text");
 * - `value` in the fixed units of results.json whatever the plan's units, named by `unit`: kPa gauge,
 *   kPa absolute, kPa (a difference), kPa/month (mean Gregorian month), °C, K (a temperature
 *   difference), L, J, s, L/s, 1/K, %;
 *   plain numbers as they are (`unit` "" or what a count counts: "h", "d"); texts, "HH:MM" local
 *   times and lists of them as strings;
 * - `atTempC`: for a pressure stated at a temperature ("1450 psig @ 70 F"), that temperature in °C;
 * - `text`: exactly as written in the plan file (a list's items joined by ", "), or null for a default.
 */
export interface Assumption extends QuantityData {
  key: string;
  label: string;
  origin: "plan file" | "default" | "demo assumption";
}

export interface MethodNote {
  name: string;
  source: string;
  description: string;
}

/** Precharge line and its tolerance lines against temperature, for one profile. */
export interface PrechargeRow {
  tempC: number;
  prechargeKPaGauge: number;
  prechargeLowKPaGauge: number;
  prechargeHighKPaGauge: number;
  idealPrechargeKPaGauge: number;
}

/** Fill-reading band at system pressure against temperature (n units in parallel read alike). */
export interface BandRow {
  tempC: number;
  readingLowPct: number;
  readingNominalPct: number;
  readingHighPct: number;
  idealReadingNominalPct: number;
}

/** The gas amount of an energy case: on the low tolerance line, the reference, or the high line. */
export type PrechargeLine = "low" | "nominal" | "high";
/** The system pressure an energy case is charged to. */
export type SystemLine = "low" | "nominal";
/** Why a break-even temperature is null: no crossing of the requirement lies in the range. */
export type BreakEvenReason = "short everywhere" | "never short";

/**
 * A break-even temperature (docs/methods.md, "Break-even temperatures"): the ambient below which one
 * energy case falls short of the profile's requirement, found by root finding on the real-gas model
 * over the range of `energyRangeC`; null with the reason where no crossing lies in the range.
 */
export interface BreakEvenRow {
  /** One accumulator, or the cold-start option ("two": its count of units on its timer). */
  units: 1 | 2;
  /** Units in parallel: 1, or the option's count. */
  count: number;
  precharge: PrechargeLine;
  system: SystemLine;
  ambientC: number | null;
  reason: BreakEvenReason | null;
}

/** An after-drop break-even of a base: charged at the afternoon temperature, trapped, cooled by the drop. */
export interface DesignPointRow extends BreakEvenRow {
  profile: string;
  /** The base's typical (median) or P90 overnight drop of the accumulator temperature. */
  drop: "typical" | "p90";
  dropC: number;
}

export interface ProfileResult {
  name: string;
  /**
   * The atmospheric pressure the curves' gauge pressures are relative to, kPa absolute: 101.325 (the
   * standard sea-level atmosphere) for `Results.profiles`, the base's own for `BaseResult.profileCurves`.
   */
  atmosphereKPaAbsolute: number;
  prechargeLine: PrechargeRow[];
  band: BandRow[];
  /** Temperature range the break-even temperatures are sought in, °C. */
  energyRangeC: { fromC: number; toC: number };
  /** Break-even temperatures at equilibrium: units × precharge line × system pressure. */
  breakEven: BreakEvenRow[];
}

/** The atmospheric pressure used at a base (docs/methods.md §1): gauge = absolute − this pressure. */
export interface AtmosphereResult {
  pressureKPaAbsolute: number;
  /**
   * "station pressure": the mean station pressure reported in the primary station's records (ISD
   * MA1); "standard atmosphere": ISO 2533 at the primary station's elevation.
   */
  source: "station pressure" | "standard atmosphere";
  /** The primary station ("USAF-WBAN") and its elevation, m. */
  station: string;
  elevationM: number;
}

/**
 * A share's spread across climate years and its 90 % interval (docs/methods.md §6): `…YearMin`,
 * `…YearMedian`, `…YearMax` of the share within each climate year (years with something to count), and
 * `…Lo90`, `…Hi90`, the 5 % and 95 % type-7 quantiles of the pooled share over a seeded bootstrap of
 * climate years. Null where nothing is counted.
 */
export type Confidence<Name extends string> = {
  [K in `${Name}${"Lo90" | "Hi90" | "YearMin" | "YearMedian" | "YearMax"}`]: number | null;
};

/** The confidence of every base-month share that drives a status. */
export type MonthConfidence = Confidence<
  "shortPctOne" | "shortPctTwo" | "belowBandPct" | "aboveBandPct" | "outOfBandPct"
>;

/**
 * Status of a base and local month (docs/methods.md §6): "act" (an aircraft present without the option
 * short of energy above `thresholds.shortPct` with one accumulator, or one with the option still above
 * it with two), "watch" (out-of-band first preflights above `thresholds.outOfBandPct`), "ok",
 * "no-stay" (no aircraft there), "no-data" (aircraft there, but no usable climate year covers a stay).
 */
export type StatusName = "act" | "watch" | "ok" | "no-stay" | "no-data";

/** The status of a base-month and what set it. */
export interface MonthDecision {
  status: StatusName;
  /** Usable climate years behind the status: the fewest among the stays present with data (0 when none). */
  statusYears: number;
  /** Fewer usable years than `climate.minYears`. */
  lowConfidence: boolean;
  /** Some stays present have data and some have none: the status comes from those with data. */
  partNoData: boolean;
  /** Aircraft whose own short share set "act" (without the option: with one; with it: with two). */
  statusAircraft: string[];
  /** The figure that set the status, %: the largest such short share ("act"), the out-of-band share ("watch"); else null. */
  statusPct: number | null;
  statusPctLo90: number | null;
  statusPctHi90: number | null;
}

export interface MonthRow extends MonthConfidence, MonthDecision {
  month: number; // 1–12, local
  preflights: number;
  belowBandPct: number | null;
  aboveBandPct: number | null;
  /** belowBandPct + aboveBandPct: the share the watch status compares with its threshold. */
  outOfBandPct: number | null;
  shortPctOne: number | null;
  shortPctTwo: number | null;
  morningKPaGaugeP10: number | null;
  morningKPaGaugeP50: number | null;
  morningKPaGaugeP90: number | null;
  morningReadingPctP10: number | null;
  morningReadingPctP50: number | null;
  morningReadingPctP90: number | null;
  overnightDropTempMeanC: number | null;
  overnightDropTempP90C: number | null;
  overnightDropKPaMean: number | null;
  overnightDropKPaP90: number | null;
  overnightDropReadingMeanPct: number | null;
  overnightDropReadingP90Pct: number | null;
  dailyRangeMeanC: number | null;
  dailyRangeP90C: number | null;
  /** Starts counted (every start time of flown days, with an ambient value). */
  starts: number;
  /** Start-energy margin (delivered − required)/required in %, one unit and the option's count. */
  energyMarginOneP10Pct: number | null;
  energyMarginOneP50Pct: number | null;
  energyMarginTwoP10Pct: number | null;
  energyMarginTwoP50Pct: number | null;
  /** Local hours of day with the highest out-of-band share of the hourly what-if readings in the month (up to 3, worst first). */
  outOfBandWorstHours: number[];
}

/** A month's statistics before the confidence and the status are added (`monthStats.ts`). */
export type MonthStatistics = Omit<MonthRow, keyof MonthConfidence | keyof MonthDecision>;
/**
 * The trapped charge of a base by local month (docs/methods.md §3, "Thermal relief"), pooled over the
 * stays there and the climate years, for the configuration each stay has fitted.
 */
export interface TrappedMonthRow {
  month: number; // 1–12, local
  /** Highest trapped fluid pressure, kPa gauge; null without a trapped hour in the month. */
  peakTrappedKPaGauge: number | null;
  /** Openings of the thermal relief valve (a run of steps letting fluid out counts once). */
  reliefEvents: number;
  /** reliefEvents ÷ climate years used: openings in the month in a year, all stays at the base. */
  reliefEventsPerYear: number;
  /** Fluid relieved, L (measured at the relief pressure and the temperature of each step). */
  relievedL: number;
  /** relievedL ÷ climate years used. */
  relievedLPerYear: number;
}

export interface ClimateMonthRow {
  month: number;
  minC: number | null;
  meanC: number | null;
  maxC: number | null;
  meanDailyRangeC: number | null;
  p90DailyRangeC: number | null;
}

/**
 * Out-of-band share by local hour of day: a what-if reading of the trapped charge at every grid hour
 * of the stays (what a preflight at that hour would show), against the band at the ambient
 * temperature. `preflights` counts those hourly readings.
 */
export interface HourRow {
  hour: number; // local hour of day 0–23
  preflights: number;
  outOfBandPct: number | null;
}

export interface AdviceRow {
  month: number;
  /** An aircraft present lacks the option and its own short share with one is above the threshold. */
  fitColdStartOption: boolean;
  /** Pooled over the aircraft present with data. */
  shortPctOne: number | null;
  shortPctTwo: number | null;
  /** shortPctOne − shortPctTwo: what a second accumulator buys, in percentage points. */
  improvementPct: number | null;
  /** The aircraft present without the option whose own short share with one is above the threshold (those to fit). */
  aircraft: string[];
}

/** One hour of an overnight trace (36 hours from the last recharge of an evening). */
export interface TracePoint {
  hour: number; // hours since trace start
  localTime: string; // ISO local time with offset
  ambientC: number;
  accumulatorC: number;
  gasKPaGauge: number;
  readingPct: number;
  bandLowPct: number;
  bandHighPct: number;
}

export interface Trace {
  label: string; // e.g. "typical (median overnight drop)"
  year: number;
  startLocal: string;
  points: TracePoint[];
}

/**
 * Mean nitrogen flows over the samples (climate years × draws of the seeded events), kg. One
 * vocabulary everywhere (report, CSV, JSON; docs/methods.md §7):
 * drawn from cylinders = added to accumulators + vented from hoses at disconnect + given to other uses,
 * and added = added by servicing + added by unscheduled full recharges. Gas released from accumulators
 * (let out to lower a precharge, or lost from a gas side emptied by unscheduled work) never came from
 * the cylinders in that event and is shown apart. Means add up; quantiles do not.
 */
export interface NitrogenFlows {
  drawn: number;
  added: number;
  addedServicing: number;
  addedUnscheduled: number;
  hoseVented: number;
  otherUse: number;
  released: number;
}

export interface NitrogenStay {
  aircraft: string;
  arrive: string; // YYYY-MM-DD
  depart: string;
  profile: string;
  coldStartOption: boolean;
  servicingEventsP50: number;
  /** Gas added to the accumulators (servicing and unscheduled recharges), kg. */
  kgAddedP50: number;
  /** Gas vented from the hose at each disconnect, kg. */
  kgHoseVentedP50: number;
  /** Gas released from the accumulators (lowered precharges, gas sides emptied), kg; not from cylinders. */
  kgReleasedP50: number;
  /** Gas drawn from the cylinders for this stay, kg. */
  kgP50: number;
  kgP90: number;
  kgP95: number;
  prechargeChecksP50: number;
  handPumpStrokesP50: number;
  /** Unscheduled full recharges, mean count over the samples. */
  unscheduledRechargesMean: number;
  meanKg: NitrogenFlows;
}

/**
 * Full, residual and usable gas of one cylinder of the plan at a site temperature of the base
 * (docs/methods.md §7): spent below the lowest precharge target at that temperature plus the
 * transfer differential. Pressures gauge at the base's atmosphere.
 */
export interface CylinderGasRow {
  /** Which temperature: the cylinder's fill temperature, or the base's mean or coldest site temperature. */
  at: "fill" | "mean" | "coldest";
  tempC: number;
  fullKPaGauge: number;
  residualKPaGauge: number;
  fullKg: number;
  residualKg: number;
  usableKg: number;
  usablePct: number;
}

/** The stock of full cylinders shipped to a base (plan `nitrogen.stock`) and whether it lasts. */
export interface NitrogenStock {
  /** Full cylinders shipped at the start; null where the plan states no stock for the base. */
  cylinders: number | null;
  /** Interval at which the stock is topped back up to `cylinders`, days; null: never. */
  resupplyEveryDays: number | null;
  /** Usable gas of the stock at the base's mean site temperature, kg; null without a stock. */
  usableKgAtMean: number | null;
  /**
   * First date on which the P90 demand since the last top-up exceeds the stock's usable gas at the
   * day's site temperature; null when the stock lasts or there is none.
   */
  stockOutP90: string | null;
}

/** One real day of a base's deployment: demand quantiles over the samples and the stock line. */
export interface NitrogenDay {
  date: string; // YYYY-MM-DD, real date
  /** The day's mean outdoor temperature, averaged over the climate years, °C. */
  siteTempC: number;
  /** Gas drawn from the cylinders since the first arrival, up to the end of the day, kg. */
  drawnKgP50: number;
  drawnKgP90: number;
  /** Gas drawn since the last top-up of the stock (the first arrival without resupply), kg. */
  sinceResupplyKgP50: number;
  sinceResupplyKgP90: number;
  /** Usable gas of the stock at the day's site temperature, kg; null without a stock. */
  stockUsableKg: number | null;
}

/** The base's gas drawn in one sample: the climate year it is labelled by and the draw of the seeded events. */
export interface NitrogenSample {
  climateYear: number;
  draw: number;
  kg: number;
}

/** What to ship: the gas drawn from the cylinders, the cylinders and the carts at P50/P90/P95. */
export interface NitrogenToShip {
  /** Gas drawn from the cylinders, kg. */
  kgP50: number;
  kgP90: number;
  kgP95: number;
  /** The same as normal m³ (0 °C, 101.325 kPa). */
  normalM3P50: number;
  normalM3P90: number;
  normalM3P95: number;
  cylindersP50: number;
  cylindersP90: number;
  cylindersP95: number;
  /** ceil(cylinders / cylindersPerCart) at each quantile (the fleet: sums of the bases' counts). */
  cartsP50: number;
  cartsP90: number;
  cartsP95: number;
  meanKg: NitrogenFlows;
  /** Unscheduled full recharges, mean count over the samples. */
  unscheduledRechargesMean: number;
}

/**
 * Nitrogen of one base: every quantile is taken over the samples (climate years × draws of the seeded
 * events) of the base's total (the stays at the base summed within each sample, cylinders from one
 * shared cascade), not summed quantiles.
 */
export interface NitrogenBase extends NitrogenToShip {
  /** Gas added to the accumulators (servicing and unscheduled recharges), kg. */
  kgAddedP50: number;
  /** Gas vented from the hose at each disconnect, kg. */
  kgHoseVentedP50: number;
  /** Gas released from the accumulators (not from the cylinders), kg. */
  kgReleasedP50: number;
  servicingEventsP50: number;
  /** Quantiles of the count of unscheduled full recharges over the samples. */
  unscheduledRechargesP50: number;
  unscheduledRechargesP90: number;
  unscheduledRechargesP95: number;
  /** Draws of the seeded events per climate year (1 without unscheduled recharges). */
  draws: number;
  /** The real year that maps onto each sample's climate year (the earliest arrival year at the base). */
  referenceYear: number | null;
  samples: NitrogenSample[];
  usableGas: CylinderGasRow[];
  stock: NitrogenStock;
  timeline: NitrogenDay[];
  stays: NitrogenStay[];
}

/**
 * The fleet's nitrogen (docs/methods.md §7): demand quantiles are quantiles of the fleet sum per
 * climate year and draw (all bases on one real-time mapping onto the climate years), never sums of the
 * bases' quantiles; cylinders and carts are the sums of the bases' own counts (stock cannot move between
 * bases); mean flows are the sums of the bases' means.
 */
export interface NitrogenFleet extends NitrogenToShip {
  /** Bases with stays and usable climate years, summed here. */
  bases: string[];
  /** Climate years onto which the fleet's earliest arrival year maps, usable at every base summed. */
  climateYears: number[];
  draws: number;
}

/**
 * The 1-in-10 and 1-in-30-year coldest mornings of a place (Gumbel fit of each year's coldest morning,
 * docs/methods.md §6), °C, each with its 90 % bootstrap interval.
 */
export interface ColdestReturnLevels {
  coldest1in10C: number | null;
  coldest1in10CLo90: number | null;
  coldest1in10CHi90: number | null;
  coldest1in30C: number | null;
  coldest1in30CLo90: number | null;
  coldest1in30CHi90: number | null;
}

/**
 * Start energy against the morning's temperature for one profile at a base (docs/methods.md,
 * "Break-even temperatures"), J: one unit and the option's count at the low, nominal and high
 * precharge lines at equilibrium, and the nominal line after the base's typical and P90 overnight
 * drops (null without drops), all charged to the nominal system pressure; and the requirement.
 */
export interface EnergyCurveRow {
  tempC: number;
  requiredJ: number;
  oneLowJ: number;
  oneNominalJ: number;
  oneHighJ: number;
  twoLowJ: number;
  twoNominalJ: number;
  twoHighJ: number;
  oneTypicalDropJ: number | null;
  oneP90DropJ: number | null;
  twoTypicalDropJ: number | null;
  twoP90DropJ: number | null;
}

/** The start-energy margin at the cold design point, low-side precharge, nominal system pressure. */
export interface DesignMargin {
  units: 1 | 2;
  count: number;
  /** At equilibrium ("none") or after the base's typical or P90 overnight drop. */
  drop: "none" | "typical" | "p90";
  energyJ: number;
  /** (delivered − required)/required, %. */
  marginPct: number;
}

/** The pump's recharge after one start from the nominal charge at the cold design point. */
export interface DesignRecharge {
  units: 1 | 2;
  count: number;
  timeS: number;
  timerS: number;
  /** The system pressure is reached within the timer. */
  reachedSystem: boolean;
}

/**
 * The design point of one profile at a base (docs/methods.md, "Design point"): the cold design point
 * is the base's 1-in-10-year coldest morning; the worksheet's figures are null without one. Gauge
 * pressures relative to the base's atmosphere; volumes per unit.
 */
export interface DesignWorksheet {
  profile: string;
  designTempC: number | null;
  /** The base's typical (median) and P90 overnight drop of the accumulator temperature, °C; null without drops. */
  dropTypicalC: number | null;
  dropP90C: number | null;
  /** The precharge lines at the design temperature (gas at V0). */
  prechargeKPaGauge: number | null;
  prechargeLowKPaGauge: number | null;
  prechargeHighKPaGauge: number | null;
  /** Nominal precharge over nominal system pressure, both absolute, at the design temperature. */
  prechargeRatio: number | null;
  gasVolumeEmptyL: number;
  gasVolumeFullL: number;
  /** Gas volume charged to nominal system pressure at the design temperature (nominal amount). */
  gasVolumeChargedL: number | null;
  /** Gas volume at the end of a start from that charge. */
  gasVolumeEndL: number | null;
  /** The fill reading of that charge, %. */
  readingPct: number | null;
  requiredJ: number | null;
  margins: DesignMargin[];
  /** Highest trapped pressure at the base over the months, against the system's high limit and the relief pressure. */
  peakTrappedKPaGauge: number | null;
  systemHighKPaGauge: number;
  reliefKPaGauge: number | null;
  recharge: DesignRecharge[];
  curve: EnergyCurveRow[];
}

/** The coldest hour of each year of a base's series, its mean, and its 1-in-10 and 1-in-30-year values. */
export interface ColdestHourResult {
  meanC: number | null;
  oneIn10C: number | null;
  oneIn10CLo90: number | null;
  oneIn10CHi90: number | null;
  oneIn30C: number | null;
  oneIn30CLo90: number | null;
  oneIn30CHi90: number | null;
  byYear: { year: number; tempC: number }[];
}

/**
 * Climate design temperatures of a base (docs/methods.md, "Climate design temperatures"), from its
 * hourly series over `climate.years`: the climate module's figures, the coldest hour's return levels with
 * their bootstrap intervals, and the mean of the coldest mornings (`coldestMorningByYear`).
 */
export interface DesignTemperaturesResult extends Omit<DesignTemperatures, "coldestHour"> {
  coldestHour: ColdestHourResult;
  coldestMorningMeanC: number | null;
}

/** Shares of a base's worst month in one what-if run. */
export interface WhatIfShares {
  shortPctOne: number | null;
  shortPctTwo: number | null;
  outOfBandPct: number | null;
}

/** One variant's shares and their change from the baseline, percentage points. */
export interface WhatIfVariantRow extends WhatIfShares {
  name: string;
  label: string;
  shortPctOneChange: number | null;
  shortPctTwoChange: number | null;
  outOfBandPctChange: number | null;
}

/**
 * The what-if variants at a base (docs/methods.md, "What-if variants"), for its worst month: the
 * month with the highest baseline short share with one accumulator (the first on ties); null with the
 * reason where no month has starts.
 */
export interface WhatIfBase {
  month: number | null;
  reason: string | null;
  baseline: WhatIfShares & { starts: number; preflights: number };
  variants: WhatIfVariantRow[];
}

export interface BaseResult extends ColdestReturnLevels {
  name: string;
  stations: StationResult[];
  timeZone: string;
  /** Climate years usable for at least one stay window at the base. */
  yearsUsed: number[];
  /** Candidate years usable for no stay window, with the share of hours of the best-covered window. */
  yearsSkipped: { year: number; completenessPct: number }[];
  climateMonths: ClimateMonthRow[];
  /** Distribution of daily range, pooled over years: bin edges in °C and day counts. */
  dailyRangeHistogram: { lowC: number; highC: number; days: number }[];
  months: MonthRow[];
  outOfBandByHour: HourRow[];
  coldestMorningC: number | null;
  coldestMorningByYear: { year: number; tempC: number }[];
  advice: AdviceRow[];
  traces: { typical: Trace | null; worst: Trace | null };
  nitrogen: NitrogenBase;
  /** Peak trapped pressure and thermal relief by local month. */
  trappedCharge: TrappedMonthRow[];
  /** The atmospheric pressure used at the base and its source. */
  atmosphere: AtmosphereResult;
  /** Precharge lines and reading bands of the profiles flown at the base, at the base's atmosphere. */
  profileCurves: ProfileResult[];
  /** Climate design temperatures of the base's series. */
  designTemperatures: DesignTemperaturesResult;
  /** Break-even temperatures after the base's typical and P90 overnight drops, per profile flown. */
  designPoint: DesignPointRow[];
  /** The cold design point of each profile flown at the base. */
  designWorksheets: DesignWorksheet[];
  /** What-if variants for the base's worst month; null when no variant was run. */
  whatIf: WhatIfBase | null;
}

/** One local month of a stay: its own figures, pooled over the stay's usable years, with 90 % intervals. */
export interface StayMonthRow extends Confidence<"shortPctOne" | "shortPctTwo" | "outOfBandPct"> {
  month: number; // 1–12, local
  /** The real calendar month of the schedule (YYYY-MM) the local month first falls in. */
  realMonth: string;
  preflights: number;
  starts: number;
  /** Short of energy with one accumulator and with two; with `coldStartOption` "two" is the stay's own configuration. */
  shortPctOne: number | null;
  shortPctTwo: number | null;
  /** First preflights below or above the band. */
  outOfBandPct: number | null;
}

/** A climate year a stay window was left out of: the window on that year and the share of its hours found. */
export interface StayYearSkipped {
  year: number;
  fromIso: string;
  toIso: string;
  completenessPct: number;
}

export interface StayResult {
  aircraft: string;
  base: string;
  arrive: string;
  depart: string;
  profile: string;
  coldStartOption: boolean;
  /** Climate years usable for this stay's window (docs/methods.md §4). */
  yearsUsed: number[];
  yearsSkipped: StayYearSkipped[];
  /** When no year covers the stay: the months it lacks and the ISD files that would hold them; else null. */
  noData: { months: number[]; files: string[] } | null;
  months: StayMonthRow[];
}

/**
 * What the plan suggests for one aircraft on one stay (docs/methods.md §6), judged on the stay's own
 * short share per month: "fit" (no option, some month above the threshold with one accumulator),
 * "fitted-needed", "fitted-not-needed", "fitted-still-short" (above the threshold even with the
 * option), "keep" (no option, none needed), "no-data". A planning estimate, never an instruction.
 */
export type ActionName =
  | "fit"
  | "fitted-needed"
  | "fitted-not-needed"
  | "fitted-still-short"
  | "keep"
  | "no-data";

export interface AircraftAction {
  aircraft: string;
  base: string;
  arrive: string;
  depart: string;
  coldStartOption: boolean;
  action: ActionName;
  /** First day of the first month above the threshold with one accumulator (not before arrival). */
  neededFrom: string | null;
  /** First day of the month after the last month above it, when that is before departure. */
  notNeededFrom: string | null;
  /** Some month stays above the threshold with two accumulators. */
  stillShortWithOption: boolean;
  /** Local months above the threshold with one accumulator, in the stay's order. */
  monthsAbove: number[];
  /** The month the figures below come from: the stay's worst with one accumulator. */
  worstMonth: number | null;
  shortPctOne: number | null;
  shortPctOneLo90: number | null;
  shortPctOneHi90: number | null;
  shortPctTwo: number | null;
  shortPctTwoLo90: number | null;
  shortPctTwoHi90: number | null;
  /** Usable climate years of the stay, and whether they are fewer than `climate.minYears`. */
  years: number;
  lowConfidence: boolean;
  text: string;
}

export interface Results {
  plan: string;
  generatedBy: string; // "coldsoak <version>"
  units: Units;
  seed: number;
  climateYears: number[];
  quantileMethod: string;
  /** The plan's thresholds: `thresholds.shortStartsPct`, `thresholds.outOfBandPct` and `climate.minYears`. */
  thresholds: { shortPct: number; outOfBandPct: number; minYears: number };
  profiles: ProfileResult[];
  bases: BaseResult[];
  nitrogenFleet: NitrogenFleet;
  stays: StayResult[];
  /** One per stay, in schedule order. */
  actions: AircraftAction[];
  assumptions: Assumption[];
  methods: MethodNote[];
  randomInputs: { name: string; description: string }[];
  warnings: string[];
  /** The what-if variants run (README, `--what-if`, plan `whatIf:`); null when none was. */
  whatIf: { variants: { name: string; label: string; description: string }[] } | null;
  /** Names of the files written beside the report (set by the CLI for the report's links; not in results.json). */
  files?: string[];
}
