/**
 * What the aggregation of a base keeps of its simulated samples (each group of identical stays on each
 * usable climate year): the records of preflights, starts and overnight drops, and the hourly readings,
 * as typed columns shared by all samples of the base, plus a few figures per sample; docs/methods.md,
 * "Statistics". The statistics read every record (their quantiles are exact), so a base holds its
 * records until it is aggregated; as columns they take 18 bytes per preflight, 26 per start, 37 per
 * drop and 10 per hour-of-day cell with readings, and no object per sample or record.
 *
 * The records of sample `s` (`outcomes.slot(yi, gi)`) are the indices `at[s]` … `at[s + 1] − 1` of each
 * kind's columns, in the order simulated.
 */
import type { NitrogenEvent, ReliefRecord, SimOutcome } from "./simulate.js";

/** Flags of a preflight: below and above the band. */
export const BELOW = 1;
export const ABOVE = 2;
/** Flags of a start: short of energy with one and with two accumulators. */
export const SHORT_ONE = 1;
export const SHORT_TWO = 2;

/** Months of a year plus the unused index 0, the stride of the per-month figures of a sample. */
const MONTH_SLOTS = 13;

export interface PreflightColumns {
  /** Records of sample s: at[s] … at[s + 1] − 1. */
  at: Int32Array;
  /** Local month, 1–12. */
  month: Uint8Array;
  /** BELOW | ABOVE. */
  flags: Uint8Array;
  gasKPaGauge: Float64Array;
  readingPct: Float64Array;
}

export interface StartColumns {
  at: Int32Array;
  month: Uint8Array;
  /** SHORT_ONE | SHORT_TWO. */
  flags: Uint8Array;
  /** Start energy with one and with two accumulators and the energy the start requires, J. */
  energyOneJ: Float64Array;
  energyTwoJ: Float64Array;
  requiredJ: Float64Array;
}

export interface DropColumns {
  at: Int32Array;
  month: Uint8Array;
  /** Day index of the morning. */
  day: Int32Array;
  tempC: Float64Array;
  gasKPa: Float64Array;
  readingPct: Float64Array;
  /** Instant of the evening's last recharge (UTC ms, climate time). */
  rechargeUtcMs: Float64Array;
}

/** The hourly what-if readings, only the `[month−1][hour]` cells with a reading. */
export interface HourlyCells {
  at: Int32Array;
  /** Cell index, (month − 1) × 24 + hour. */
  cell: Uint16Array;
  readings: Int32Array;
  outOfBand: Int32Array;
}

/** Energy margin of a start, % of the energy required. */
export function marginPct(energyJ: number, requiredJ: number): number {
  return (100 * (energyJ - requiredJ)) / requiredJ;
}

/** The figures of each sample that are not records, indexed by sample (module-internal). */
interface SampleFigures {
  /** Lowest ambient temperature of the sample's preflights, °C; +∞ without preflights. */
  coldestAmbientC: Float64Array;
  /** The same by local month: `[s × 13 + month]`, +∞ without. */
  coldestAmbientByMonthC: Float64Array;
  /** Highest trapped fluid pressure by local month, `[s × 13 + month]`, Pa absolute; NaN: no trapped step. */
  peakTrappedAbsPa: Float64Array;
  /** Gas vented from accumulators to lower a precharge, mol (all units). */
  ventedMol: Float64Array;
  servicings: Int32Array;
  checks: Int32Array;
  /** Hand-pump strokes (a fractional count: the last stroke of a servicing in part). */
  handPumpStrokes: Float64Array;
  startsWithoutAmbient: Int32Array;
  /** Servicing fills and relief openings (rare: a shared empty list where there are none). */
  nitrogen: (readonly NitrogenEvent[])[];
  reliefs: (readonly ReliefRecord[])[];
}

/** Every column of a base's outcomes. */
interface OutcomeColumns {
  preflights: PreflightColumns;
  starts: StartColumns;
  drops: DropColumns;
  hourly: HourlyCells;
  figures: SampleFigures;
}

/**
 * The kept records of every group of a base on every one of its years (built by `outcomesBuilder`).
 *
 * @example
 * const s = outcomes.slot(yi, gi);
 * const p = outcomes.preflights;
 * for (let i = p.at[s]!; i < p.at[s + 1]!; i++) p.gasKPaGauge[i];  // every preflight of the sample
 */
export class BaseOutcomes {
  constructor(
    /** Number of groups (the stride of a year's samples). */
    readonly groups: number,
    /** Row of the columns of each year of this view (the years as simulated, or a subset of them). */
    private readonly yearRows: readonly number[],
    private readonly columns: OutcomeColumns,
  ) {}

  /** Number of climate years. */
  get years(): number {
    return this.yearRows.length;
  }

  get preflights(): PreflightColumns {
    return this.columns.preflights;
  }

  get starts(): StartColumns {
    return this.columns.starts;
  }

  get drops(): DropColumns {
    return this.columns.drops;
  }

  get hourly(): HourlyCells {
    return this.columns.hourly;
  }

  /** The sample of group `gi` on year `yi`: the index of its figures and of its records' `at`. */
  slot(yi: number, gi: number): number {
    return this.yearRows[yi]! * this.groups + gi;
  }

  /** Lowest ambient temperature of a sample's preflights, °C; +∞ without preflights. */
  coldestAmbientC(s: number): number {
    return this.columns.figures.coldestAmbientC[s]!;
  }

  /** Lowest ambient temperature of a sample's preflights in local month `month` (1–12), °C; +∞ without. */
  coldestAmbientInMonthC(s: number, month: number): number {
    return this.columns.figures.coldestAmbientByMonthC[s * MONTH_SLOTS + month]!;
  }

  /** Highest trapped pressure of a sample in local month `month`, Pa absolute; NaN: no trapped step. */
  peakTrappedAbsPa(s: number, month: number): number {
    return this.columns.figures.peakTrappedAbsPa[s * MONTH_SLOTS + month]!;
  }

  /** Gas vented from accumulators to lower a precharge in a sample, mol (all units). */
  ventedMol(s: number): number {
    return this.columns.figures.ventedMol[s]!;
  }

  servicings(s: number): number {
    return this.columns.figures.servicings[s]!;
  }

  checks(s: number): number {
    return this.columns.figures.checks[s]!;
  }

  handPumpStrokes(s: number): number {
    return this.columns.figures.handPumpStrokes[s]!;
  }

  startsWithoutAmbient(s: number): number {
    return this.columns.figures.startsWithoutAmbient[s]!;
  }

  /** The servicing fills of a sample, in the order simulated. */
  nitrogen(s: number): readonly NitrogenEvent[] {
    return this.columns.figures.nitrogen[s]!;
  }

  /** The openings of the thermal relief valve in a sample. */
  reliefs(s: number): readonly ReliefRecord[] {
    return this.columns.figures.reliefs[s]!;
  }

  /** The same records on a subset of the years: year `i` of the view is year `yearIndices[i]` of this one. */
  onYears(yearIndices: readonly number[]): BaseOutcomes {
    return new BaseOutcomes(
      this.groups,
      yearIndices.map((yi) => this.yearRows[yi]!),
      this.columns,
    );
  }
}

/** Elements of one chunk of a `Growing` column. */
const CHUNK = 1 << 16;

type ColumnArray = Uint8Array | Uint16Array | Int32Array | Float64Array;

/** A typed-array type: one of its own of a length, or a view on a buffer. */
interface ColumnKind<A extends ColumnArray> {
  readonly BYTES_PER_ELEMENT: number;
  new (length: number): A;
  new (buffer: ArrayBuffer, byteOffset: number, length: number): A;
}

/** Where the columns of a base are joined: one buffer, filled from `offset` on. */
interface Block {
  buffer: ArrayBuffer;
  offset: number;
}

/**
 * A column of numbers gathered in chunks of `CHUNK` elements, then joined as a view on the base's one
 * block: nothing is copied while it grows (growth by doubling would leave every smaller array behind
 * as garbage, and a copy at the end), and the base's columns are one allocation, which the C library
 * gives back to the system whole when it is freed (many column-sized blocks, allocated and freed base
 * after base, stay with the process).
 */
class Growing<A extends ColumnArray> {
  private full: A[] = [];
  private chunk: A;
  private used = 0;
  length = 0;

  constructor(private readonly kind: ColumnKind<A>) {
    this.chunk = new kind(CHUNK);
  }

  push(v: number): void {
    if (this.used === CHUNK) {
      this.full.push(this.chunk);
      this.chunk = new this.kind(CHUNK);
      this.used = 0;
    }
    this.chunk[this.used++] = v;
    this.length++;
  }

  /** Bytes the column takes in a block, rounded up to 8 so that every column after it is aligned. */
  blockBytes(): number {
    return Math.ceil((this.length * this.kind.BYTES_PER_ELEMENT) / 8) * 8;
  }

  /** The column as a view on `block` at its offset (which moves past it); the chunks are dropped. */
  done(block: Block): A {
    const out = new this.kind(block.buffer, block.offset, this.length);
    block.offset += this.blockBytes();
    let at = 0;
    for (const c of this.full) {
      out.set(c, at);
      at += c.length;
    }
    out.set(this.chunk.subarray(0, this.used), at);
    this.full = [];
    this.chunk = new this.kind(0);
    this.used = 0;
    return out;
  }
}

const i32 = (n: number) => new Int32Array(n);
const f64 = (n: number) => new Float64Array(n);
const NONE: readonly never[] = Object.freeze([]);

/**
 * Gathers the kept records of a base's samples as they are simulated: `add` each sample in order (year
 * by year, group by group), then `done`.
 */
export class OutcomesBuilder {
  private next = 0;
  private readonly slots: number;
  private readonly pf;
  private readonly st;
  private readonly dr;
  private readonly hr;
  private readonly figures: SampleFigures;

  constructor(
    private readonly years: number,
    private readonly groups: number,
  ) {
    this.slots = years * groups;
    const at = () => i32(this.slots + 1);
    this.pf = {
      at: at(),
      month: new Growing(Uint8Array),
      flags: new Growing(Uint8Array),
      gas: new Growing(Float64Array),
      reading: new Growing(Float64Array),
    };
    this.st = {
      at: at(),
      month: new Growing(Uint8Array),
      flags: new Growing(Uint8Array),
      one: new Growing(Float64Array),
      two: new Growing(Float64Array),
      required: new Growing(Float64Array),
    };
    this.dr = {
      at: at(),
      month: new Growing(Uint8Array),
      day: new Growing(Int32Array),
      tempC: new Growing(Float64Array),
      gasKPa: new Growing(Float64Array),
      reading: new Growing(Float64Array),
      recharge: new Growing(Float64Array),
    };
    this.hr = {
      at: at(),
      cell: new Growing(Uint16Array),
      readings: new Growing(Int32Array),
      outOfBand: new Growing(Int32Array),
    };
    this.figures = {
      coldestAmbientC: f64(this.slots).fill(Number.POSITIVE_INFINITY),
      coldestAmbientByMonthC: f64(this.slots * MONTH_SLOTS).fill(Number.POSITIVE_INFINITY),
      peakTrappedAbsPa: f64(this.slots * MONTH_SLOTS).fill(Number.NaN),
      ventedMol: f64(this.slots),
      servicings: i32(this.slots),
      checks: i32(this.slots),
      handPumpStrokes: f64(this.slots),
      startsWithoutAmbient: i32(this.slots),
      nitrogen: new Array<readonly NitrogenEvent[]>(this.slots).fill(NONE),
      reliefs: new Array<readonly ReliefRecord[]>(this.slots).fill(NONE),
    };
  }

  /** Adds the outcome of group `gi` on year `yi` (an empty outcome for a year not usable for it). */
  add(yi: number, gi: number, o: SimOutcome): void {
    const s = yi * this.groups + gi;
    if (s !== this.next) throw new Error(`sample (${yi}, ${gi}) added out of order`);
    this.next++;
    this.addPreflights(s, o);
    this.addStarts(s, o);
    this.addDrops(s, o);
    this.addHourly(s, o);
    const f = this.figures;
    f.peakTrappedAbsPa.set(o.peakTrappedAbsPa.subarray(0, MONTH_SLOTS), s * MONTH_SLOTS);
    f.ventedMol[s] = o.ventedMol;
    f.servicings[s] = o.servicings;
    f.checks[s] = o.checks;
    f.handPumpStrokes[s] = o.handPumpStrokes;
    f.startsWithoutAmbient[s] = o.startsWithoutAmbient;
    if (o.nitrogen.length > 0) f.nitrogen[s] = o.nitrogen;
    if (o.reliefs.length > 0) f.reliefs[s] = o.reliefs;
  }

  private addPreflights(s: number, o: SimOutcome): void {
    const c = this.pf;
    const f = this.figures;
    o.preflights.forEach((r, i) => {
      c.month.push(r.month);
      c.flags.push((r.below ? BELOW : 0) | (r.above ? ABOVE : 0));
      c.gas.push(r.gasKPaGauge);
      c.reading.push(r.readingPct);
      if (i === 0 || r.ambientC < f.coldestAmbientC[s]!) f.coldestAmbientC[s] = r.ambientC;
      const m = s * MONTH_SLOTS + r.month;
      f.coldestAmbientByMonthC[m] = Math.min(f.coldestAmbientByMonthC[m]!, r.ambientC);
    });
    c.at[s + 1] = c.month.length;
  }

  private addStarts(s: number, o: SimOutcome): void {
    const c = this.st;
    for (const r of o.starts) {
      c.month.push(r.month);
      c.flags.push(
        (r.energyOneJ < r.requiredJ ? SHORT_ONE : 0) | (r.energyTwoJ < r.requiredJ ? SHORT_TWO : 0),
      );
      c.one.push(r.energyOneJ);
      c.two.push(r.energyTwoJ);
      c.required.push(r.requiredJ);
    }
    c.at[s + 1] = c.month.length;
  }

  private addDrops(s: number, o: SimOutcome): void {
    const c = this.dr;
    for (const r of o.drops) {
      c.month.push(r.month);
      c.day.push(r.day);
      c.tempC.push(r.tempC);
      c.gasKPa.push(r.gasKPa);
      c.reading.push(r.readingPct);
      c.recharge.push(r.rechargeUtcMs);
    }
    c.at[s + 1] = c.month.length;
  }

  private addHourly(s: number, o: SimOutcome): void {
    const c = this.hr;
    o.hourlyReadings.forEach((n, i) => {
      if (n === 0 && o.hourlyOutOfBand[i] === 0) return;
      c.cell.push(i);
      c.readings.push(n);
      c.outOfBand.push(o.hourlyOutOfBand[i]!);
    });
    c.at[s + 1] = c.cell.length;
  }

  /** The base's outcomes, once every sample is added. */
  done(): BaseOutcomes {
    if (this.next !== this.slots) throw new Error(`${this.slots - this.next} samples not added`);
    const { pf, st, dr, hr } = this;
    const columns = [pf, st, dr, hr].flatMap((kind) =>
      Object.values(kind).filter((c): c is Growing<ColumnArray> => c instanceof Growing),
    );
    const b: Block = { buffer: new ArrayBuffer(columns.reduce((n, c) => n + c.blockBytes(), 0)), offset: 0 };
    return new BaseOutcomes(
      this.groups,
      Array.from({ length: this.years }, (_y, yi) => yi),
      {
        preflights: {
          at: pf.at,
          month: pf.month.done(b),
          flags: pf.flags.done(b),
          gasKPaGauge: pf.gas.done(b),
          readingPct: pf.reading.done(b),
        },
        starts: {
          at: st.at,
          month: st.month.done(b),
          flags: st.flags.done(b),
          energyOneJ: st.one.done(b),
          energyTwoJ: st.two.done(b),
          requiredJ: st.required.done(b),
        },
        drops: {
          at: dr.at,
          month: dr.month.done(b),
          day: dr.day.done(b),
          tempC: dr.tempC.done(b),
          gasKPa: dr.gasKPa.done(b),
          readingPct: dr.reading.done(b),
          rechargeUtcMs: dr.recharge.done(b),
        },
        hourly: {
          at: hr.at,
          cell: hr.cell.done(b),
          readings: hr.readings.done(b),
          outOfBand: hr.outOfBand.done(b),
        },
        figures: this.figures,
      },
    );
  }
}
