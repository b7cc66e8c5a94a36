/**
 * `coldsoak band`: the command's definition (arguments, options, help). Its work, `bandRun.ts`, with
 * the plan file reader and the physics, is loaded only when the command runs.
 */
import type { Command } from "commander";
import type { BandCliOptions } from "./bandRun.js";

export function registerBand(program: Command): void {
  program
    .command("band")
    .description(
      "print the precharge line, its tolerance lines and the fill-reading band against temperature",
    )
    .argument("<plan.yaml>", "plan file whose profile to use")
    .option("--profile <name>", "profile name (default: the plan's first profile)")
    .option("--from <T>", "lowest temperature in the plan's unit (default −60 °F or −50 °C)")
    .option("--to <T>", "highest temperature (default 140 °F or 60 °C)")
    .option("--step <T>", "temperature step (default 10)")
    .option("--json", 'print { "profile", "rows": [ { "tempC", "prechargeKPaGauge", ... } ] } on stdout')
    .addHelpText(
      "after",
      `
Examples:
  coldsoak band plan.yaml
  coldsoak band plan.yaml --profile standard --from -40 --to 100 --step 5
  coldsoak band plan.yaml --json

Exit codes: 0 success, 2 bad input or usage (the message names file:line:field), 1 anything else.
Planning estimates, not maintenance data: service from the approved maintenance data.`,
    )
    .action(async (planFile: string, opts: BandCliOptions) => {
      const { bandAction } = await import("./bandRun.js");
      await bandAction(planFile, opts);
    });
}
