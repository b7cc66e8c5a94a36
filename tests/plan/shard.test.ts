/** Shards of a screen: the stable hash and the `--shard k/n` option (README, "Scale past one machine"). */
import { describe, expect, it } from "vitest";
import { fnv1a32, parseShard, shardOf } from "../../src/plan/shard.js";

describe("FNV-1a 32-bit hash of a station id", () => {
  it("matches the published test vectors", () => {
    // Test vectors of FNV-1a 32 (IETF draft-eastlake-fnv, and Noll's FNV page): "" is the offset
    // basis; "a" and "foobar" from the same tables.
    expect(fnv1a32("")).toBe(0x811c9dc5);
    expect(fnv1a32("a")).toBe(0xe40c292c);
    expect(fnv1a32("foobar")).toBe(0xbf9cf968);
  });

  it("puts every station in exactly one shard, the same on every run", () => {
    const ids = Array.from({ length: 500 }, (_v, i) => `${String(700000 + i * 37).padStart(6, "0")}-99999`);
    for (const n of [1, 2, 7, 50]) {
      const shards = ids.map((id) => shardOf(id, n));
      expect(shards.every((k) => Number.isInteger(k) && k >= 0 && k < n)).toBe(true);
      expect(ids.map((id) => shardOf(id, n))).toEqual(shards);
    }
    // Spread (common practice, no source): 500 ids over 7 shards, each shard within half of the mean 71.4.
    const counts = new Array(7).fill(0);
    for (const id of ids) counts[shardOf(id, 7)]++;
    for (const c of counts) expect(c).toBeGreaterThan(36);
  });
});

describe("--shard k/n", () => {
  it("reads k of n with k from 0 to n − 1", () => {
    expect(parseShard("0/1")).toEqual({ index: 0, count: 1 });
    expect(parseShard("6/7")).toEqual({ index: 6, count: 7 });
  });

  it("names the option and what it expects", () => {
    for (const bad of ["7/7", "1/0", "-1/3", "a/b", "3", "1.5/4"])
      expect(() => parseShard(bad)).toThrow(
        /^--shard: ".*"; expected k\/n with n from 1 to 100000 and k from 0 to n − 1/,
      );
  });
});
