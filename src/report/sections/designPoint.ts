/**
 * Report section "Design point" of a base (partial `designPoint`): for each profile flown at the base,
 * the start energy against the morning's temperature (one and two accumulators at the precharge
 * lines, after the base's typical and P90 overnight drops, and the requirement) with the break-even
 * temperatures, and a short worksheet at the cold design point (the base's 1-in-10-year coldest
 * morning). Reads `BaseResult.designWorksheets`, `designPoint`, `profileCurves[].breakEven` and
 * `coldest1in10C`.
 */
import type {
  BaseResult,
  BreakEvenRow,
  DesignMargin,
  DesignWorksheet,
  EnergyCurveRow,
} from "../../plan/results.js";
import { formatDisplay, pct, showWithUnit, type UnitSystem } from "../../units/index.js";
import { type LineSeries, PALETTE, xyChart } from "../charts.js";
import type { BaseContext, Figure, TableRow } from "../shared.js";

export interface DesignProfileView {
  name: string;
  figure: Figure;
  worksheet: TableRow[];
  breakEven: TableRow[];
  twoLabel: string;
}

export interface DesignPointView {
  profiles: DesignProfileView[];
}

/** "−12.3 °F", or why there is none. */
function breakEvenText(r: BreakEvenRow | undefined, u: UnitSystem): string {
  if (r === undefined) return "–";
  return r.ambientC === null ? `none: ${r.reason}` : showWithUnit(u.temp, r.ambientC);
}

const sameCase = (a: BreakEvenRow, b: BreakEvenRow) =>
  a.units === b.units && a.precharge === b.precharge && a.system === b.system;

/** Break-even temperatures of every case: at equilibrium, after the typical and after the P90 drop. */
function breakEvenTable(base: BaseResult, profile: string, u: UnitSystem): TableRow[] {
  const equilibrium = base.profileCurves.find((p) => p.name === profile)?.breakEven ?? [];
  const drops = base.designPoint.filter((r) => r.profile === profile);
  return equilibrium.map((r) => ({
    cells: [
      `${r.count} × ${r.precharge} precharge, ${r.system} system`,
      breakEvenText(r, u),
      breakEvenText(
        drops.find((d) => d.drop === "typical" && sameCase(d, r)),
        u,
      ),
      breakEvenText(
        drops.find((d) => d.drop === "p90" && sameCase(d, r)),
        u,
      ),
    ],
  }));
}

function marginsText(margins: DesignMargin[], units: 1 | 2): string {
  const words = { none: "at equilibrium", typical: "after the typical drop", p90: "after the P90 drop" };
  const parts = margins.filter((m) => m.units === units).map((m) => `${pct(m.marginPct)} % ${words[m.drop]}`);
  return parts.length > 0 ? parts.join("; ") : "–";
}

const number = (v: number | null, digits: number) => (v === null ? "–" : formatDisplay(v, digits));

/** The worksheet at the cold design point, one line per item. */
function worksheetRows(w: DesignWorksheet, u: UnitSystem): TableRow[] {
  const T = (c: number | null) => showWithUnit(u.temp, c);
  const P = (kPa: number | null) => showWithUnit(u.pressure, kPa);
  const V = (l: number | null) => showWithUnit(u.volume, l);
  const two = w.recharge.find((r) => r.units === 2)?.count ?? 2;
  const rows: [string, string][] = [
    ["Cold design point (1-in-10-year coldest morning)", T(w.designTempC)],
    [
      "Overnight drop of the accumulator, typical / P90",
      `${showWithUnit(u.tempDelta, w.dropTypicalC)} / ${showWithUnit(u.tempDelta, w.dropP90C)}`,
    ],
  ];
  if (w.designTempC !== null) {
    rows.push(
      [
        "Precharge there: low / nominal / high line",
        `${P(w.prechargeLowKPaGauge)} / ${P(w.prechargeKPaGauge)} / ${P(w.prechargeHighKPaGauge)}`,
      ],
      ["Precharge ÷ nominal system pressure (both absolute)", number(w.prechargeRatio, 3)],
      [
        "Gas volume: empty (V0) / full (Vmin) / charged / after one start",
        `${V(w.gasVolumeEmptyL)} / ${V(w.gasVolumeFullL)} / ${V(w.gasVolumeChargedL)} (reading ${pct(w.readingPct)} %) / ${V(w.gasVolumeEndL)}`,
      ],
      ["Energy required there", showWithUnit(u.energy, w.requiredJ)],
      ["Margin, one accumulator, low-side precharge", marginsText(w.margins, 1)],
      [`Margin, ${two} accumulators, low-side precharge`, marginsText(w.margins, 2)],
    );
  }
  const relief = w.reliefKPaGauge === null ? "no relief valve" : `relief at ${P(w.reliefKPaGauge)}`;
  rows.push([
    "Peak trapped pressure at the base against the system's high limit",
    `${P(w.peakTrappedKPaGauge)} against ${P(w.systemHighKPaGauge)} (${relief})`,
  ]);
  if (w.recharge.length > 0) {
    rows.push([
      "Recharge after one start there, against the pump's timer",
      w.recharge
        .map(
          (r) =>
            `${r.count} × ${r.reachedSystem ? `${number(r.timeS, 0)} s` : "not reached"} of a ${number(r.timerS, 0)} s timer`,
        )
        .join("; "),
    ]);
  }
  return rows.map(([label, value]) => ({ cells: [label, value] }));
}

/** Points of one energy line of the curve in the report's units (kJ). */
function energyLine(
  curve: EnergyCurveRow[],
  u: UnitSystem,
  value: (r: EnergyCurveRow) => number | null,
): LineSeries["points"] {
  return curve.map((r) => {
    const v = value(r);
    return { x: u.temp.convert(r.tempC), y: v === null ? null : u.energy.convert(v) };
  });
}

/** A single marked point at a break-even temperature on the requirement (none without one). */
function markAt(r: BreakEvenRow | undefined, curve: EnergyCurveRow[], u: UnitSystem): LineSeries["points"] {
  if (r === undefined || r.ambientC === null || curve.length < 2) return [];
  const c = r.ambientC;
  const i = curve.findIndex((x) => x.tempC >= c);
  const [a, b] = i <= 0 ? [curve[0]!, curve[1]!] : [curve[i - 1]!, curve[i]!];
  const required = a.requiredJ + ((b.requiredJ - a.requiredJ) * (c - a.tempC)) / (b.tempC - a.tempC);
  return [{ x: u.temp.convert(c), y: u.energy.convert(required) }];
}

async function profileView(ctx: BaseContext, w: DesignWorksheet, id: string): Promise<DesignProfileView> {
  const { base, anchor, u } = ctx;
  const T = u.temp.unit;
  const two =
    w.recharge.find((r) => r.units === 2)?.count ?? w.margins.find((m) => m.units === 2)?.count ?? 2;
  const isNominal = (r: BreakEvenRow) => r.units === 1 && r.precharge === "nominal" && r.system === "nominal";
  const equilibrium = base.profileCurves.find((p) => p.name === w.profile)?.breakEven.find(isNominal);
  const afterP90 = base.designPoint.find((r) => r.profile === w.profile && r.drop === "p90" && isNominal(r));
  const curve = w.curve;
  const lines: LineSeries[] = [
    { name: "Required", color: PALETTE.black, points: energyLine(curve, u, (r) => r.requiredJ) },
    { name: "1, nominal precharge", color: PALETTE.blue, points: energyLine(curve, u, (r) => r.oneNominalJ) },
    {
      name: "1, after the typical drop",
      color: PALETTE.orange,
      dash: [6, 3],
      points: energyLine(curve, u, (r) => r.oneTypicalDropJ),
    },
    {
      name: "1, after the P90 drop",
      color: PALETTE.vermillion,
      dash: [2, 2],
      points: energyLine(curve, u, (r) => r.oneP90DropJ),
    },
    {
      name: `${two}, nominal precharge`,
      color: PALETTE.green,
      dash: [8, 2, 2, 2],
      points: energyLine(curve, u, (r) => r.twoNominalJ),
    },
    {
      name: "Break-even, 1 at equilibrium",
      color: PALETTE.blue,
      shape: "diamond",
      points: markAt(equilibrium, curve, u),
    },
    {
      name: "Break-even, 1 after the P90 drop",
      color: PALETTE.vermillion,
      shape: "triangle-up",
      points: markAt(afterP90, curve, u),
    },
  ];
  const temps = curve.map((r) => u.temp.convert(r.tempC));
  const chart = await xyChart({
    id: `${anchor}-${id}-energy`,
    title: `Profile ${w.profile} at ${base.name}: start energy against the morning's temperature`,
    xTitle: `Temperature in the morning (${T})`,
    yTitle: `Start energy (${u.energy.unit})`,
    ...(temps.length > 1 ? { xDomain: [Math.min(...temps), Math.max(...temps)] as [number, number] } : {}),
    yZero: true,
    width: 520,
    height: 240,
    bands: [
      {
        name: "1, low to high precharge",
        color: PALETTE.sky,
        points: curve.map((r) => ({
          x: u.temp.convert(r.tempC),
          y: u.energy.convert(r.oneLowJ),
          y2: u.energy.convert(r.oneHighJ),
        })),
      },
      {
        name: `${two}, low to high precharge`,
        color: PALETTE.green,
        points: curve.map((r) => ({
          x: u.temp.convert(r.tempC),
          y: u.energy.convert(r.twoLowJ),
          y2: u.energy.convert(r.twoHighJ),
        })),
      },
    ],
    lines,
  });
  const figure = ctx.figs.next(
    chart,
    `Hydraulic energy of one start with 1 and ${two} accumulators charged to the nominal system pressure, at equilibrium (shaded: the low to the high precharge line) and after the base's typical and P90 overnight drops (charged that much warmer, fluid trapped, cooled), against the energy a start needs; marks at the break-even temperatures, below which a start falls short. Real gas (Span et al. 2000), at ${base.name}'s atmosphere. Model estimate — not servicing data.`,
  );
  return {
    name: w.profile,
    figure,
    worksheet: worksheetRows(w, u),
    breakEven: breakEvenTable(base, w.profile, u),
    twoLabel: String(two),
  };
}

export async function designPointSection(ctx: BaseContext): Promise<DesignPointView> {
  const profiles: DesignProfileView[] = [];
  for (const [i, w] of ctx.base.designWorksheets.entries())
    profiles.push(await profileView(ctx, w, `d${i + 1}`));
  return { profiles };
}
