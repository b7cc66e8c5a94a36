#!/usr/bin/env node
import { Command, CommanderError } from "commander";
import { isMainModule } from "../entry.js";
import { InputError } from "../errors.js";
import { TOOL_VERSION } from "../version.js";
import { registerCommands } from "./commands.js";
import { writeRunStatsAtExit } from "./runStats.js";

export function buildProgram(): Command {
  const program = new Command("coldsoak")
    .description(
      "Plans how day-to-night temperature swings affect nitrogen-charged APU start accumulators across a fleet's bases.",
    )
    .version(TOOL_VERSION)
    .showHelpAfterError(false)
    .exitOverride()
    .addHelpText(
      "after",
      `
Examples:
  coldsoak init my-fleet                               start a plan of your own
  coldsoak plan sample-data/demo-plan.yaml --pdf       run the demo scenario, write out/demo/report.html
  coldsoak climate data/isd --units si                 summarise ISD climate files per station
  coldsoak precharge --ref 1450psig@70F --at 50F       precharge at another temperature
  coldsoak band sample-data/demo-plan.yaml             precharge line and fill-reading band table
  coldsoak energy sample-data/demo-plan.yaml           start energy and break-even temperatures
  coldsoak pdf out/demo/report.html                    print a report to PDF

Run 'coldsoak <command> --help' for each command's options.
Planning estimates, not maintenance data: service from the approved maintenance data and the
manufacturer's instructions, follow local rules, and take high-pressure gas precautions.`,
    );
  registerCommands(program);
  return program;
}

export async function main(argv: string[]): Promise<number> {
  const program = buildProgram();
  try {
    await program.parseAsync(argv, { from: "user" });
    return 0;
  } catch (err) {
    if (err instanceof CommanderError) {
      if (err.code === "commander.helpDisplayed" || err.code === "commander.version" || err.exitCode === 0)
        return 0;
      return 2; // commander already printed its one-line message
    }
    if (err instanceof InputError) {
      process.stderr.write(`coldsoak: ${err.message}\n`);
      return 2;
    }
    const msg = err instanceof Error ? err.message : String(err);
    process.stderr.write(`coldsoak: ${msg.split("\n")[0]}\n`);
    if (process.env.COLDSOAK_DEBUG && err instanceof Error) process.stderr.write(`${err.stack}\n`);
    return 1;
  }
}

if (isMainModule(import.meta.url)) {
  // A reader that closes the pipe early (`coldsoak --help | head`) is not an error.
  process.stdout.on("error", (err: NodeJS.ErrnoException) => {
    if (err.code === "EPIPE") process.exit(process.exitCode ?? 0);
    throw err;
  });
  writeRunStatsAtExit();
  main(process.argv.slice(2)).then((code) => {
    process.exitCode = code;
  });
}
