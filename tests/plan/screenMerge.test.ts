/** The merge of a sharded screen's partials (README, "Scale past one machine"): what it accepts and what it refuses. */
import { describe, expect, it } from "vitest";
import { mergePartials, type PartialFile, parsePartial } from "../../src/plan/screenMerge.js";
import type { ScreenPartial, ScreenSettings, ScreenStation } from "../../src/plan/screenResults.js";

const SETTINGS: ScreenSettings = {
  format: "coldsoak screen 1",
  generatedBy: "coldsoak 0.1.0",
  plan: "region",
  planSha256: "a".repeat(64),
  profile: "standard",
  units: "us",
  seed: 1,
  thresholds: { shortPct: 1, outOfBandPct: 2, minYears: 5 },
  climate: { years: null, minYearShare: 0.8, gapHours: 3 },
  referenceYear: 2001,
};

/** A station reduced to what the merge reads (its id); the rest is carried as it is. */
const station = (id: string) => ({ station: { id } }) as unknown as ScreenStation;

function part(index: number, count: number, ids: string[], edit: Partial<ScreenSettings> = {}): PartialFile {
  const partial: ScreenPartial = {
    ...SETTINGS,
    ...edit,
    shard: { index, count },
    stations: ids.map(station),
  };
  return { file: `screen-part-${index}-of-${count}.json`, partial };
}

const errorOf = (parts: PartialFile[]) => {
  try {
    mergePartials(parts);
  } catch (err) {
    return (err as Error).message;
  }
  return "no error";
};

describe("merging partials", () => {
  it("gives the settings and every station, sorted by id, whatever the order of the files", () => {
    const merged = mergePartials([part(2, 3, ["b-2"]), part(0, 3, ["c-3", "a-1"]), part(1, 3, [])]);
    expect(merged.stations.map((s) => s.station.id)).toEqual(["a-1", "b-2", "c-3"]);
    expect({ ...merged, stations: [] }).toEqual({ ...SETTINGS, stations: [] });
    expect(Object.keys(merged)).not.toContain("shard");
  });

  it("refuses partials of another tool version, plan file or setting, naming the file", () => {
    expect(errorOf([part(0, 2, []), part(1, 2, [], { generatedBy: "coldsoak 0.2.0" })])).toBe(
      "screen-part-1-of-2.json: written by coldsoak 0.2.0, the first partial by coldsoak 0.1.0; run every shard with one version of the tool",
    );
    expect(errorOf([part(0, 2, []), part(1, 2, [], { planSha256: "b".repeat(64) })])).toMatch(
      /^screen-part-1-of-2\.json: from another plan file .*run every shard with the same plan file$/,
    );
    expect(errorOf([part(0, 2, []), part(1, 2, [], { profile: "other" })])).toMatch(
      /^screen-part-1-of-2\.json: its profile \("other"\) differs from the first partial's \("standard"\)$/,
    );
  });

  it("refuses a missing, repeated or foreign shard and a station in two shards", () => {
    expect(errorOf([part(0, 3, []), part(2, 3, [])])).toMatch(/^screen-merge: shard 1 of 3 missing/);
    expect(errorOf([part(0, 2, []), part(0, 2, [])])).toMatch(/shard: shard 0 of 2 again/);
    expect(errorOf([part(0, 2, []), part(1, 3, [])])).toMatch(
      /shard: shard 1 of 3, the first partial is of 2/,
    );
    expect(errorOf([part(0, 2, ["x-1"]), part(1, 2, ["x-1"])])).toMatch(
      /^screen-part-1-of-2\.json:stations: station x-1 is also in screen-part-0-of-2\.json/,
    );
    expect(errorOf([])).toMatch(/no partial files given/);
  });

  it("reads only partials: not JSON, another format or a merged screen.json is refused", () => {
    const text = (v: unknown) => JSON.stringify(v);
    expect(() => parsePartial("{", "p.json")).toThrow(/^p\.json: not JSON/);
    expect(() => parsePartial(text({ format: "other" }), "p.json")).toThrow(
      /^p\.json:format: expected "coldsoak screen 1"/,
    );
    expect(() => parsePartial(text({ ...SETTINGS, stations: [] }), "screen.json")).toThrow(
      /^screen\.json:shard: missing or not k of n/,
    );
    expect(parsePartial(text(part(0, 1, ["a-1"]).partial), "p.json").shard).toEqual({ index: 0, count: 1 });
  });
});
