/**
 * `coldsoak screen-merge`: the command's definition (arguments, options, help). Its work,
 * `screenMergeRun.ts`, is loaded only when the command runs.
 */
import type { Command } from "commander";

export function registerScreenMerge(program: Command): void {
  program
    .command("screen-merge")
    .description("merge the partials of a sharded screen into the folder the unsharded screen writes")
    .argument("<partial...>", "screen-part-k-of-n.json files, one per shard k = 0 … n−1")
    .option("--out <dir>", "output root folder; results go to <dir>/<plan name>-screen/", "out")
    .addHelpText(
      "after",
      `
Writes screen.json, screen.csv and screen.html, byte for byte those of the unsharded screen (the page
carries its generation time: set SOURCE_DATE_EPOCH for a fixed one).

Example:
  coldsoak screen-merge parts/screen-part-*-of-50.json --out results`,
    )
    .action(async (files: string[], opts: { out: string }) => {
      const { screenMergeAction } = await import("./screenMergeRun.js");
      await screenMergeAction(files, opts);
    });
}
