/**
 * The merge of a sharded screen (README, "Scale past one machine"): the partials of shards 0 … n − 1
 * (`screen-part-k-of-n.json`) into the results the unsharded screen gives, stations sorted by id.
 * Partials are refused, naming the file, when they are not partials, come from another plan file,
 * another profile or setting or another version of the tool, when a shard is missing or given twice,
 * or when two of them hold the same station.
 */
import { inputError } from "../errors.js";
import type { ScreenPartial, ScreenResults, ScreenSettings } from "./screenResults.js";

/** The format every screen file carries. */
export const SCREEN_FORMAT: ScreenSettings["format"] = "coldsoak screen 1";

/** A partial and the file it was read from. */
export interface PartialFile {
  file: string;
  partial: ScreenPartial;
}

/** A file name for the partial of shard k of n. */
export function partialName(index: number, count: number): string {
  return `screen-part-${index}-of-${count}.json`;
}

const isCount = (v: unknown): v is number => typeof v === "number" && Number.isInteger(v) && v >= 0;

/** Parses a partial's text; what is not one is an input error naming the file. */
export function parsePartial(text: string, file: string): ScreenPartial {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (err) {
    throw inputError(
      file,
      undefined,
      undefined,
      `not JSON (${(err as Error).message}); expected a screen partial`,
    );
  }
  const p = data as Partial<ScreenPartial> | null;
  if (p === null || typeof p !== "object" || p.format !== SCREEN_FORMAT)
    throw inputError(
      file,
      undefined,
      "format",
      `expected "${SCREEN_FORMAT}" (a file written by coldsoak screen --shard k/n)`,
    );
  const shard = p.shard;
  if (!shard || !isCount(shard.index) || !isCount(shard.count) || shard.index >= shard.count)
    throw inputError(
      file,
      undefined,
      "shard",
      "missing or not k of n; expected a partial of coldsoak screen --shard k/n, not a merged screen.json",
    );
  if (!Array.isArray(p.stations) || p.stations.some((s) => typeof s?.station?.id !== "string"))
    throw inputError(file, undefined, "stations", "expected a list of screened stations, each with its id");
  return p as ScreenPartial;
}

/** The settings of a partial (all but its shard and stations), as one comparable text per key. */
function settingsOf(p: ScreenPartial): ScreenSettings {
  const { shard: _shard, stations: _stations, ...settings } = p;
  return settings;
}

/** Why two partials' settings differ, in the user's words, or null when they are equal. */
function settingsDifference(a: ScreenSettings, b: ScreenSettings): string | null {
  if (a.generatedBy !== b.generatedBy)
    return `written by ${b.generatedBy}, the first partial by ${a.generatedBy}; run every shard with one version of the tool`;
  if (a.planSha256 !== b.planSha256)
    return `from another plan file (SHA-256 ${b.planSha256.slice(0, 12)}…, the first partial's ${a.planSha256.slice(0, 12)}…); run every shard with the same plan file`;
  for (const key of Object.keys(a) as (keyof ScreenSettings)[]) {
    if (JSON.stringify(a[key]) !== JSON.stringify(b[key]))
      return `its ${key} (${JSON.stringify(b[key])}) differs from the first partial's (${JSON.stringify(a[key])})`;
  }
  return null;
}

/**
 * Merges the partials of one sharded screen into its results: every shard 0 … n − 1 exactly once, the
 * same settings, no station twice; stations sorted by id.
 */
export function mergePartials(parts: PartialFile[]): ScreenResults {
  if (parts.length === 0) throw inputError("screen-merge", undefined, undefined, "no partial files given");
  const first = parts[0]!;
  const settings = settingsOf(first.partial);
  const count = first.partial.shard.count;
  const byShard = new Map<number, string>();
  const owner = new Map<string, string>();
  for (const { file, partial } of parts) {
    const refuse = (field: string | undefined, why: string) => inputError(file, undefined, field, why);
    const why = settingsDifference(settings, settingsOf(partial));
    if (why !== null) throw refuse(undefined, why);
    const { index } = partial.shard;
    if (partial.shard.count !== count)
      throw refuse(
        "shard",
        `shard ${index} of ${partial.shard.count}, the first partial is of ${count}; merge the partials of one split`,
      );
    if (byShard.has(index))
      throw refuse("shard", `shard ${index} of ${count} again (also ${byShard.get(index)})`);
    byShard.set(index, file);
    for (const s of partial.stations) {
      const other = owner.get(s.station.id);
      if (other !== undefined)
        throw refuse(
          "stations",
          `station ${s.station.id} is also in ${other}; its records are in files of two shards (files of several stations go with their first station: keep a station's files together)`,
        );
      owner.set(s.station.id, file);
    }
  }
  const missing = Array.from({ length: count }, (_v, k) => k).filter((k) => !byShard.has(k));
  if (missing.length > 0)
    throw inputError(
      "screen-merge",
      undefined,
      undefined,
      `shard${missing.length > 1 ? "s" : ""} ${missing.slice(0, 10).join(", ")}${missing.length > 10 ? ", …" : ""} of ${count} missing; give the partial of every shard (${partialName(missing[0]!, count)}, …)`,
    );
  const stations = parts
    .flatMap((p) => p.partial.stations)
    .sort((a, b) => (a.station.id < b.station.id ? -1 : a.station.id > b.station.id ? 1 : 0));
  return { ...settings, stations };
}
