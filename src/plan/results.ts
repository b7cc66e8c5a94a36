/**
 * The `results.json` contract (README, Outputs). Everything the report shows comes from here;
 * the report never calls the climate or physics code. Units are fixed whatever the plan says:
 * °C, kPa gauge (`…KPaGauge`), L, kg, J; percentages 0–100; `null` where a month has no preflights.
 * No wall-clock time is stored, so two runs on the same inputs give byte-identical files.
 */
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
 *   "pressureRate", "temperature", "volume", "energy", "duration", "flow", "expansion", "percent",
 *   "fraction", "number", "count", "year", "localTime", "weekday", "text");
 * - `value` in the fixed units of results.json whatever the plan's units, named by `unit`: kPa gauge,
 *   kPa absolute, kPa (a difference), kPa/month (mean Gregorian month), °C, L, J, s, L/s, 1/K, %;
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

export interface ProfileResult {
  name: string;
  prechargeLine: PrechargeRow[];
  band: BandRow[];
}

export interface MonthRow {
  month: number; // 1–12, local
  preflights: number;
  belowBandPct: number | null;
  aboveBandPct: number | null;
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
  fitColdStartOption: boolean;
  shortPctOne: number | null;
  shortPctTwo: number | null;
  /** shortPctOne − shortPctTwo: what a second accumulator buys, in percentage points. */
  improvementPct: number | null;
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

export interface BaseResult {
  name: string;
  stations: StationResult[];
  timeZone: string;
  yearsUsed: number[];
  yearsSkipped: { year: number; completenessPct: number }[];
  climateMonths: ClimateMonthRow[];
  /** Distribution of daily range, pooled over years: bin edges in °C and day counts. */
  dailyRangeHistogram: { lowC: number; highC: number; days: number }[];
  months: MonthRow[];
  outOfBandByHour: HourRow[];
  coldestMorningC: number | null;
  coldestMorningByYear: { year: number; tempC: number }[];
  coldest1in10C: number | null;
  advice: AdviceRow[];
  traces: { typical: Trace | null; worst: Trace | null };
  nitrogen: NitrogenBase;
}

export interface StayResult {
  aircraft: string;
  base: string;
  arrive: string;
  depart: string;
  profile: string;
  coldStartOption: boolean;
}

export interface Results {
  plan: string;
  generatedBy: string; // "coldsoak <version>"
  units: Units;
  seed: number;
  climateYears: number[];
  quantileMethod: string;
  thresholds: { shortPct: number };
  profiles: ProfileResult[];
  bases: BaseResult[];
  nitrogenFleet: NitrogenFleet;
  stays: StayResult[];
  assumptions: Assumption[];
  methods: MethodNote[];
  randomInputs: { name: string; description: string }[];
  warnings: string[];
  /** Names of the files written beside the report (set by the CLI for the report's links; not in results.json). */
  files?: string[];
}
