/**
 * `coldsoak screen`: the command's definition (arguments, options, help). Its work, `screenRun.ts`
 * (climate, engine, tables and page), is loaded only when the command runs.
 */
import type { Command } from "commander";
import type { ScreenCliOptions } from "./screenRun.js";

export function registerScreen(program: Command): void {
  program
    .command("screen")
    .description(
      "screen every station of a climate archive against a profile: one aircraft parked outside all year, without and with the cold-start option; a map of where and when the option is needed",
    )
    .argument(
      "<plan.yaml>",
      "plan file: its profiles, operations, thresholds and climate settings (bases, schedule and nitrogen are not read)",
    )
    .argument("<climate...>", "climate files or folders (read recursively): every station found is screened")
    .option("--out <dir>", "output root folder; results go to <dir>/<plan name>-screen/", "out")
    .option("--profile <name>", "profile screened (default: the plan's first)")
    .option(
      "--shard <k/n>",
      "screen only the stations of shard k of n (k = 0 … n−1) and write <out>/screen-part-k-of-n.json for screen-merge",
    )
    .option("--workers <n>", "worker threads over stations (default: one per core)")
    .option("--cache-dir <dir>", "keep the read climate in this cache folder (default: no cache)")
    .addHelpText(
      "after",
      `
Output (in <out>/<plan name>-screen/, replaced only after a successful run):
  screen.json    every station's figures by local month (°C, %; README, "Region screen")
  screen.csv     one row per station and local month, with the station's QC counts
  screen.html    self-contained page: the map and the stations sorted by risk

Sharded (README, "Scale past one machine"): a station goes to shard FNV-1a-32(id) mod n; run
  coldsoak screen plan.yaml archive/ --shard k/n --out parts     for k = 0 … n−1, anywhere, then
  coldsoak screen-merge parts/screen-part-*-of-n.json             to write the folder above.

Examples:
  coldsoak screen region.yaml data/isd
  coldsoak screen sample-data/demo-plan.yaml sample-data/climate --workers 2
  coldsoak screen region.yaml /archive/isd --shard 3/50 --out /shared/parts

Planning estimates, not maintenance data: service from the approved maintenance data and the
manufacturer's instructions, follow local rules, and take high-pressure gas precautions.`,
    )
    .action(async (planFile: string, climate: string[], opts: ScreenCliOptions) => {
      const { screenAction } = await import("./screenRun.js");
      await screenAction(planFile, climate, opts);
    });
}
