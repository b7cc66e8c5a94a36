/**
 * `coldsoak plan`: the command's definition (arguments, options, help). Its work, `planRun.ts`, and
 * everything it needs (plan file, climate, engine, report) is loaded only when the command runs.
 */
import type { Command } from "commander";
import type { PlanCliOptions } from "./planRun.js";

export function registerPlan(program: Command): void {
  program
    .command("plan")
    .description(
      "simulate every stay of a deployment schedule over every year of climate record and write the planning report",
    )
    .argument(
      "<plan.yaml>",
      "plan file (YAML): bases, accumulator profiles, operations, nitrogen, thresholds",
    )
    .option("--schedule <file>", "deployment schedule CSV (overrides the plan's `schedule:` key)")
    .option("--out <dir>", "output root folder; results go to <dir>/<plan name>/", "out")
    .option("--json", "print results.json on stdout instead of the summary")
    .option(
      "--what-if",
      "also run every what-if variant over the same climate (the plan's whatIf: list, when it has one, names them)",
    )
    .option(
      "--pdf",
      "also print the report to report.pdf through the system Chromium (skipped, with a note, when none)",
    )
    .option("--no-cache", "read the climate files again instead of using the climate cache")
    .option(
      "--cache-dir <dir>",
      "climate cache folder (default: the plan's climate.cacheDir, else <out>/.cache/climate)",
    )
    .addHelpText(
      "after",
      `
Output (in <out>/<plan name>/, replaced only after a successful run):
  results.json   everything the report shows (°C, kPa gauge, kg, normal m³, %; no wall-clock time)
  *.csv          one table each: bases, months, advice, out_of_band_by_hour, coldest_mornings,
                 climate_months, daily_range_histogram, nitrogen_stays, nitrogen_fleet,
                 nitrogen_timeline, nitrogen_cylinder_gas, trapped_charge, traces, stations,
                 atmosphere, precharge_line, band, base_curves, stays, stay_months, aircraft_actions,
                 assumptions, break_even, energy_curve, design_point, design_temperatures,
                 design_months, hours_below, what_if (with what-if variants)
  report.html    the self-contained planning report

Schedule CSV: aircraft,base,arrive,depart[,cold_start_option][,profile]
  a stay covers arrive up to, not including, depart (YYYY-MM-DD)

Examples:
  coldsoak plan sample-data/demo-plan.yaml
  coldsoak plan plan.yaml --schedule winter.csv --out results
  coldsoak plan plan.yaml --json > results.json
  coldsoak plan sample-data/demo-plan.yaml --what-if

Planning estimates, not maintenance data: service from the approved maintenance data and the
manufacturer's instructions, follow local rules, and take high-pressure gas precautions.`,
    )
    .action(async (planFile: string, opts: PlanCliOptions) => {
      const { planAction } = await import("./planRun.js");
      await planAction(planFile, opts);
    });
}
