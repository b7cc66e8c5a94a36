/**
 * Shared shapes of the climate module: options, station metadata, the hourly series and the
 * quality-control counts (docs/methods.md, "Climate data").
 */

/** Options of `loadClimate`. */
export interface ClimateOptions {
  /** Longest run of missing hours filled by linear interpolation (docs/methods.md, default 3). */
  gapHours: number;
  /** Cache folder; `null` disables the cache. Default `out/.cache/climate`. */
  cacheDir: string | null;
  /** Optional station-history CSV: USAF,WBAN,STATION NAME,CTRY,STATE,ICAO,LAT,LON,ELEV(M),BEGIN,END. */
  stationHistoryCsv?: string;
  /** Station id ("USAF-WBAN") for ISD-Lite files whose name does not carry it. */
  stationIdOverride?: string;
  /** Called after each file is read (done of total). */
  onProgress?: (done: number, total: number) => void;
  /** Stations ("USAF-WBAN") to build; the files' other stations are skipped. Default: all. */
  stations?: readonly string[];
  /** Told of what does not stop the load: a station with no kept record, a cache that cannot be written. */
  onWarning?: (message: string) => void;
  /** Also compute each station's monthly climatology (`StationClimate.months`) and keep it in the cache. */
  summarize?: boolean;
}

export const DEFAULT_GAP_HOURS = 3;
/**
 * Default cache folder: beside the plan folders of the default output root, under a name no plan can
 * take (plan names start with a letter or digit).
 */
export const DEFAULT_CACHE_DIR = "out/.cache/climate";

/** Reasons a record is not kept, in the order they are tested (docs/methods.md, "Quality control"). */
export const DROP_REASONS = [
  "malformed",
  "summary",
  "otherSite",
  "missing",
  "range",
  "erroneous",
  "suspect",
  "duplicate",
] as const;
export type DropReason = (typeof DROP_REASONS)[number];

/** Quality-control counts for one station. Invariant: read = kept + Σ dropped. */
export interface QcCounts {
  read: number;
  kept: number;
  dropped: Record<DropReason, number>;
}

export interface StationMeta {
  id: string; // "USAF-WBAN"
  name: string | null;
  lat: number; // degrees, north positive
  lon: number; // degrees, east positive
  elevationM: number;
  timeZone: string; // IANA
  callLetters: string | null;
}

/** Hourly air temperature on the UTC hour grid. */
export interface HourlySeries {
  /** First grid hour, ms since the epoch, on the hour. */
  startUtcMs: number;
  /** One value per UTC hour from start; NaN = missing. */
  tempC: Float64Array;
  /** 1 where the value was filled by linear interpolation. */
  filled: Uint8Array;
}

/** Coldest and warmest kept observation (their own values and times, not the hourly grid). */
export interface Extremes {
  minC: number;
  minUtc: string;
  maxC: number;
  maxUtc: string;
}

export interface StationClimate {
  meta: StationMeta;
  series: HourlySeries;
  qc: QcCounts;
  extremes: Extremes | null;
  /** Mean of the kept records' station pressure (ISD additional group MA1), hPa; null if none. */
  meanStationPressureHpa: number | null;
  /** "file:line: reason" for the first few malformed lines. */
  malformedExamples: string[];
  /**
   * The monthly local-time climatology of `series` (`monthlyClimate`), when it was asked for
   * (`ClimateOptions.summarize`): kept in the cache, so that a summary served from it needs no
   * local-time work.
   */
  months?: MonthClimate[];
}

/** One row of the monthly local-time climatology (months with no data give nulls). */
export interface MonthClimate {
  month: number; // 1–12, local time
  minC: number | null;
  meanC: number | null;
  maxC: number | null;
  meanDailyRangeC: number | null;
  p90DailyRangeC: number | null;
}

export const HOUR_MS = 3_600_000;
