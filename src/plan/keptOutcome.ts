/**
 * What the aggregation of a base keeps of one simulated stay-year: the records of preflights, starts
 * and overnight drops as typed columns of the fields the statistics read (docs/methods.md §6), in the
 * order simulated, instead of one object per record; everything else of the outcome as it is. A base
 * holds one of these per group and usable year until it is aggregated, so the columns are what its
 * memory grows with.
 */
import type { SimOutcome } from "./simulate.js";

/** Flags of a preflight: below and above the band. */
export const BELOW = 1;
export const ABOVE = 2;
/** Flags of a start: short of energy with one and with two accumulators. */
export const SHORT_ONE = 1;
export const SHORT_TWO = 2;

export interface PreflightColumns {
  /** Local month, 1–12. */
  month: Uint8Array;
  /** BELOW | ABOVE. */
  flags: Uint8Array;
  gasKPaGauge: Float64Array;
  readingPct: Float64Array;
  /** Lowest ambient temperature of the preflights, °C; undefined without preflights. */
  coldestAmbientC: number | undefined;
  /** Lowest ambient temperature of the preflights of each local month, °C: `[month]` (1–12), +∞ without. */
  coldestAmbientByMonthC: Float64Array;
}

export interface StartColumns {
  month: Uint8Array;
  /** SHORT_ONE | SHORT_TWO. */
  flags: Uint8Array;
  /** Start energy with one and with two accumulators and the energy the start requires, J. */
  energyOneJ: Float64Array;
  energyTwoJ: Float64Array;
  requiredJ: Float64Array;
}

/** Energy margin of a start, % of the energy required. */
export function marginPct(energyJ: number, requiredJ: number): number {
  return (100 * (energyJ - requiredJ)) / requiredJ;
}

export interface DropColumns {
  month: Uint8Array;
  /** Day index of the morning. */
  day: Int32Array;
  tempC: Float64Array;
  gasKPa: Float64Array;
  readingPct: Float64Array;
  /** Instant of the evening's last recharge (UTC ms, climate time). */
  rechargeUtcMs: Float64Array;
}

/** The hourly what-if readings of `SimOutcome`, only the `[month−1][hour]` cells with a reading. */
export interface HourlyCells {
  /** Cell index, (month − 1) × 24 + hour. */
  cell: Uint16Array;
  readings: Int32Array;
  outOfBand: Int32Array;
}

export interface KeptOutcome
  extends Omit<SimOutcome, "preflights" | "starts" | "drops" | "hourlyReadings" | "hourlyOutOfBand"> {
  preflights: PreflightColumns;
  starts: StartColumns;
  drops: DropColumns;
  hourly: HourlyCells;
}

function preflightColumns(o: SimOutcome): PreflightColumns {
  const n = o.preflights.length;
  const c: PreflightColumns = {
    month: new Uint8Array(n),
    flags: new Uint8Array(n),
    gasKPaGauge: new Float64Array(n),
    readingPct: new Float64Array(n),
    coldestAmbientC: undefined,
    coldestAmbientByMonthC: new Float64Array(13).fill(Number.POSITIVE_INFINITY),
  };
  o.preflights.forEach((r, i) => {
    c.month[i] = r.month;
    c.flags[i] = (r.below ? BELOW : 0) | (r.above ? ABOVE : 0);
    c.gasKPaGauge[i] = r.gasKPaGauge;
    c.readingPct[i] = r.readingPct;
    if (c.coldestAmbientC === undefined || r.ambientC < c.coldestAmbientC) c.coldestAmbientC = r.ambientC;
    c.coldestAmbientByMonthC[r.month] = Math.min(c.coldestAmbientByMonthC[r.month]!, r.ambientC);
  });
  return c;
}

function startColumns(o: SimOutcome): StartColumns {
  const n = o.starts.length;
  const c: StartColumns = {
    month: new Uint8Array(n),
    flags: new Uint8Array(n),
    energyOneJ: new Float64Array(n),
    energyTwoJ: new Float64Array(n),
    requiredJ: new Float64Array(n),
  };
  o.starts.forEach((r, i) => {
    c.month[i] = r.month;
    c.flags[i] = (r.energyOneJ < r.requiredJ ? SHORT_ONE : 0) | (r.energyTwoJ < r.requiredJ ? SHORT_TWO : 0);
    c.energyOneJ[i] = r.energyOneJ;
    c.energyTwoJ[i] = r.energyTwoJ;
    c.requiredJ[i] = r.requiredJ;
  });
  return c;
}

function dropColumns(o: SimOutcome): DropColumns {
  const n = o.drops.length;
  const c: DropColumns = {
    month: new Uint8Array(n),
    day: new Int32Array(n),
    tempC: new Float64Array(n),
    gasKPa: new Float64Array(n),
    readingPct: new Float64Array(n),
    rechargeUtcMs: new Float64Array(n),
  };
  o.drops.forEach((r, i) => {
    c.month[i] = r.month;
    c.day[i] = r.day;
    c.tempC[i] = r.tempC;
    c.gasKPa[i] = r.gasKPa;
    c.readingPct[i] = r.readingPct;
    c.rechargeUtcMs[i] = r.rechargeUtcMs;
  });
  return c;
}

function hourlyCells(o: SimOutcome): HourlyCells {
  const cells: number[] = [];
  o.hourlyReadings.forEach((n, i) => {
    if (n !== 0 || o.hourlyOutOfBand[i] !== 0) cells.push(i);
  });
  return {
    cell: Uint16Array.from(cells),
    readings: Int32Array.from(cells, (i) => o.hourlyReadings[i]!),
    outOfBand: Int32Array.from(cells, (i) => o.hourlyOutOfBand[i]!),
  };
}

/** The outcome as the aggregation keeps it: its records as columns, the rest as it is. */
export function keptOutcome(o: SimOutcome): KeptOutcome {
  const { hourlyReadings: _r, hourlyOutOfBand: _o, ...rest } = o;
  return {
    ...rest,
    preflights: preflightColumns(o),
    starts: startColumns(o),
    drops: dropColumns(o),
    hourly: hourlyCells(o),
  };
}
