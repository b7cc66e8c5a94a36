/**
 * `coldsoak precharge`: the command's definition (options, help). Its work, `prechargeRun.ts`, with the
 * nitrogen equation, is loaded only when the command runs.
 */
import type { Command } from "commander";
import type { PrechargeCliOptions } from "./prechargeRun.js";

/** Registers `coldsoak precharge`. */
export function registerPrecharge(program: Command): void {
  program
    .command("precharge")
    .description(
      "precharge gauge pressure at another temperature for a charge serviced to a reference pressure at a reference temperature (real and ideal gas side by side)",
    )
    .requiredOption(
      "--ref <pressure@temperature>",
      "service reference, <number><psig|psia|bar|barg|bara|kPa|kPag|kPaa|MPa|MPag|MPaa>@<number><F|C|K>, spaces allowed; psig, bar(g), kPa(g) and MPa(g) are gauge",
    )
    .requiredOption("--at <temperature>", "temperature to convert to, <number><F|C|K>")
    .option(
      "--elevation <metres>",
      "site elevation for the local atmospheric pressure (ISO 2533 standard atmosphere)",
      "0",
    )
    .option("--json", "write { realPsig, idealPsig, realKPaGauge, idealKPaGauge, atTempC } to stdout")
    .addHelpText(
      "after",
      [
        "",
        "Examples:",
        "  coldsoak precharge --ref 1450psig@70F --at 50F",
        "  coldsoak precharge --ref 100bar@20C --at -30C --elevation 1500 --json",
        "",
        "The gas amount is fixed by the reference with the piston on its fluid-side stop; the answer is",
        "the pressure of that amount at the same volume at the new temperature.",
        "",
        "Exit codes: 0 success, 2 bad input or usage (the message names the option), 1 anything else.",
      ].join("\n"),
    )
    .action(async (opts: PrechargeCliOptions) => {
      const { prechargeAction } = await import("./prechargeRun.js");
      await prechargeAction(opts);
    });
}
