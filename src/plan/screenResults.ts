/**
 * The `screen.json` contract (README, "Region screen"): every station of a climate archive against one
 * profile, one aircraft parked outside all year without and with the cold-start option. The page and the
 * CSV are written from it alone, and so is the merge of sharded runs. Units are fixed as in
 * `results.json`: °C, kPa absolute, %; `null` where there is nothing to count. No wall-clock time.
 */
import type { DesignTemperatures, HoursBelow, MonthDesignTemperature } from "../climate/designTemps.js";
import type { AtmosphereResult, ColdestReturnLevels, StationResult, StatusName, Units } from "./results.js";

/** A share, % (null where nothing is counted), with its 90 % interval over climate years (docs/methods.md §6). */
export type ShareWithInterval<N extends string> = { [K in N | `${N}Lo90` | `${N}Hi90`]: number | null };

/**
 * One local month of a station: `shortPctOne`, starts short of energy with one accumulator (the
 * aircraft without the option); `shortPctTwo`, with two (the aircraft with the option fitted);
 * `outOfBandPct`, first preflights out of band (below + above) without the option.
 */
export interface ScreenMonth
  extends ShareWithInterval<"shortPctOne">,
    ShareWithInterval<"shortPctTwo">,
    ShareWithInterval<"outOfBandPct"> {
  month: number; // 1–12, local
  /** First preflights and starts of the aircraft without the option, pooled over the usable years. */
  preflights: number;
  starts: number;
  /** The same with the option fitted, %. */
  outOfBandPctWithOption: number | null;
  /** Status as the planning report gives it for an aircraft without the option (docs/methods.md §6). */
  status: StatusName;
  /** Status for an aircraft with the option fitted ("act": still short with two). */
  statusWithOption: StatusName;
  /** Fewer usable years than `climate.minYears`. */
  lowConfidence: boolean;
  /** The option is needed: short with one above `thresholds.shortStartsPct`. */
  needsOption: boolean;
  /** Coldest preflight ambient of the month over the usable years and its 1-in-10-year value, °C. */
  coldestMorningC: number | null;
  coldest1in10C: number | null;
}

/** The margin of a station's 1-in-10-year coldest morning over the profile's equilibrium break-even temperature. */
export interface BreakEvenMargin {
  units: 1 | 2;
  /** Ambient at which the charged accumulator just delivers a start's energy (nominal precharge and system pressure), °C. */
  breakEvenC: number | null;
  /** The station's 1-in-10-year coldest morning minus `breakEvenC`, K; negative: colder than the break-even. */
  marginC: number | null;
  /** Why there is no value, else null. */
  reason: string | null;
}

/** Climate design temperatures of a station (`climate/designTemps.ts`), as `screen.json` holds them. */
export type { DesignTemperatures, HoursBelow, MonthDesignTemperature };

/** One station of the screen. */
export interface ScreenStation extends ColdestReturnLevels {
  station: StationResult;
  atmosphere: AtmosphereResult;
  /** Climate years usable for the whole-year stay, and those left out with the share of hours found. */
  yearsUsed: number[];
  yearsSkipped: { year: number; completenessPct: number }[];
  /** Fewer usable years than `climate.minYears` (shown as such, never dropped). */
  tooFewYears: boolean;
  /** What the record lacks when no year is usable, else null. */
  noData: { months: number[]; files: string[] } | null;
  /** Coldest preflight ambient over the usable years, °C. */
  coldestMorningC: number | null;
  /** Local months in which the option is needed, 1–12 ascending. */
  monthsNeedingOption: number[];
  /** The season of need in the calendar: fit by the first day of `fitBy`, not needed after the end of `notNeededAfter`. */
  fitBy: number | null;
  notNeededAfter: number | null;
  /** Local months still short with the option fitted. */
  monthsStillShort: number[];
  /** One and two accumulators, nominal precharge and system pressure. */
  breakEven: BreakEvenMargin[];
  /** Climate design temperatures of the station's series, with the hours below the break-even temperatures. */
  design: DesignTemperatures;
  months: ScreenMonth[];
  warnings: string[];
}

/** What a screen was run with: equal in every partial of one sharded screen. */
export interface ScreenSettings {
  format: "coldsoak screen 1";
  generatedBy: string; // "coldsoak <version>"
  plan: string;
  /** SHA-256 of the plan file's bytes: partials from another plan file are refused when merged. */
  planSha256: string;
  profile: string;
  units: Units;
  seed: number;
  thresholds: { shortPct: number; outOfBandPct: number; minYears: number };
  climate: { years: { from: number; to: number } | null; minYearShare: number; gapHours: number };
  /** The real year whose weekdays the whole-year stay follows (1 January to 1 January). */
  referenceYear: number;
}

/** screen.json: the settings and every station, sorted by id. */
export interface ScreenResults extends ScreenSettings {
  stations: ScreenStation[];
}

/** screen-part-k-of-n.json: the stations of shard k of n. */
export interface ScreenPartial extends ScreenResults {
  shard: { index: number; count: number };
}
