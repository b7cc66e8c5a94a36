/** Climate ingestion: NOAA ISD files in, cleaned hourly temperature series out (docs/methods.md, "Climate data"). */

export { buildStations, type ClimateSelection, readClimateFiles } from "./build.js";
export { cacheStats, fileHash, READER_VERSION, resetCacheStats } from "./cache.js";
export {
  type DailyRange,
  dailyRanges,
  type LocalClimatology,
  localClimatology,
  MIN_HOURS_FOR_DAILY_RANGE,
  monthlyClimate,
} from "./climatology.js";
export {
  type DesignTemperatures,
  type DesignTempOptions,
  designTemperatures,
  type HoursBelow,
  type MonthDesignTemperature,
  NO_YEAR_REASON,
} from "./designTemps.js";
export {
  emptySeries,
  filledHours,
  fillGaps,
  mergeByPriority,
  presentHours,
  tempAtUtcMs,
  valueAtHour,
  windowCompleteness,
  yearCompleteness,
} from "./hourly.js";
export { climateOptions, listClimateFiles, loadClimate, loadClimateSelection } from "./load.js";
export { hourlyOffsetsMin, localDays, timeZoneFor } from "./localTime.js";
export { TEMP_MAX_TENTHS, TEMP_MIN_TENTHS } from "./qc.js";
export { detectFormat, readClimateFile } from "./source.js";
export { isoUtc, type StationSummary, stationCoverage, stationSummary } from "./summary.js";
export * from "./types.js";
