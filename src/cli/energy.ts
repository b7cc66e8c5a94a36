/**
 * `coldsoak energy`: the command's definition (arguments, options, help). Its work, `energyRun.ts`,
 * with the plan file reader and the physics, is loaded only when the command runs.
 */
import type { Command } from "commander";
import type { EnergyCliOptions } from "./energyRun.js";

/** The caution printed under every table of the command. */
export const ENERGY_CAUTION =
  "Model estimates, not servicing data: service from the approved maintenance data and the manufacturer's instructions; follow local rules.";

export function registerEnergy(program: Command): void {
  program
    .command("energy")
    .description(
      "print the start energy of one and two accumulators against temperature with the break-even temperatures",
    )
    .argument("<plan.yaml>", "plan file whose profile to use")
    .option("--profile <name>", "profile name (default: the plan's first profile)")
    .option("--from <T>", "lowest temperature in the plan's unit (default −60 °F or −50 °C)")
    .option("--to <T>", "highest temperature (default 140 °F or 60 °C)")
    .option("--step <T>", "temperature step of the tables (default 10)")
    .option("--drop <ΔT>", "also after an overnight drop of this size (charged warmer, trapped, cooled)")
    .option(
      "--json",
      'print { "profile", "cases", "rows": [ { "tempC", "requiredJ", "energyJ" } ], "breakEven", "drop" } on stdout',
    )
    .addHelpText(
      "after",
      `
The cases: 1 accumulator and the cold-start option's count, each with the gas amount on the low
tolerance line, the reference or the high line, charged to the low or the nominal system pressure.
A break-even temperature is the ambient below which the case falls short of the required energy;
"none: short everywhere" or "none: never short" where no crossing lies between --from and --to.

Examples:
  coldsoak energy plan.yaml
  coldsoak energy plan.yaml --profile standard --from -40 --to 60 --step 5
  coldsoak energy plan.yaml --drop 20 --json

Exit codes: 0 success, 2 bad input or usage (the message names file:line:field), 1 anything else.
${ENERGY_CAUTION}`,
    )
    .action(async (planFile: string, opts: EnergyCliOptions) => {
      const { energyAction } = await import("./energyRun.js");
      await energyAction(planFile, opts);
    });
}
