/**
 * The work of `coldsoak screen-merge <partial files...> [--out dir]`: merges the partials of a sharded screen
 * (`screen-part-k-of-n.json`, every shard once) into `out/<plan name>-screen/`, the same folder the
 * unsharded screen writes (README, "Scale past one machine"). Partials of another plan file, profile,
 * setting or tool version, a missing or repeated shard, a station in two shards: exit 2.
 */
import { join } from "node:path";
import { readInputText } from "../fsutil.js";
import { mergePartials, parsePartial } from "../plan/screenMerge.js";
import type { ScreenResults } from "../plan/screenResults.js";
import { screenSummary, writeScreenFolder } from "./screenRun.js";

/** Largest partial read (a partial holds some 10 kB per station). */
const MAX_PARTIAL_BYTES = 512 * 1024 * 1024;

/** Reads and merges the partials, writes the screen's folder; returns it and the merged results. */
export async function runScreenMerge(
  files: string[],
  opts: { out: string },
): Promise<{ folder: string; results: ScreenResults }> {
  const parts = [];
  for (const file of files)
    parts.push({
      file,
      partial: parsePartial(await readInputText(file, "the partial", MAX_PARTIAL_BYTES), file),
    });
  const results = mergePartials(parts);
  return { folder: await writeScreenFolder(opts.out, results), results };
}

/** `coldsoak screen-merge` once its options are parsed: merges, prints the summary and the page's path. */
export async function screenMergeAction(files: string[], opts: { out: string }): Promise<void> {
  const { folder, results } = await runScreenMerge(files, opts);
  process.stdout.write(`${screenSummary(results)}\n${join(folder, "screen.html")}\n`);
}
