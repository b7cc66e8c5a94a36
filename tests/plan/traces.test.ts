/** Overnight traces (docs/methods.md §5; README, Outputs: `bases[].traces`, traces.csv). */
import { describe, expect, it } from "vitest";
import { runPlan } from "../../src/plan/engine.js";
import { PA_PER_PSI } from "../../src/units/index.js";
import { fixturePlan, fixtureStay, HOUR_MS, oneLitreUnit, syntheticClimate } from "./helpers.js";

describe("overnight traces", () => {
  const from = Date.UTC(2014, 0, 1);
  // 10 °C by day, −10 °C by night (UTC), so that the trapped charge moves between the starts.
  const climate = syntheticClimate(
    (ms) => {
      const h = ((ms - from) / HOUR_MS) % 24;
      return h >= 9 && h <= 17 ? 10 : -10;
    },
    from,
    from + 10 * 24 * HOUR_MS,
  );
  const stays = [fixtureStay("A1", "2027-01-02", "2027-01-06")];
  const plan = fixturePlan((t) => {
    oneLitreUnit(t);
    t.operations.startTimes = ["07:00", "18:00"];
  });
  const trace = runPlan(plan, stays, new Map([["North Field", climate]])).results.bases[0]!.traces.worst!;

  it("starts with the state just after the day's last recharge, then every grid hour", () => {
    // Definition (docs/methods.md §5): the trace starts at the last recharge of the evening, 18:00; a
    // recharge that completes leaves the gas at nominal system pressure, 3000 psig (docs/methods.md
    // §3, Recharge), whereas the 18:00 grid reading before the start was the charge trapped since 07:00.
    expect(trace.startLocal).toMatch(/T18:00:00Z$/);
    const [first, second] = trace.points;
    expect(first!.hour).toBe(0);
    expect(first!.localTime).toBe(trace.startLocal);
    expect((first!.gasKPaGauge * 1000) / PA_PER_PSI).toBeCloseTo(3000, 3);
    expect(second!.hour).toBe(1);
    // Then one point per grid hour, up to 36 hours or the end of the stay.
    expect(trace.points.map((p) => p.hour)).toEqual(trace.points.map((_p, i) => i));
  });
});
