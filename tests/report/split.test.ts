import { describe, expect, it } from "vitest";
import {
  basePageCount,
  basePageName,
  basePagePath,
  isSplit,
  listPart,
  MAX_BASES_IN_ONE_FILE,
  MAX_LIST_ROWS,
  SPLIT_META,
  splitPdfNote,
} from "../../src/report/split.js";

// The layout rules of a split report (src/report/split.ts). The limits are the project's own choice
// (common practice, no source): the demo's four bases and 25 stays stay in one file untouched.

describe("split report layout", () => {
  it("splits only beyond the documented number of bases", () => {
    expect(MAX_BASES_IN_ONE_FILE).toBeGreaterThanOrEqual(4); // the demo has 4 bases (sample-data/demo-plan.yaml)
    expect(isSplit(MAX_BASES_IN_ONE_FILE)).toBe(false);
    expect(isSplit(MAX_BASES_IN_ONE_FILE + 1)).toBe(true);
  });

  it("names base pages by position, three digits at least, never by the base's name", () => {
    expect(basePageName(0)).toBe("001.html");
    expect(basePageName(41)).toBe("042.html");
    expect(basePageName(999)).toBe("1000.html");
    expect(basePagePath(12)).toBe("bases/013.html");
  });

  it("reads the split marker from an overview's head, and finds none elsewhere", () => {
    const overview = `<!doctype html><html><head><meta name="${SPLIT_META}" content="500"></head><body></body></html>`;
    expect(basePageCount(overview)).toBe(500);
    expect(basePageCount("<!doctype html><html><head></head><body></body></html>")).toBeNull();
    // The marker counts in the head only: a page whose body quotes it is no split overview.
    expect(
      basePageCount(`<html><head></head><body><meta name="${SPLIT_META}" content="3"></body>`),
    ).toBeNull();
  });

  it("keeps a list whole up to the limit and points to its CSV beyond it", () => {
    const rows = Array.from({ length: MAX_LIST_ROWS }, (_, i) => i);
    expect(listPart(rows, "aircraft_actions.csv")).toEqual({ rows, more: null });
    const long = Array.from({ length: MAX_LIST_ROWS + 1234 }, (_, i) => i);
    const part = listPart(long, "aircraft_actions.csv", "../aircraft_actions.csv");
    expect(part.rows).toEqual(rows);
    expect(part.more).toEqual({
      count: "1,234",
      file: "aircraft_actions.csv",
      href: "../aircraft_actions.csv",
      shown: MAX_LIST_ROWS.toLocaleString("en-US"),
    });
  });

  it("says that a split report's PDF holds the overview alone, and how to print a base page", () => {
    expect(splitPdfNote(1500, "out/fleet/")).toBe(
      "the PDF holds the fleet overview only; the 1,500 base pages in bases/ are not in it (print one with: coldsoak pdf out/fleet/bases/001.html)",
    );
  });
});
