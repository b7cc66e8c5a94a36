/**
 * Report section "Nitrogen and cylinders" of a base (partial `nitrogen`): what to ship for the base
 * (gas drawn from the cylinders at P50/P90/P95, cylinders, carts), where the gas goes (mean flows in
 * the one vocabulary of docs/methods.md §7), what one cylinder holds and gives at the base's
 * temperatures, the timeline of demand against the stock shipped with the stock-out date, and the
 * nitrogen by stay; with the nitrogen cautions. Reads `BaseResult.nitrogen`; the texts shared with the
 * fleet roll-up (flow labels, cautions, stock status) are exported from here.
 */

import type { BaseResult, NitrogenFlows, NitrogenStock } from "../../plan/results.js";
import { formatDisplay, show, type UnitSystem } from "../../units/index.js";
import { type LineSeries, PALETTE, xyChart } from "../charts.js";
import type { BaseContext, Figure, TableRow } from "../shared.js";
import { sectionId } from "./glance.js";

/** The one vocabulary of the nitrogen flows (report, CSV and JSON name the same quantities). */
export const FLOW_LABELS: Record<keyof NitrogenFlows, string> = {
  drawn: "Drawn from cylinders",
  added: "Added to accumulators",
  addedServicing: "Added by servicing",
  addedUnscheduled: "Added by unscheduled full recharges",
  hoseVented: "Vented from hoses at disconnect",
  otherUse: "Given to other uses",
  released: "Released from accumulators",
};

/** Cautions shown beside the nitrogen figures. */
export const NITROGEN_CAUTIONS = [
  "Asphyxiation: nitrogen displaces oxygen without warning. Vent hoses and accumulators outdoors or into extraction, never in a closed shelter or hangar without ventilation and oxygen monitoring.",
  "Transport: cylinders travel as compressed gas under the dangerous-goods rules (UN 1066, nitrogen, compressed, class 2.2); follow the carrier's and the local rules for packing, marking, securing and documents.",
];

/** What the nitrogen figures leave out, for the reader who ships from them. */
export const NITROGEN_EXCLUSIONS =
  "Not included: leaks of ground equipment and fittings, purging or first filling of new equipment, uses of the carts not entered as other uses, the gas in cylinders returned partly used, cylinders held in reserve or in transit.";

/** The stock status of a base in words: the P90 stock-out date, "stock lasts", or no stock stated. */
export function stockStatusText(stock: NitrogenStock): string {
  if (stock.cylinders === null) return "no stock stated in the plan (nitrogen.stock)";
  if (stock.stockOutP90 !== null) return `runs out at P90 on ${stock.stockOutP90}`;
  return "stock lasts (P90 demand stays below the usable stock)";
}

/** "every 28 d" or "never" for a resupply interval in days. */
export function resupplyText(days: number | null): string {
  return days === null ? "never" : `every ${formatDisplay(days, Number.isInteger(days) ? 0 : 1)} d`;
}

/** "3 full cylinders, topped up every 28 d", "1 full cylinder, not topped up", or "none stated". */
function stockShippedText(stock: NitrogenStock): string {
  if (stock.cylinders === null) return "none stated";
  const n = `${stock.cylinders} full cylinder${stock.cylinders === 1 ? "" : "s"}`;
  return stock.resupplyEveryDays === null
    ? `${n}, not topped up`
    : `${n}, topped up ${resupplyText(stock.resupplyEveryDays)}`;
}

export interface NitrogenView {
  /** Fragment id of the section, linked from the first screen. */
  id: string;
  totals: TableRow[];
  flows: TableRow[];
  usable: TableRow[];
  timeline: Figure | null;
  stockText: string;
  stays: TableRow[];
  cautions: string[];
  exclusions: string;
}

/** The mean flows as rows: drawn, its parts, then released apart. */
export function flowRows(flows: NitrogenFlows, u: UnitSystem): TableRow[] {
  const row = (key: keyof NitrogenFlows, indent: string) => ({
    cells: [`${indent}${FLOW_LABELS[key]}`, show(u.mass, flows[key]), show(u.gasVolume, flows[key])],
  });
  return [
    row("drawn", ""),
    row("addedServicing", "= "),
    row("addedUnscheduled", "+ "),
    row("hoseVented", "+ "),
    row("otherUse", "+ "),
    row("released", "apart: "),
  ];
}

const CYLINDER_AT: Record<string, string> = {
  fill: "fill temperature",
  mean: "mean site temperature",
  coldest: "coldest site temperature",
};

/** The timeline of the base: P50–P90 band of the gas drawn since the last top-up, and the stock line. */
async function timelineFigure(ctx: BaseContext): Promise<Figure | null> {
  const { base, u, anchor } = ctx;
  const n = base.nitrogen;
  if (n.timeline.length === 0) return null;
  const M = u.mass;
  const since = n.stock.resupplyEveryDays === null ? "since the first arrival" : "since the last top-up";
  const lines: LineSeries[] = [
    {
      name: "P50",
      color: PALETTE.blue,
      points: n.timeline.map((d) => ({ x: d.date, y: M.convert(d.sinceResupplyKgP50) })),
    },
    {
      name: "P90",
      color: PALETTE.orange,
      dash: [6, 3],
      points: n.timeline.map((d) => ({ x: d.date, y: M.convert(d.sinceResupplyKgP90) })),
    },
  ];
  if (n.stock.cylinders !== null) {
    lines.push({
      name: `usable gas of the stock (${n.stock.cylinders} cylinder${n.stock.cylinders === 1 ? "" : "s"})`,
      color: PALETTE.vermillion,
      dash: [2, 2],
      points: n.timeline.map((d) => ({ x: d.date, y: M.convert(d.stockUsableKg ?? 0) })),
    });
  }
  const chart = await xyChart({
    id: `${anchor}-n2-timeline`,
    title: `${base.name}: nitrogen drawn ${since} against the stock`,
    xTitle: "Date",
    yTitle: `Drawn ${since} (${M.unit})`,
    xType: "temporal",
    yZero: true,
    width: 560,
    lines,
    bands: [
      {
        name: "P50–P90 band",
        color: PALETTE.sky,
        points: n.timeline.map((d) => ({
          x: d.date,
          y: M.convert(d.sinceResupplyKgP50),
          y2: M.convert(d.sinceResupplyKgP90),
        })),
      },
    ],
  });
  return ctx.figs.next(
    chart,
    `${base.name}: gas drawn from the cylinders ${since} (P50 line, P90 dashed, band between), against the usable gas of the stock shipped at each day's site temperature. Stock: ${stockStatusText(n.stock)}.`,
  );
}

/** The totals to ship: gas drawn at P50/P90/P95, cylinders, carts, counts. */
function totalsRows(n: BaseResult["nitrogen"], u: UnitSystem): TableRow[] {
  const row = (label: string, unit: string, ...values: string[]): TableRow => ({
    cells: [label, unit, ...values, ...Array(3 - values.length).fill("–")],
  });
  const mass = (kg: number) => show(u.mass, kg);
  const gas = (kg: number) => show(u.gasVolume, kg);
  const count = (x: number) => formatDisplay(x, 0);
  return [
    row(FLOW_LABELS.drawn, u.mass.unit, mass(n.kgP50), mass(n.kgP90), mass(n.kgP95)),
    row(FLOW_LABELS.drawn, u.gasVolume.unit, gas(n.kgP50), gas(n.kgP90), gas(n.kgP95)),
    row("Cylinders", "count", count(n.cylindersP50), count(n.cylindersP90), count(n.cylindersP95)),
    row("Carts", "count", count(n.cartsP50), count(n.cartsP90), count(n.cartsP95)),
    row("Servicing events", "count", formatDisplay(n.servicingEventsP50, 1)),
    row(
      `Unscheduled full recharges (mean ${formatDisplay(n.unscheduledRechargesMean, 2)})`,
      "count",
      formatDisplay(n.unscheduledRechargesP50, 1),
      formatDisplay(n.unscheduledRechargesP90, 1),
      formatDisplay(n.unscheduledRechargesP95, 1),
    ),
  ];
}

export async function nitrogenSection(ctx: BaseContext): Promise<NitrogenView> {
  const { base, u, anchor } = ctx;
  const n = base.nitrogen;
  const mass = (kg: number) => show(u.mass, kg);
  return {
    id: sectionId(anchor, "nitrogen"),
    totals: totalsRows(n, u),
    flows: flowRows(n.meanKg, u),
    usable: n.usableGas.map((r) => ({
      cells: [
        `${CYLINDER_AT[r.at]}, ${show(u.temp, r.tempC)} ${u.temp.unit}`,
        show(u.pressure, r.fullKPaGauge),
        mass(r.fullKg),
        show(u.pressure, r.residualKPaGauge),
        mass(r.residualKg),
        mass(r.usableKg),
        formatDisplay(r.usablePct, 1),
      ],
    })),
    timeline: await timelineFigure(ctx),
    stockText: `Stock: ${stockShippedText(n.stock)}; ${stockStatusText(n.stock)}.`,
    stays: n.stays.map((s) => ({
      cells: [
        s.aircraft,
        s.arrive,
        s.depart,
        s.profile,
        s.coldStartOption ? "yes" : "no",
        formatDisplay(s.prechargeChecksP50, 1),
        formatDisplay(s.servicingEventsP50, 1),
        formatDisplay(s.unscheduledRechargesMean, 2),
        formatDisplay(s.handPumpStrokesP50, 0),
        mass(s.kgAddedP50),
        mass(s.kgHoseVentedP50),
        mass(s.kgReleasedP50),
        mass(s.kgP50),
        mass(s.kgP90),
        mass(s.kgP95),
      ],
    })),
    cautions: NITROGEN_CAUTIONS,
    exclusions: NITROGEN_EXCLUSIONS,
  };
}
