/**
 * The kept records of a base as shared columns: each sample's records where `at` says, in the order
 * simulated, with the sample's own figures, and a view on a subset of the years. The records are
 * constructed here (their values only need to come back where they were put).
 */
import { describe, expect, it } from "vitest";
import { ABOVE, BELOW, OutcomesBuilder, SHORT_ONE } from "../../src/plan/baseOutcomes.js";
import type { SimOutcome } from "../../src/plan/simulate.js";
import { emptyOutcome } from "../../src/plan/stayRun.js";

/** An outcome with `n` preflights in `month` at ambient temperatures base − 0, base − 1, … °C. */
function outcome(n: number, month: number, baseC: number): SimOutcome {
  const o = emptyOutcome();
  for (let i = 0; i < n; i++) {
    o.preflights.push({
      month,
      ambientC: baseC - i,
      gasKPaGauge: 10_000 + baseC + i,
      readingPct: 50 + i,
      below: i === 0,
      above: i === 1,
    } as SimOutcome["preflights"][number]);
    o.starts.push({
      month,
      energyOneJ: 1000,
      energyTwoJ: 3000,
      requiredJ: 2000,
    } as SimOutcome["starts"][number]);
  }
  o.servicings = n;
  o.handPumpStrokes = n + 0.5;
  o.peakTrappedAbsPa[month] = 2e7 + n;
  if (n > 0) o.nitrogen.push({ day: 0, utcMs: 0, fromMol: 1, toMol: 2, tempK: 280, units: 1 });
  return o;
}

describe("a base's outcomes as columns", () => {
  const years = 3;
  const groups = 2;
  const b = new OutcomesBuilder(years, groups);
  for (let yi = 0; yi < years; yi++)
    for (let gi = 0; gi < groups; gi++) b.add(yi, gi, outcome(yi + gi, 1 + yi, 10 * yi + gi));
  const o = b.done();

  it("puts each sample's records at at[s] … at[s+1] − 1, in the order added", () => {
    const p = o.preflights;
    for (let yi = 0; yi < years; yi++) {
      for (let gi = 0; gi < groups; gi++) {
        const s = o.slot(yi, gi);
        expect(p.at[s + 1]! - p.at[s]!).toBe(yi + gi);
        for (let k = 0; k < yi + gi; k++) {
          const i = p.at[s]! + k;
          expect(p.month[i]).toBe(1 + yi);
          expect(p.gasKPaGauge[i]).toBe(10_000 + 10 * yi + gi + k);
          expect(p.flags[i]).toBe(k === 0 ? BELOW : k === 1 ? ABOVE : 0);
        }
      }
    }
    expect(p.month).toHaveLength(0 + 1 + 1 + 2 + 2 + 3);
    expect(o.starts.flags[0]).toBe(SHORT_ONE);
  });

  it("keeps each sample's own figures: coldest ambient, trapped peak, counts and fills", () => {
    const s = o.slot(2, 1);
    expect(o.coldestAmbientC(s)).toBe(21 - 2);
    expect(o.coldestAmbientInMonthC(s, 3)).toBe(21 - 2);
    expect(o.coldestAmbientInMonthC(s, 1)).toBe(Number.POSITIVE_INFINITY);
    expect(o.coldestAmbientC(o.slot(0, 0))).toBe(Number.POSITIVE_INFINITY);
    expect(o.peakTrappedAbsPa(s, 3)).toBe(2e7 + 3);
    expect(o.peakTrappedAbsPa(s, 2)).toBeNaN();
    expect(o.servicings(s)).toBe(3);
    expect(o.handPumpStrokes(s)).toBe(3.5);
    expect(o.nitrogen(s)).toHaveLength(1);
    expect(o.nitrogen(o.slot(0, 0))).toHaveLength(0);
  });

  it("views a subset of the years without copying the columns", () => {
    const v = o.onYears([2, 0]);
    expect(v.years).toBe(2);
    expect(v.slot(0, 1)).toBe(o.slot(2, 1));
    expect(v.slot(1, 0)).toBe(o.slot(0, 0));
    expect(v.preflights).toBe(o.preflights);
  });

  it("refuses samples out of order and an incomplete base", () => {
    const c = new OutcomesBuilder(2, 2);
    expect(() => c.add(0, 1, emptyOutcome())).toThrow(/out of order/);
    c.add(0, 0, emptyOutcome());
    expect(() => c.done()).toThrow(/3 samples not added/);
  });
});

describe("a base's outcome columns beyond one gathering chunk", () => {
  // Columns are gathered in chunks of 65,536 elements and joined at the end; 150,000 records
  // over two samples cross two chunk boundaries, one of them inside the second sample.
  const sizes = [70_000, 80_000];
  const b = new OutcomesBuilder(1, 2);
  sizes.forEach((n, gi) => {
    b.add(0, gi, outcome(n, 1 + gi, 0));
  });
  const o = b.done();

  it("joins the chunks into one column holding every record in the order added", () => {
    const p = o.preflights;
    expect(p.month).toHaveLength(150_000);
    expect(Array.from(p.at)).toEqual([0, 70_000, 150_000]);
    for (const [i, expected] of [
      [0, 10_000],
      [65_535, 10_000 + 65_535],
      [65_536, 10_000 + 65_536],
      [69_999, 10_000 + 69_999],
      [70_000, 10_000],
      [70_000 + 61_071, 10_000 + 61_071],
      [131_072, 10_000 + 61_072],
      [149_999, 10_000 + 79_999],
    ] as const) {
      expect(p.gasKPaGauge[i]).toBe(expected);
    }
    expect(p.month[69_999]).toBe(1);
    expect(p.month[70_000]).toBe(2);
    expect(o.starts.energyOneJ).toHaveLength(150_000);
  });

  it("holds every column of the base in one buffer, each aligned and apart from the others", () => {
    const columns = [o.preflights.month, o.preflights.gasKPaGauge, o.starts.flags, o.starts.requiredJ];
    const buffer = columns[0]!.buffer;
    for (const c of columns) {
      expect(c.buffer).toBe(buffer);
      expect(c.byteOffset % 8).toBe(0);
    }
    // Written in turn, no column overwrites another: the last start's requirement is still 2000 J.
    expect(o.starts.requiredJ[149_999]).toBe(2000);
    expect(o.preflights.month[149_999]).toBe(2);
  });
});
