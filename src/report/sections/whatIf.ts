/**
 * Report section "What if" of a base (partial `whatIf`): for the base's worst month, how the share of
 * starts short with one and with two accumulators and the out-of-band share change under each what-if
 * variant, as a tornado chart (largest change in the short share with one first) and a table. Reads
 * `BaseResult.whatIf` and `Results.whatIf`; the section is left out when no variant was run.
 */
import type { WhatIfVariantRow } from "../../plan/results.js";
import { pct } from "../../units/index.js";
import { PALETTE, tornadoChart } from "../charts.js";
import { type BaseContext, type Figure, monthName, type TableRow } from "../shared.js";

export interface WhatIfView {
  shown: boolean;
  month: string;
  note: string;
  figure: Figure | null;
  table: TableRow[];
}

/** "+1.2" / "−0.4" / "0.0" percentage points, "–" without a value. */
function change(v: number | null): string {
  if (v === null) return "–";
  return v > 0 ? `+${pct(v)}` : pct(v);
}

/** Variants by the size of their change in the short share with one, largest first (ties in run order). */
function tornadoOrder(rows: WhatIfVariantRow[]): WhatIfVariantRow[] {
  const size = (r: WhatIfVariantRow) => Math.abs(r.shortPctOneChange ?? 0);
  return rows
    .map((r, i) => ({ r, i }))
    .sort((a, b) => size(b.r) - size(a.r) || a.i - b.i)
    .map((x) => x.r);
}

export async function whatIfSection({ results, base, anchor, figs }: BaseContext): Promise<WhatIfView> {
  const w = base.whatIf;
  if (results.whatIf === null || w === null)
    return { shown: false, month: "", note: "", figure: null, table: [] };
  if (w.month === null) {
    return { shown: true, month: "", note: `No what-if figures: ${w.reason}.`, figure: null, table: [] };
  }
  const month = monthName(w.month);
  const rows = tornadoOrder(w.variants);
  const chart = await tornadoChart({
    id: `${anchor}-whatif`,
    title: `${base.name}, ${month}: change in the shares under each what-if variant`,
    xTitle: "Change from the plan as it stands (percentage points)",
    yTitle: "Variant",
    categories: rows.map((r) => r.label),
    series: [
      {
        name: "Short, one",
        color: PALETTE.vermillion,
        dash: [],
        values: rows.map((r) => r.shortPctOneChange),
      },
      { name: "Short, two", color: PALETTE.blue, dash: [4, 2], values: rows.map((r) => r.shortPctTwoChange) },
      {
        name: "Out of band",
        color: PALETTE.yellow,
        dash: [1, 2],
        values: rows.map((r) => r.outOfBandPctChange),
      },
    ],
  });
  const figure = figs.next(
    chart,
    `Change in the share of starts short of energy with one and with two accumulators and in the share of first preflights out of band at ${base.name} in ${month} (its worst month with one accumulator), each variant run over the same climate years; the largest change in the short share with one first. Planning estimates.`,
  );
  const b = w.baseline;
  const table: TableRow[] = [
    {
      cells: [
        "As planned",
        `${pct(b.shortPctOne)}`,
        `${pct(b.shortPctTwo)}`,
        `${pct(b.outOfBandPct)}`,
        "",
        "",
        "",
      ],
    },
    ...rows.map((r) => ({
      cells: [
        r.label,
        pct(r.shortPctOne),
        pct(r.shortPctTwo),
        pct(r.outOfBandPct),
        change(r.shortPctOneChange),
        change(r.shortPctTwoChange),
        change(r.outOfBandPctChange),
      ],
    })),
  ];
  return {
    shown: true,
    month,
    note: `${b.starts} starts and ${b.preflights} first preflights in ${month} over the climate years, as planned.`,
    figure,
    table,
  };
}
