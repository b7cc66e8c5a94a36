import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { DateTime } from "luxon";
import { describe, expect, it } from "vitest";
import { runPlan } from "../../src/plan/engine.js";
import { loadPlanClimate } from "../../src/plan/run.js";
import { fixturePlan } from "./helpers.js";

const SAMPLES = new URL("../../../shared/isd-samples/", import.meta.url);
const FILE = fileURLToPath(new URL("725300-94846-2014.gz", SAMPLES));

/** Type-7 quantile written out in the test (Hyndman & Fan 1996). */
function q7(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  return s[lo]! + (h - lo) * ((s[Math.min(lo + 1, s.length - 1)] ?? s[lo]!) - s[lo]!);
}

describe.skipIf(!existsSync(FILE))("real data: 725300-94846-2014 (NOAA ISD sample), January–April", () => {
  it("coldest preflight = coldest hourly value at the first start hour; monthly P90 daily range from the series", async () => {
    const plan = fixturePlan(
      (t) => {
        t.climate.paths = [FILE];
        t.climate.years = { from: 2014, to: 2014 };
        t.bases[0].stations = ["725300-94846"];
        delete t.bases[0].hangar;
        t.operations.startTimes = ["06:00", "14:00"];
        t.operations.weekdays = 7;
      },
      fileURLToPath(new URL("plan.yaml", SAMPLES)),
    );
    const climate = await loadPlanClimate(plan, { cacheDir: null });
    const stays = [
      {
        aircraft: "A1",
        base: "North Field",
        arrive: "2027-01-01",
        depart: "2027-05-01",
        coldStartOption: false,
        profile: "standard",
        line: 2,
      },
    ];
    const { results } = runPlan(plan, stays, climate);
    const base = results.bases[0]!;
    expect(base.yearsUsed).toEqual([2014]);

    // From the data: the hourly value at 06:00 local on each day of January–April 2014.
    const { series, timeZone } = climate.get("North Field")!;
    let coldest = Number.POSITIVE_INFINITY;
    const present = [0, 0, 0, 0, 0];
    for (
      let d = DateTime.fromObject({ year: 2014, month: 1, day: 1, hour: 6 }, { zone: timeZone });
      d.month <= 4;
      d = d.plus({ days: 1 })
    ) {
      const v = series.tempC[(d.toMillis() - series.startUtcMs) / 3_600_000];
      if (v !== undefined && !Number.isNaN(v)) {
        coldest = Math.min(coldest, v);
        present[d.month]!++;
      }
    }
    expect(base.coldestMorningC).toBe(coldest);

    // Daily range straight from the hourly series: local-day max − min, days with ≥ 20 hours (docs/methods.md §4).
    const byDay = new Map<string, number[]>();
    for (let i = 0; i < series.tempC.length; i++) {
      const v = series.tempC[i]!;
      if (Number.isNaN(v)) continue;
      const local = DateTime.fromMillis(series.startUtcMs + i * 3_600_000, { zone: timeZone });
      if (local.year !== 2014) continue;
      const key = local.toISODate()!;
      byDay.set(key, [...(byDay.get(key) ?? []), v]);
    }
    for (const month of [1, 2, 3, 4]) {
      const ranges = [...byDay.entries()]
        .filter(([k, v]) => Number(k.slice(5, 7)) === month && v.length >= 20)
        .map(([, v]) => Math.max(...v) - Math.min(...v));
      expect(base.months[month - 1]!.dailyRangeP90C).toBeCloseTo(q7(ranges, 0.9), 9);
      // One preflight per day whose first-start hour has a value.
      expect(base.months[month - 1]!.preflights).toBe(present[month]);
    }
  });
});
