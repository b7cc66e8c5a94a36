/**
 * Turns `Results` into the plain strings and pre-rendered charts the templates place. All formatting
 * and unit conversion happens here; the templates only lay out text (escaped by handlebars) and the
 * chart SVG (rendered by vega from data it escapes itself).
 */
import type {
  AdviceRow,
  BaseResult,
  MonthRow,
  PrechargeRow,
  ProfileResult,
  Results,
  StationResult,
  Trace,
} from "../plan/results.js";
import {
  formatDisplay,
  pct,
  show,
  shownText,
  showWithUnit,
  type UnitSystem,
  unitSystem,
} from "../units/index.js";
import { barChart, type Chart, PALETTE, stackedChart, xyChart } from "./charts.js";

export const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

export function monthName(month: number): string {
  return MONTHS[month - 1] ?? String(month);
}

/** Status of one base and month in the fleet summary. */
export type Status = "act" | "watch" | "ok" | "none";

export const STATUS_LABEL: Record<Status, string> = {
  act: "Act",
  watch: "Watch",
  ok: "OK",
  none: "No stay",
};

export interface Cell {
  status: Status;
  label: string;
  title: string;
}

export interface ActionRow {
  base: string;
  month: string;
  status: Status;
  label: string;
  text: string;
}

export interface Figure {
  chart: Chart;
  number: number;
  caption: string;
}

export interface TableRow {
  cells: string[];
}

export interface BaseView {
  anchor: string;
  name: string;
  timeZone: string;
  stationList: string;
  yearsUsed: string;
  yearsSkipped: string;
  climateTable: TableRow[];
  climateFigures: Figure[];
  coldest: { morning: string; oneIn10: string; byYear: string };
  profiles: { name: string; figures: Figure[]; table: TableRow[] }[];
  traces: { label: string; detail: string; figure: Figure | null }[];
  readingTable: TableRow[];
  energyTable: TableRow[];
  riskFigure: Figure | null;
  hourFigure: Figure | null;
  hourNote: string;
  advice: {
    month: string;
    status: Status;
    label: string;
    one: string;
    two: string;
    gain: string;
    text: string;
  }[];
  nitrogenTotals: TableRow[];
  nitrogenStays: TableRow[];
}

export interface ReportView {
  plan: string;
  generatedAt: string;
  toolVersion: string;
  climateYears: string;
  unitsName: string;
  seed: string;
  files: { name: string; linkable: boolean }[];
  thresholdText: string;
  fleet: { months: string[]; rows: { base: string; anchor: string; cells: Cell[] }[]; actions: ActionRow[] };
  bases: BaseView[];
  methods: { name: string; source: string; description: string }[];
  quantileMethod: string;
  randomInputs: { name: string; description: string }[];
  unitNotes: string[];
  assumptions: { key: string; label: string; shown: string; origin: string }[];
  coverage: {
    base: string;
    anchor: string;
    stations: TableRow[];
    qc: TableRow[];
    yearsUsed: string;
    yearsSkipped: string;
  }[];
  warnings: string[];
  u: Record<string, string>;
}

/** Options of the view builder (the generation time is passed in so that tests can fix it). */
export interface ViewOptions {
  generatedAt: string;
}

/** Counts figures across the whole report so captions read "Figure 1", "Figure 2", … in order. */
class FigureCounter {
  n = 0;
  next(chart: Chart, caption: string): Figure {
    this.n += 1;
    return { chart, number: this.n, caption };
  }
}

/** Status of a month from its statistics and advice: act, watch, ok, or none (no preflights). */
export function monthStatus(
  m: MonthRow | undefined,
  advice: AdviceRow | undefined,
  shortPct: number,
): Status {
  if (!m || m.preflights === 0) return "none";
  if (advice?.fitColdStartOption || (m.shortPctOne ?? 0) > shortPct) return "act";
  if ((m.belowBandPct ?? 0) + (m.aboveBandPct ?? 0) > 0) return "watch";
  return "ok";
}

function maxOf(values: (number | null)[]): number | null {
  const v = values.filter((x): x is number => x !== null);
  return v.length === 0 ? null : Math.max(...v);
}

/** The action for a run of months with the same status, quoting the worst month of the run. */
function actionText(run: MonthRow[], status: Status, shortPct: number): string {
  const upTo = (v: number | null) => `${run.length > 1 && (v ?? 0) > 0 ? "up to " : ""}${pct(v)} %`;
  const below = maxOf(run.map((m) => m.belowBandPct));
  const above = maxOf(run.map((m) => m.aboveBandPct));
  const outOfBand = (below ?? 0) + (above ?? 0) > 0;
  const readings = `out-of-band fill readings at the first preflight (${upTo(below)} below band, ${upTo(above)} above)`;
  if (status === "act") {
    const one = maxOf(run.map((m) => m.shortPctOne));
    const two = maxOf(run.map((m) => m.shortPctTwo));
    let text = `Fit the cold-start option: ${upTo(one)} of starts short of energy with one accumulator, ${upTo(two)} with two.`;
    if ((two ?? 0) > shortPct)
      text += ` Still above the ${pct(shortPct)} % threshold with two: plan overnight hangar space or a later first start.`;
    if (outOfBand) text += ` Also expect ${readings}.`;
    return text;
  }
  return `Expect ${readings}. Allow servicing time and brief technicians on the overnight drop.`;
}

/** Action rows of one base: consecutive calendar months with the same status share one row. */
function groupActions(b: BaseResult, shortPct: number): ActionRow[] {
  const adv = new Map(b.advice.map((a) => [a.month, a]));
  const byMonth = new Map(b.months.map((m) => [m.month, m]));
  const rows: ActionRow[] = [];
  let run: MonthRow[] = [];
  let runStatus: Status = "none";
  const flush = () => {
    if (run.length > 0 && (runStatus === "act" || runStatus === "watch")) {
      const first = monthName(run[0]!.month);
      const last = monthName(run[run.length - 1]!.month);
      rows.push({
        base: b.name,
        month: run.length === 1 ? first : `${first}–${last}`,
        status: runStatus,
        label: STATUS_LABEL[runStatus],
        text: actionText(run, runStatus, shortPct),
      });
    }
    run = [];
  };
  for (let month = 1; month <= 12; month++) {
    const m = byMonth.get(month);
    const status = monthStatus(m, adv.get(month), shortPct);
    if (status !== runStatus) {
      flush();
      runStatus = status;
    }
    if (m) run.push(m);
  }
  flush();
  return rows;
}

/**
 * "hangar air at 59.0 °F from 19:00 to 06:30" from the plan's hangar assumptions of a base (keys
 * `bases.<name>.hangar.{in,out,temperature}`: local times "HH:MM" and °C), or null without one.
 */
export function hangarText(results: Results, baseName: string): string | null {
  const get = (k: string) => results.assumptions.find((a) => a.key === `bases.${baseName}.hangar.${k}`);
  const from = get("in");
  const to = get("out");
  const temp = get("temperature");
  if (!from || !to || typeof temp?.value !== "number") return null;
  const t = showWithUnit(unitSystem(results.units).temp, temp.value);
  return `hangar air at ${t} from ${from.value} to ${to.value}`;
}

function stationLabel(s: StationResult): string {
  return s.name ? `${s.id} (${s.name})` : s.id;
}

function yearsText(years: number[]): string {
  if (years.length === 0) return "none";
  const sorted = [...years].sort((a, b) => a - b);
  const parts: string[] = [];
  let start = sorted[0]!;
  let prev = start;
  for (const y of [...sorted.slice(1), Number.NaN]) {
    if (y === prev + 1) {
      prev = y;
      continue;
    }
    parts.push(start === prev ? String(start) : `${start}–${prev}`);
    start = y;
    prev = y;
  }
  return `${parts.join(", ")} (${sorted.length} year${sorted.length === 1 ? "" : "s"})`;
}

/** Profiles flown at a base (from the stays); all profiles when no stay names one that exists. */
function profilesForBase(results: Results, base: BaseResult): ProfileResult[] {
  const names = new Set(results.stays.filter((s) => s.base === base.name).map((s) => s.profile));
  for (const s of base.nitrogen.stays) names.add(s.profile);
  const used = results.profiles.filter((p) => names.has(p.name));
  return used.length > 0 ? used : results.profiles;
}

/** Rows of a long table thinned to whole multiples of `stepC` (or every k-th row when none fall there). */
function thinByTemp<T extends { tempC: number }>(rows: T[], stepC: number, maxRows: number): T[] {
  const onGrid = rows.filter((r) => Math.abs(r.tempC / stepC - Math.round(r.tempC / stepC)) < 1e-9);
  if (onGrid.length >= 3 && onGrid.length <= maxRows) return onGrid;
  const k = Math.max(1, Math.ceil(rows.length / maxRows));
  return rows.filter((_r, i) => i % k === 0 || i === rows.length - 1);
}

async function traceFigure(
  figs: FigureCounter,
  u: UnitSystem,
  baseName: string,
  anchor: string,
  kind: "typical" | "worst",
  trace: Trace,
  hangar: string | null,
): Promise<Figure> {
  const pts = trace.points;
  // The trace starts at the day's last start and its recharge (not necessarily in the evening).
  const xTitle = "Hours after the day's last start and recharge";
  const xDomain: [number, number] = [0, Math.max(36, ...pts.map((p) => p.hour))];
  const title = `${baseName}: ${trace.label}, ${trace.year}, starting ${localTimeText(trace.startLocal)}`;
  const chart = await stackedChart(`${anchor}-trace-${kind}`, title, [
    {
      id: "",
      title: "",
      xTitle,
      yTitle: `Temperature (${u.temp.unit})`,
      xDomain,
      lines: [
        {
          name: hangar ? "Air (outside, or hangar)" : "Outside air",
          color: PALETTE.sky,
          dash: [6, 3],
          points: pts.map((p) => ({ x: p.hour, y: u.temp.convert(p.ambientC) })),
        },
        {
          name: "Accumulator",
          color: PALETTE.vermillion,
          points: pts.map((p) => ({ x: p.hour, y: u.temp.convert(p.accumulatorC) })),
        },
      ],
    },
    {
      id: "",
      title: "",
      xTitle,
      yTitle: `Gas pressure (${u.pressure.unit})`,
      xDomain,
      lines: [
        {
          name: "Gas pressure",
          color: PALETTE.blue,
          points: pts.map((p) => ({ x: p.hour, y: u.pressure.convert(p.gasKPaGauge) })),
        },
      ],
    },
    {
      id: "",
      title: "",
      xTitle,
      yTitle: "Fill reading (%)",
      xDomain,
      bands: [
        {
          name: "Band at air temperature",
          color: PALETTE.green,
          points: pts.map((p) => ({ x: p.hour, y: p.bandLowPct, y2: p.bandHighPct })),
        },
      ],
      lines: [
        {
          name: "Reading",
          color: PALETTE.black,
          points: pts.map((p) => ({ x: p.hour, y: p.readingPct })),
        },
      ],
    },
  ]);
  const air = hangar ? `the air around the aircraft (${hangar}; outside air otherwise)` : "the outside air";
  return figs.next(
    chart,
    `Top: temperature of ${air} and of the accumulator. Middle: trapped gas pressure. Bottom: fill reading against the band a technician would use at that air temperature.`,
  );
}

async function buildBase(
  results: Results,
  base: BaseResult,
  index: number,
  u: UnitSystem,
  figs: FigureCounter,
): Promise<BaseView> {
  const anchor = `base-${index + 1}`;
  const T = u.temp.unit;
  const shortPct = results.thresholds.shortPct;
  const climateMonths = [...base.climateMonths].sort((a, b) => a.month - b.month);
  const monthOrder = climateMonths.map((m) => monthName(m.month));

  const climateFigures: Figure[] = [];
  climateFigures.push(
    figs.next(
      await xyChart({
        id: `${anchor}-climate`,
        title: `${base.name}: monthly temperature (local months, all years pooled)`,
        xTitle: "Month (local)",
        yTitle: `Air temperature (${T})`,
        xType: "ordinal",
        xOrder: monthOrder,
        lines: [
          {
            name: "Maximum",
            color: PALETTE.vermillion,
            dash: [6, 3],
            shape: "triangle-up",
            points: climateMonths.map((m) => ({
              x: monthName(m.month),
              y: nullable(u.temp.convert, m.maxC),
            })),
          },
          {
            name: "Mean",
            color: PALETTE.black,
            shape: "circle",
            points: climateMonths.map((m) => ({
              x: monthName(m.month),
              y: nullable(u.temp.convert, m.meanC),
            })),
          },
          {
            name: "Minimum",
            color: PALETTE.blue,
            dash: [2, 2],
            shape: "triangle-down",
            points: climateMonths.map((m) => ({
              x: monthName(m.month),
              y: nullable(u.temp.convert, m.minC),
            })),
          },
        ],
      }),
      `Monthly minimum, mean and maximum of the hourly air temperature at ${base.name}, in ${T}.`,
    ),
  );
  if (base.dailyRangeHistogram.length > 0) {
    climateFigures.push(
      figs.next(
        await barChart({
          id: `${anchor}-swing`,
          title: `${base.name}: distribution of the daily temperature swing`,
          xTitle: `Daily swing, maximum − minimum (${u.tempDelta.unit})`,
          yTitle: "Days (count)",
          color: PALETTE.sky,
          bars: base.dailyRangeHistogram.map((b) => ({
            x: u.tempDelta.convert(b.lowC),
            x2: u.tempDelta.convert(b.highC),
            y: b.days,
          })),
        }),
        `Distribution of the local-day temperature swing (days with at least 20 hours of data) at ${base.name}, in ${u.tempDelta.unit}.`,
      ),
    );
  }

  const profiles = [];
  for (const [pi, p] of profilesForBase(results, base).entries()) {
    const figures: Figure[] = [];
    const P = u.pressure.unit;
    const temps = p.prechargeLine.map((r) => r.tempC);
    /** Chart points of one precharge line (temperature, gauge pressure) in the report's units. */
    const lineOf = (kPaGauge: (r: PrechargeRow) => number) =>
      p.prechargeLine.map((r) => ({ x: u.temp.convert(r.tempC), y: u.pressure.convert(kPaGauge(r)) }));
    const xDomain: [number, number] | undefined =
      temps.length > 1 ? [u.temp.convert(Math.min(...temps)), u.temp.convert(Math.max(...temps))] : undefined;
    figures.push(
      figs.next(
        await xyChart({
          id: `${anchor}-p${pi + 1}-precharge`,
          title: `Profile ${p.name}: precharge line, real gas against ideal gas`,
          xTitle: `Temperature (${T})`,
          yTitle: `Precharge (${P})`,
          ...(xDomain ? { xDomain } : {}),
          lines: [
            {
              name: "Real gas (Span et al. 2000)",
              color: PALETTE.blue,
              points: lineOf((r) => r.prechargeKPaGauge),
            },
            {
              name: "Tolerance, upper",
              color: PALETTE.orange,
              dash: [6, 3],
              points: lineOf((r) => r.prechargeHighKPaGauge),
            },
            {
              name: "Tolerance, lower",
              color: PALETTE.vermillion,
              dash: [6, 3],
              points: lineOf((r) => r.prechargeLowKPaGauge),
            },
            {
              name: "Ideal gas",
              color: PALETTE.black,
              dash: [2, 2],
              points: lineOf((r) => r.idealPrechargeKPaGauge),
            },
          ],
        }),
        `Precharge line of profile ${p.name} (piston on the fluid-side stop) with its tolerance lines, real gas against the ideal-gas model, in ${P}.`,
      ),
    );
    figures.push(
      figs.next(
        await xyChart({
          id: `${anchor}-p${pi + 1}-band`,
          title: `Profile ${p.name}: fill-reading band against temperature, one or two accumulators`,
          xTitle: `Temperature (${T})`,
          yTitle: "Fill reading (% of stroke)",
          ...(xDomain ? { xDomain } : {}),
          bands: [
            {
              name: "Band, 1 or 2 accumulators",
              color: PALETTE.green,
              points: p.band.map((r) => ({
                x: u.temp.convert(r.tempC),
                y: r.readingLowPct,
                y2: r.readingHighPct,
              })),
            },
          ],
          lines: [
            {
              name: "Nominal, real gas",
              color: PALETTE.black,
              points: p.band.map((r) => ({ x: u.temp.convert(r.tempC), y: r.readingNominalPct })),
            },
            {
              name: "Nominal, ideal gas",
              color: PALETTE.purple,
              dash: [2, 2],
              points: p.band.map((r) => ({ x: u.temp.convert(r.tempC), y: r.idealReadingNominalPct })),
            },
          ],
        }),
        `Fill-reading band at system pressure for profile ${p.name}. One accumulator and two in parallel read alike (each holds the same gas at the same pressure and temperature), so one band serves both; a second unit changes the start energy, not the reading.`,
      ),
    );
    const bandByTemp = new Map(p.band.map((r) => [r.tempC, r]));
    const table = thinByTemp(p.prechargeLine, 10, 12).map((r) => {
      const b = bandByTemp.get(r.tempC);
      return {
        cells: [
          show(u.temp, r.tempC),
          show(u.pressure, r.prechargeLowKPaGauge),
          show(u.pressure, r.prechargeKPaGauge),
          show(u.pressure, r.prechargeHighKPaGauge),
          show(u.pressure, r.idealPrechargeKPaGauge),
          b ? pct(b.readingLowPct) : "–",
          b ? pct(b.readingNominalPct) : "–",
          b ? pct(b.readingHighPct) : "–",
        ],
      };
    });
    profiles.push({ name: p.name, figures, table });
  }

  const hangar = hangarText(results, base.name);
  const traces: BaseView["traces"] = [];
  for (const kind of ["typical", "worst"] as const) {
    const t = base.traces[kind];
    const label = kind === "typical" ? "Typical overnight swing" : "Worst overnight swing";
    if (!t || t.points.length === 0) {
      traces.push({ label, detail: "No trace: no overnight stay in the years used.", figure: null });
      continue;
    }
    traces.push({
      label,
      detail: `${t.label}; year ${t.year}; starting ${localTimeText(t.startLocal)} local time.`,
      figure: await traceFigure(figs, u, base.name, anchor, kind, t, hangar),
    });
  }

  const months = [...base.months].sort((a, b) => a.month - b.month);
  const riskOrder = months.map((m) => monthName(m.month));
  const readingTable = months.map((m) => ({
    cells: [
      monthName(m.month),
      formatDisplay(m.preflights, 0),
      pct(m.belowBandPct),
      pct(m.aboveBandPct),
      `${show(u.pressure, m.morningKPaGaugeP10)} / ${show(u.pressure, m.morningKPaGaugeP50)} / ${show(u.pressure, m.morningKPaGaugeP90)}`,
      `${pct(m.morningReadingPctP10)} / ${pct(m.morningReadingPctP50)} / ${pct(m.morningReadingPctP90)}`,
      `${show(u.tempDelta, m.overnightDropTempMeanC)} / ${show(u.tempDelta, m.overnightDropTempP90C)}`,
      `${show(u.pressureDelta, m.overnightDropKPaMean)} / ${show(u.pressureDelta, m.overnightDropKPaP90)}`,
      `${pct(m.overnightDropReadingMeanPct)} / ${pct(m.overnightDropReadingP90Pct)}`,
    ],
  }));
  const energyTable = months.map((m) => ({
    cells: [
      monthName(m.month),
      formatDisplay(m.starts, 0),
      pct(m.shortPctOne),
      pct(m.shortPctTwo),
      `${pct(m.energyMarginOneP10Pct)} / ${pct(m.energyMarginOneP50Pct)}`,
      `${pct(m.energyMarginTwoP10Pct)} / ${pct(m.energyMarginTwoP50Pct)}`,
      `${show(u.tempDelta, m.dailyRangeMeanC)} / ${show(u.tempDelta, m.dailyRangeP90C)}`,
    ],
  }));
  const withData = months.filter((m) => m.preflights > 0);
  const riskFigure =
    withData.length > 0
      ? figs.next(
          await xyChart({
            id: `${anchor}-risk`,
            title: `${base.name}: risk by month`,
            xTitle: "Month (local)",
            yTitle: "Share (%)",
            xType: "ordinal",
            xOrder: riskOrder,
            yZero: true,
            width: 560,
            height: 200,
            lines: [
              {
                name: "Below band",
                color: PALETTE.blue,
                shape: "circle",
                points: months.map((m) => ({ x: monthName(m.month), y: m.belowBandPct })),
              },
              {
                name: "Above band",
                color: PALETTE.orange,
                dash: [4, 2],
                shape: "diamond",
                points: months.map((m) => ({ x: monthName(m.month), y: m.aboveBandPct })),
              },
              {
                name: "Short, one accumulator",
                color: PALETTE.vermillion,
                dash: [6, 3],
                shape: "square",
                points: months.map((m) => ({ x: monthName(m.month), y: m.shortPctOne })),
              },
              {
                name: "Short, two accumulators",
                color: PALETTE.purple,
                dash: [2, 2],
                shape: "triangle-up",
                points: months.map((m) => ({ x: monthName(m.month), y: m.shortPctTwo })),
              },
            ],
            rules: [{ y: shortPct, label: `threshold ${pct(shortPct)} %`, color: PALETTE.vermillion }],
          }),
          `Share of first preflights reading below or above the band, and share of starts short of energy with one and with two accumulators, by local month, at ${base.name}. The dotted line is the plan's short-start threshold.`,
        )
      : null;

  const hours = [...base.outOfBandByHour].sort((a, b) => a.hour - b.hour).filter((h) => h.preflights > 0);
  const hourFigure =
    hours.length > 0
      ? figs.next(
          await barChart({
            id: `${anchor}-hours`,
            title: `${base.name}: share out of band by local hour of day`,
            xTitle: "Hour of day (local)",
            yTitle: "Out of band (%)",
            color: PALETTE.orange,
            bars: hours.map((h) => ({ x: String(h.hour).padStart(2, "0"), y: h.outOfBandPct })),
            xOrder: hours.map((h) => String(h.hour).padStart(2, "0")),
            width: 560,
            height: 170,
          }),
          `Share of hours at which a check would read out of band if made at that hour (the trapped charge against the band for the air temperature around the aircraft${hangar ? `: ${hangar}` : ""}), by local hour of day, at ${base.name}, all stay months pooled. The preflight itself is the first start of the day.`,
        )
      : null;

  const monthByNumber = new Map(base.months.map((m) => [m.month, m]));
  const advice = [...base.advice]
    .sort((a, b) => a.month - b.month)
    .map((a) => {
      const m = monthByNumber.get(a.month);
      const status: Status = a.fitColdStartOption ? "act" : "ok";
      const two = a.shortPctTwo ?? 0;
      let text = a.fitColdStartOption ? "Fit the cold-start option." : "One accumulator is enough.";
      if (a.fitColdStartOption && two > shortPct)
        text += " Still short with two: plan hangar space or a later first start.";
      if (!m || m.preflights === 0) text = "No preflights in this month.";
      return {
        month: monthName(a.month),
        marginOne: m ? pct(m.energyMarginOneP10Pct) : "–",
        marginTwo: m ? pct(m.energyMarginTwoP10Pct) : "–",
        status: !m || m.preflights === 0 ? ("none" as Status) : status,
        label: STATUS_LABEL[!m || m.preflights === 0 ? "none" : status],
        one: pct(a.shortPctOne),
        two: pct(a.shortPctTwo),
        gain: pct(a.improvementPct),
        text,
      };
    });

  const n = base.nitrogen;
  const M = u.mass;
  const G = u.gasVolume;
  /** One totals row: label, unit, then P50/P90/P95 ("–" where only the median is computed). */
  const row = (label: string, unit: string, ...values: string[]): TableRow => ({
    cells: [label, unit, ...values, ...Array(3 - values.length).fill("–")],
  });
  const mass = (kg: number) => show(M, kg);
  const gas = (kg: number) => show(G, kg);
  const count = (x: number) => formatDisplay(x, 0);
  const nitrogenTotals: TableRow[] = [
    row("Nitrogen mass drawn from cylinders", M.unit, mass(n.kgP50), mass(n.kgP90), mass(n.kgP95)),
    row("Nitrogen at standard conditions", G.unit, gas(n.kgP50), gas(n.kgP90), gas(n.kgP95)),
    row("Cylinders", "count", count(n.cylindersP50), count(n.cylindersP90), count(n.cylindersP95)),
    row("Carts", "count", count(n.cartsP50), count(n.cartsP90), count(n.cartsP95)),
    row("Nitrogen left in accumulators", M.unit, mass(n.kgAddedP50)),
    row("Nitrogen vented (hose, lowered precharges)", M.unit, mass(n.kgVentedP50)),
    row("Servicing events", "count", formatDisplay(n.servicingEventsP50, 1)),
  ];
  const nitrogenStays = n.stays.map((s) => ({
    cells: [
      s.aircraft,
      s.arrive,
      s.depart,
      s.profile,
      s.coldStartOption ? "yes" : "no",
      formatDisplay(s.prechargeChecksP50, 1),
      formatDisplay(s.servicingEventsP50, 1),
      formatDisplay(s.handPumpStrokesP50, 0),
      show(M, s.kgAddedP50),
      show(M, s.kgVentedP50),
      show(M, s.kgP50),
      show(M, s.kgP90),
      show(M, s.kgP95),
    ],
  }));

  return {
    anchor,
    name: base.name,
    timeZone: base.timeZone,
    stationList: base.stations.map(stationLabel).join("; ") || "none",
    yearsUsed: yearsText(base.yearsUsed),
    yearsSkipped:
      base.yearsSkipped.length === 0
        ? "none"
        : base.yearsSkipped.map((y) => `${y.year} (${pct(y.completenessPct)} % complete)`).join(", "),
    climateTable: climateMonths.map((m) => ({
      cells: [
        monthName(m.month),
        show(u.temp, m.minC),
        show(u.temp, m.meanC),
        show(u.temp, m.maxC),
        show(u.tempDelta, m.meanDailyRangeC),
        show(u.tempDelta, m.p90DailyRangeC),
      ],
    })),
    climateFigures,
    coldest: {
      morning: base.coldestMorningC === null ? "–" : `${show(u.temp, base.coldestMorningC)} ${T}`,
      oneIn10: base.coldest1in10C === null ? "–" : `${show(u.temp, base.coldest1in10C)} ${T}`,
      byYear:
        base.coldestMorningByYear.map((y) => `${y.year}: ${show(u.temp, y.tempC)} ${T}`).join(", ") || "none",
    },
    profiles,
    traces,
    readingTable,
    energyTable,
    riskFigure,
    hourFigure,
    hourNote:
      hours.length > 0 ? "" : "No preflights with a reading in the years used, so no hourly breakdown.",
    advice,
    nitrogenTotals,
    nitrogenStays,
  };
}

/** "2018-12-01T15:00:00-06:00" → "2018-12-01 15:00 (UTC−06:00)"; anything else is shown as given. */
export function localTimeText(iso: string): string {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2})(?::\d{2}(?:\.\d+)?)?(Z|[+-]\d{2}:\d{2})?$/.exec(iso);
  if (!m) return iso;
  const zone = m[3] === undefined ? "" : m[3] === "Z" ? " (UTC)" : ` (UTC${m[3].replace("-", "\u2212")})`;
  return `${m[1]} ${m[2]}${zone}`;
}

/** "2015-01-01T00:00:00Z" → "2015-01-01 00:00" (the column header says UTC). */
function shortUtc(iso: string): string {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2})/.exec(iso);
  return m ? `${m[1]} ${m[2]}` : iso;
}

/** A date-time kept on one line: no-break space and non-breaking hyphens (U+00A0, U+2011). */
function unbroken(text: string): string {
  return text.replace(/ /g, "\u00a0").replace(/-/g, "\u2011");
}

function nullable(f: (v: number) => number, v: number | null): number | null {
  return v === null ? null : f(v);
}

/** Only plain relative file names become links; anything else is shown as text. */
function linkable(name: string): boolean {
  return /^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(name);
}

/** Builds the whole view model (every chart rendered) from the results. */
export async function buildView(results: Results, options: ViewOptions): Promise<ReportView> {
  const u = unitSystem(results.units);
  const figs = new FigureCounter();
  const shortPct = results.thresholds.shortPct;
  const bases: BaseView[] = [];
  for (const [i, b] of results.bases.entries()) bases.push(await buildBase(results, b, i, u, figs));

  const rows = results.bases.map((b, i) => {
    const byMonth = new Map(b.months.map((m) => [m.month, m]));
    const adv = new Map(b.advice.map((a) => [a.month, a]));
    const cells = MONTHS.map((_name, k) => {
      const m = byMonth.get(k + 1);
      const status = monthStatus(m, adv.get(k + 1), shortPct);
      return {
        status,
        label: STATUS_LABEL[status],
        title: `${b.name}, ${MONTHS[k]}: ${STATUS_LABEL[status]}`,
      };
    });
    return { base: b.name, anchor: `base-${i + 1}`, cells };
  });
  const actions: ActionRow[] = [];
  for (const b of results.bases) actions.push(...groupActions(b, shortPct));

  const files = results.files ?? ["results.json"];

  return {
    plan: results.plan,
    generatedAt: options.generatedAt,
    toolVersion: results.generatedBy,
    climateYears: yearsText(results.climateYears),
    unitsName: `${u.name} (${u.pressure.unit}, ${u.temp.unit}, ${u.volume.unit}, ${u.mass.unit}, ${u.gasVolume.unit})`,
    seed: String(results.seed),
    files: files.map((name) => ({ name, linkable: linkable(name) })),
    thresholdText: pct(shortPct),
    fleet: { months: MONTHS, rows, actions },
    bases,
    methods: results.methods,
    quantileMethod: results.quantileMethod,
    randomInputs: results.randomInputs,
    unitNotes: u.notes,
    assumptions: results.assumptions.map((a) => ({
      key: a.key,
      label: a.label,
      shown: shownText(a, u),
      origin: a.origin,
    })),
    coverage: results.bases.map((b, i) => ({
      base: b.name,
      anchor: `base-${i + 1}`,
      stations: b.stations.map((s) => ({
        cells: [
          s.id,
          s.name ?? "–",
          `${formatDisplay(s.lat, 3)}, ${formatDisplay(s.lon, 3)}`,
          show(u.length, s.elevationM),
          s.timeZone,
          `${unbroken(shortUtc(s.firstUtc))} to ${unbroken(shortUtc(s.lastUtc))}`,
          formatDisplay(s.hours, 0),
          formatDisplay(s.filledHours, 0),
          pct(s.completeness * 100),
        ],
      })),
      qc: b.stations.map((s) => ({
        cells: [
          s.id,
          formatDisplay(s.qc.read, 0),
          formatDisplay(s.qc.kept, 0),
          ...QC_REASONS.map((r) => formatDisplay(s.qc.dropped[r], 0)),
        ],
      })),
      yearsUsed: yearsText(b.yearsUsed),
      yearsSkipped:
        b.yearsSkipped.length === 0
          ? "none"
          : b.yearsSkipped.map((y) => `${y.year} (${pct(y.completenessPct)} % complete)`).join(", "),
    })),
    warnings: results.warnings,
    u: {
      pressure: u.pressure.unit,
      pressureDelta: u.pressureDelta.unit,
      temp: u.temp.unit,
      tempDelta: u.tempDelta.unit,
      mass: u.mass.unit,
      gasVolume: u.gasVolume.unit,
      volume: u.volume.unit,
      length: u.length.unit,
    },
  };
}

/** Drop reasons in the order of the product brief, section 4. */
export const QC_REASONS = [
  "malformed",
  "summary",
  "otherSite",
  "missing",
  "range",
  "erroneous",
  "suspect",
  "duplicate",
] as const;
