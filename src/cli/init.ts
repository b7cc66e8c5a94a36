/**
 * `coldsoak init`: the command's definition (arguments, options, help). Its work, `initRun.ts`, is
 * loaded only when the command runs.
 */
import type { Command } from "commander";
import type { InitCliOptions } from "./initRun.js";

export function registerInit(program: Command): void {
  program
    .command("init")
    .summary("write a starter plan, schedule and climate folder to edit for your fleet")
    .description(
      "Writes a commented starter plan file (plan.yaml), a schedule (schedule.csv), an empty climate/ " +
        "folder for your NOAA ISD files and a README.txt that says where to get them. Every value in the " +
        "starter plan is an example to replace. Never overwrites: if a file is already there, nothing is " +
        "written and the exit code is 2.",
    )
    .argument("<folder>", "folder to write into (created if missing)")
    .option("--name <name>", "plan name, which names the output folder (default: the folder's name)")
    .addHelpText(
      "after",
      "\nExamples:\n" +
        "  coldsoak init my-fleet\n" +
        "  coldsoak init plans/winter-2027 --name winter-2027\n" +
        "\nThen put ISD files into my-fleet/climate/, edit my-fleet/plan.yaml and run\n" +
        "  coldsoak plan my-fleet/plan.yaml\n" +
        "\nExit codes: 0 success, 2 a file already exists or bad usage, 1 anything else.",
    )
    .action(async (folder: string, opts: InitCliOptions) => {
      const { initAction } = await import("./initRun.js");
      await initAction(folder, opts);
    });
}
