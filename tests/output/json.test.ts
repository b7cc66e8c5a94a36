/**
 * The machine JSON in pieces: joined, the pieces are the text JSON.stringify gives (ECMA-262,
 * JSON.stringify with a replacer and a two-space gap) byte for byte, whatever the value and however
 * deep the pieces are cut. The expected text is the language's own serialisation, not this code's.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { machineJson, machineJsonPieces } from "../../src/output/json.js";

/** Values JSON meets in results and the ones it treats apart: undefined, NaN, ±Infinity, −0, dates. */
const leaf = fc.oneof(
  fc.double(),
  fc.integer(),
  fc.string(),
  fc.boolean(),
  fc.constant(null),
  fc.constant(undefined),
  fc.constant(-0),
  fc.constant(Number.NaN),
  fc.date({ noInvalidDate: true }),
);
const value = fc.letrec((tie) => ({
  node: fc.oneof({ depthSize: "small" }, leaf, tie("array"), tie("object")),
  array: fc.array(tie("node"), { maxLength: 4 }),
  object: fc.dictionary(fc.string(), tie("node"), { maxKeys: 4 }),
})).object;

describe("machine JSON in pieces", () => {
  it("joins to the whole text at every depth of cutting", () => {
    fc.assert(
      fc.property(value, fc.integer({ min: 0, max: 6 }), (v, depth) => {
        expect([...machineJsonPieces(v, depth)].join("")).toBe(machineJson(v));
      }),
      { seed: 2027, numRuns: 500 },
    );
  });

  it("cuts a long list into one piece per item, and rounds numbers to 6 decimals as the whole text does", () => {
    const v = { rows: Array.from({ length: 1000 }, (_x, i) => ({ i, x: i / 3, skip: undefined })) };
    const pieces = [...machineJsonPieces(v, 2)];
    expect(pieces.length).toBeGreaterThan(1000);
    expect(Math.max(...pieces.map((p) => p.length))).toBeLessThan(60);
    expect(pieces.join("")).toBe(machineJson(v));
    expect(pieces.join("")).toContain('"x": 0.333333'); // at most 6 decimals
  });
});
