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

export interface ProfileResult {
  name: string;
  /**
   * The atmospheric pressure the curves' gauge pressures are relative to, kPa absolute: 101.325 (the
   * standard sea-level atmosphere) for `Results.profiles`, the base's own for `BaseResult.profileCurves`.
   */
  atmosphereKPaAbsolute: number;
  prechargeLine: PrechargeRow[];
  band: BandRow[];
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

export interface NitrogenStay {
  aircraft: string;
  arrive: string; // YYYY-MM-DD
  depart: string;
  profile: string;
  coldStartOption: boolean;
  servicingEventsP50: number;
  kgAddedP50: number;
  kgVentedP50: number;
  kgP50: number;
  kgP90: number;
  kgP95: number;
  prechargeChecksP50: number;
  handPumpStrokesP50: number;
}

/**
 * Nitrogen of one base: every quantile is taken over climate years of the base's yearly total (the
 * stays at the base summed within each year, cylinders from one shared cascade), not summed quantiles.
 */
export interface NitrogenBase {
  /** Gas drawn from the cylinders (into accumulators plus hose vents), kg. */
  kgP50: number;
  kgP90: number;
  kgP95: number;
  /** Gas that ended in the accumulators, kg. */
  kgAddedP50: number;
  /** Gas vented: hose at each disconnect plus precharges lowered, kg. */
  kgVentedP50: number;
  servicingEventsP50: number;
  cylindersP50: number;
  cylindersP90: number;
  cylindersP95: number;
  /** ceil(cylinders / cylindersPerCart) at each quantile. */
  cartsP50: number;
  cartsP90: number;
  cartsP95: number;
  stays: NitrogenStay[];
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
  /** Peak trapped pressure and thermal relief by local month. */
  trappedCharge: TrappedMonthRow[];
  /** The atmospheric pressure used at the base and its source. */
  atmosphere: AtmosphereResult;
  /** Precharge lines and reading bands of the profiles flown at the base, at the base's atmosphere. */
  profileCurves: ProfileResult[];
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
  stays: StayResult[];
  assumptions: Assumption[];
  methods: MethodNote[];
  randomInputs: { name: string; description: string }[];
  warnings: string[];
  /** Names of the files written beside the report (set by the CLI for the report's links; not in results.json). */
  files?: string[];
}
