/**
 * Report part "Nitrogen to ship" (partial `nitrogenFleet`), near the top of the report: per base and
 * for the fleet, the gas drawn from the cylinders at P50/P90/P95, cylinders and carts, the mean split
 * by cause, the stock shipped and whether it lasts; what the figures include and leave out; the
 * nitrogen cautions. Fleet demand is the quantile of the fleet total per sample, fleet cylinders and
 * carts the sum of the bases' own counts (docs/methods.md §7). Reads `Results.nitrogenFleet` and
 * `BaseResult.nitrogen`.
 */
import type { NitrogenFlows, Results } from "../../plan/results.js";
import { formatDisplay, show, shownText, type UnitSystem } from "../../units/index.js";
import type { TableRow } from "../shared.js";
import {
  FLOW_LABELS,
  NITROGEN_CAUTIONS,
  NITROGEN_EXCLUSIONS,
  resupplyText,
  stockStatusText,
} from "./nitrogen.js";

export interface NitrogenFleetView {
  intro: string;
  ship: TableRow[];
  causes: TableRow[];
  stock: TableRow[];
  causeHeads: string[];
  included: string[];
  exclusions: string;
  cautions: string[];
}

/** The columns of the split by cause, in order; their sum is the gas drawn. */
const CAUSES: (keyof NitrogenFlows)[] = ["addedServicing", "addedUnscheduled", "hoseVented", "otherUse"];

/** What the demand includes, item by item, with the plan's settings as shown in the assumptions. */
function includedItems(results: Results, u: UnitSystem): string[] {
  const find = (key: string) => results.assumptions.find((x) => x.key === key);
  const shown = (key: string) => {
    const a = find(key);
    return a === undefined ? "–" : shownText(a, u);
  };
  const rate = find("nitrogen.unscheduledRechargesPerAircraftMonth");
  const per = find("nitrogen.otherUse.per");
  return [
    `Servicing by the operations policy: precharge checks every ${shown("operations.prechargeCheckDays")}, out-of-band action "${shown("operations.outOfBand")}", gas-loss top-ups; the hose vented at every disconnect.`,
    rate === undefined || rate.value === 0
      ? "Unscheduled full recharges: none in the plan (nitrogen.unscheduledRechargesPerAircraftMonth)."
      : `Unscheduled full recharges after accumulator, valve or seal work: ${shownText(rate, u)} (seeded Poisson events), each from vented to the precharge line.`,
    per === undefined
      ? "Other uses of the same carts (struts, tyres): none in the plan (nitrogen.otherUse)."
      : `Other uses of the same carts (struts, tyres): ${shown("nitrogen.otherUse.amount")} per aircraft per ${per.value === "week" ? "week" : "flown day"}.`,
  ];
}

export function nitrogenFleetSection(results: Results, u: UnitSystem): NitrogenFleetView {
  const f = results.nitrogenFleet;
  const mass = (kg: number) => show(u.mass, kg);
  const count = (x: number) => formatDisplay(x, 0);
  const bases = results.bases.map((b) => ({ name: b.name, n: b.nitrogen }));
  const fleetName = "Fleet total";
  const shipRow = (name: string, n: (typeof bases)[number]["n"] | typeof f): TableRow => ({
    cells: [
      name,
      mass(n.kgP50),
      mass(n.kgP90),
      mass(n.kgP95),
      show(u.gasVolume, n.kgP90),
      count(n.cylindersP50),
      count(n.cylindersP90),
      count(n.cylindersP95),
      count(n.cartsP50),
      count(n.cartsP90),
      count(n.cartsP95),
    ],
  });
  const causeRow = (name: string, flows: NitrogenFlows): TableRow => ({
    cells: [name, ...CAUSES.map((k) => mass(flows[k])), mass(flows.drawn), mass(flows.released)],
  });
  const years = f.climateYears.length;
  return {
    intro:
      `Gas drawn from the cylinders, over ${years} climate year${years === 1 ? "" : "s"}${f.draws > 1 ? ` × ${f.draws} draws of the seeded events` : ""}. ` +
      "Fleet demand is the quantile of the fleet total in each sample, not the sum of the bases' quantiles; " +
      "fleet cylinders and carts are the sum of each base's own count, since stock cannot move between bases.",
    ship: [...bases.map((b) => shipRow(b.name, b.n)), shipRow(fleetName, f)],
    causeHeads: [...CAUSES.map((k) => FLOW_LABELS[k]), FLOW_LABELS.drawn, FLOW_LABELS.released],
    causes: [...bases.map((b) => causeRow(b.name, b.n.meanKg)), causeRow(fleetName, f.meanKg)],
    stock: bases.map((b) => ({
      cells: [
        b.name,
        b.n.stock.cylinders === null ? "–" : count(b.n.stock.cylinders),
        b.n.stock.cylinders === null ? "–" : resupplyText(b.n.stock.resupplyEveryDays),
        b.n.stock.usableKgAtMean === null ? "–" : mass(b.n.stock.usableKgAtMean),
        stockStatusText(b.n.stock),
      ],
    })),
    included: includedItems(results, u),
    exclusions: NITROGEN_EXCLUSIONS,
    cautions: NITROGEN_CAUTIONS,
  };
}
