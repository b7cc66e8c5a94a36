/**
 * The overnight traces of one base: of all overnight drops in reading (last recharge of an evening to
 * the next morning's preflight, each group of stays once, every usable year), the median and the
 * largest are simulated again with an hourly trace that starts with the state just after the evening's
 * last recharge, then every grid hour, with local times in the base's zone.
 */
import { DateTime } from "luxon";
import { HOUR_MS } from "./days.js";
import type { BaseResult, Trace } from "./results.js";
import type { BaseSamples } from "./samples.js";
import type { DropRecord } from "./simulate.js";
import { simulateStayYear } from "./simulate.js";
import { type BaseOutcomes, type Simulator, sampleInputs } from "./simulateSamples.js";

/** Hours of a trace after the evening's last recharge (its first point is the state just after it). */
export const TRACE_HOURS = 36;

/** One overnight drop with the sample it comes from. */
interface DropRef {
  groupIndex: number;
  yearIndex: number;
  drop: Pick<DropRecord, "readingPct" | "day" | "rechargeUtcMs">;
}

/**
 * Every drop of every group on every year as indices into the drop columns, ascending by drop in
 * reading (ties: year, group, day), with the year and group of each drop.
 */
function sortedDrops(base: BaseSamples, outcomes: BaseOutcomes) {
  const d = outcomes.drops;
  const n = d.readingPct.length;
  const year = new Int32Array(n);
  const group = new Int32Array(n);
  const order: number[] = [];
  for (let yi = 0; yi < base.years.length; yi++) {
    for (let gi = 0; gi < base.groups.length; gi++) {
      const o = outcomes.slot(yi, gi);
      for (let i = d.at[o]!; i < d.at[o + 1]!; i++) {
        year[i] = yi;
        group[i] = gi;
        order.push(i);
      }
    }
  }
  order.sort(
    (a, b) =>
      d.readingPct[a]! - d.readingPct[b]! ||
      year[a]! - year[b]! ||
      group[a]! - group[b]! ||
      d.day[a]! - d.day[b]!,
  );
  /** The drop at `rank` of the order, or undefined past its end. */
  return {
    length: order.length,
    at(rank: number): DropRef | undefined {
      const i = order[rank];
      if (i === undefined) return undefined;
      return {
        groupIndex: group[i]!,
        yearIndex: year[i]!,
        drop: { readingPct: d.readingPct[i]!, day: d.day[i]!, rechargeUtcMs: d.rechargeUtcMs[i]! },
      };
    },
  };
}

function trace(sim: Simulator, base: BaseSamples, ref: DropRef | undefined, label: string): Trace | null {
  if (ref === undefined) return null;
  // From the day's last start and its recharge: the first point is the state just after it.
  const from = ref.drop.rechargeUtcMs;
  const o = simulateStayYear({
    ...sampleInputs(sim, base, ref.groupIndex, ref.yearIndex),
    trace: { fromUtcMs: from, hours: TRACE_HOURS },
  });
  const zone = base.climate.timeZone;
  const local = (ms: number) => DateTime.fromMillis(ms, { zone }).toISO({ suppressMilliseconds: true }) ?? "";
  return {
    label,
    year: base.years[ref.yearIndex]!,
    startLocal: local(from),
    points: o.trace.map((t) => ({
      hour: (t.utcMs - from) / HOUR_MS,
      localTime: local(t.utcMs),
      ambientC: t.ambientC,
      accumulatorC: t.accumulatorC,
      gasKPaGauge: t.gasKPaGauge,
      readingPct: t.readingPct,
      bandLowPct: t.bandLowPct,
      bandHighPct: t.bandHighPct,
    })),
  };
}

/** The typical (median) and the worst (largest) overnight drop in reading, traced hour by hour. */
export function overnightTraces(
  sim: Simulator,
  base: BaseSamples,
  outcomes: BaseOutcomes,
): BaseResult["traces"] {
  const drops = sortedDrops(base, outcomes);
  return {
    typical: trace(
      sim,
      base,
      drops.at(Math.floor((drops.length - 1) / 2)),
      "typical (median overnight drop in reading)",
    ),
    worst: trace(sim, base, drops.at(drops.length - 1), "worst (largest overnight drop in reading)"),
  };
}
