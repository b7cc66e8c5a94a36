/**
 * `coldsoak climate`: the command's definition (arguments, options, help). Its work, `climateRun.ts`,
 * and the climate pipeline are loaded only when the command runs.
 */
import { type Command, Option } from "commander";
import { DEFAULT_CACHE_DIR, DEFAULT_GAP_HOURS } from "../climate/types.js";
import type { ClimateCliOptions } from "./climateRun.js";

export function registerClimate(program: Command): void {
  program
    .command("climate")
    .summary("read NOAA ISD climate files and summarise each station")
    .description(
      "Reads NOAA Integrated Surface Data files (ISD full format, ISD-Lite, or the comma-separated " +
        "global-hourly layout; plain or gzip; the layout is detected from the content) and folders of them, " +
        "applies the quality rules, builds the hourly series and prints, per station: period, hours, " +
        "completeness, quality-control counts, monthly min/mean/max in local time, mean and P90 daily range, " +
        "and the coldest and warmest observation; and the climate design temperatures (annual 99.6 % and 99 % " +
        "cold dry-bulb, the coldest month's 1 % value, the coldest hour's 1-in-10 and 1-in-30-year values, " +
        "hours a year below −20, −30 and −40 in the chosen units with the longest spell).",
    )
    .argument("<paths...>", "climate files or folders (read recursively)")
    .addOption(
      new Option("--units <system>", "units of the table and CSV").choices(["us", "si"]).default("us"),
    )
    .option("--json", "print the stations as JSON on stdout (always °C)")
    .option("--csv <file>", "also write the monthly table as CSV")
    .option(
      "--gap-hours <n>",
      "fill gaps up to this many hours by linear interpolation",
      String(DEFAULT_GAP_HOURS),
    )
    .option(
      "--min-year-share <share>",
      "share of a year's (a month's) hours that must hold a value for its design temperatures",
      "0.8",
    )
    .option("--cache-dir <dir>", "folder of the parsed-series cache", DEFAULT_CACHE_DIR)
    .option("--no-cache", "read every file again, neither using nor writing the cache")
    .option(
      "--station-history <csv>",
      "station list CSV (USAF,WBAN,STATION NAME,...,LAT,LON,ELEV(M),...) for names and positions",
    )
    .option("--station-id <USAF-WBAN>", "station id of ISD-Lite files whose name does not carry it")
    .addHelpText(
      "after",
      "\nExamples:\n" +
        "  coldsoak climate data/isd/725300-94846-2014.gz\n" +
        "  coldsoak climate data/isd --units si --csv out/climate.csv\n" +
        "  coldsoak climate data/isd --json > climate.json\n" +
        "\nExit codes: 0 success, 2 bad input or usage (the message names file:line:field), 1 anything else.",
    )
    .action(async (paths: string[], opts: ClimateCliOptions) => {
      const { runClimate } = await import("./climateRun.js");
      await runClimate(paths, opts);
    });
}
