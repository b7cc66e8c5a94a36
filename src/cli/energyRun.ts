/**
 * `coldsoak energy <plan.yaml> [--profile NAME] [--from T --to T --step T] [--drop ΔT] [--json]`: the
 * start energy one and two accumulators deliver against temperature, at the low, nominal and high
 * precharge lines and the low and nominal system pressures, against the profile's required energy,
 * with the break-even temperatures found by root finding on the real-gas model (docs/methods.md,
 * "Break-even temperatures"); with `--drop`, also after an overnight drop of that size. Temperatures in
 * the plan's unit; gauge pressures relative to the standard sea-level atmosphere (101.325 kPa).
 */
import { realGas } from "../physics/nitrogen.js";
import {
  afterDropBreakEven,
  type BreakEvenRow,
  ENERGY_CASES,
  type EnergyRow,
  energyProfile,
  energyRows,
  equilibriumBreakEven,
} from "../plan/breakEven.js";
import { loadPlanFile, type ProfileInput } from "../plan/planFile.js";
import {
  FAHRENHEIT_PER_KELVIN,
  formatMachine,
  gaugePa,
  kToC,
  PA_PER_KPA,
  parseTemperatureDifferenceOnScale,
  STANDARD_ATMOSPHERE_PA,
  show,
  showWithUnit,
  type UnitSystem,
  unitSystem,
} from "../units/index.js";
import { ENERGY_CAUTION } from "./energy.js";
import {
  alignedLines,
  parseOption,
  profileOption,
  type TemperatureRangeOptions,
  temperatureRangeOption,
} from "./options.js";

export interface EnergyCliOptions extends TemperatureRangeOptions {
  profile?: string;
  drop?: string;
  json?: boolean;
}

const num = (v: number) => Number(formatMachine(v));

function jsonRows(rows: EnergyRow[]) {
  return rows.map((r) => ({
    tempC: num(kToC(r.tempK)),
    requiredJ: num(r.requiredJ),
    energyJ: r.energyJ.map(num),
  }));
}

/** Break-even rows as JSON: units, count, precharge, system, ambientC (°C) and reason. */
function jsonBreakEven(rows: BreakEvenRow[]) {
  return rows.map((r) => ({
    units: r.units,
    count: r.count,
    precharge: r.precharge,
    system: r.system,
    ambientC: r.ambientC === null ? null : num(r.ambientC),
    reason: r.reason,
  }));
}

/** The energy table at one system pressure: temperature, requirement, and each precharge line for 1 and 2. */
function energyTable(rows: EnergyRow[], system: "low" | "nominal", count: number, u: UnitSystem): string[] {
  const cols = ENERGY_CASES.flatMap((c, i) => (c.system === system ? [{ c, i }] : []));
  const header = [
    `temp ${u.temp.unit}`,
    "required kJ",
    ...cols.map(({ c }) => `${c.units === 1 ? 1 : count}× ${c.precharge} kJ`),
  ];
  const body = rows.map((r) => [
    show(u.temp, kToC(r.tempK)),
    show(u.energy, r.requiredJ),
    ...cols.map(({ i }) => show(u.energy, r.energyJ[i]!)),
  ]);
  return alignedLines(header, body);
}

/** "−12.3 °F", or the reason no crossing lies in the range. */
export function breakEvenText(r: BreakEvenRow, u: UnitSystem): string {
  return r.ambientC === null ? `none: ${r.reason}` : showWithUnit(u.temp, r.ambientC);
}

function breakEvenLines(rows: BreakEvenRow[], u: UnitSystem): string[] {
  return alignedLines(
    ["units", "precharge", "system", "falls short below"],
    rows.map((r) => [String(r.count), r.precharge, r.system, breakEvenText(r, u)]),
  );
}

/** The system pressures of a profile as text ("3,000 psig"). */
function systemText(profile: ProfileInput, which: "low" | "nominal", u: UnitSystem): string {
  const p = profile.system[which];
  const gaugeKPa = gaugePa(p, STANDARD_ATMOSPHERE_PA) / PA_PER_KPA;
  return showWithUnit(u.pressure, gaugeKPa);
}

/** The energy tables and break-even temperatures as the command prints them (`--json` shape, README). */
export async function energyCommand(
  planFile: string,
  opts: EnergyCliOptions,
): Promise<{ text: string; json: object }> {
  const plan = await loadPlanFile(planFile);
  const profile = profileOption(plan, opts.profile);
  const range = temperatureRangeOption(plan, opts);
  const u = unitSystem(plan.units);
  const scale = plan.units === "us" ? "F" : "C";
  const dropK =
    opts.drop === undefined
      ? null
      : parseOption(
          "--drop",
          "--drop 20 (the plan's unit) or --drop 11C",
          (t) => parseTemperatureDifferenceOnScale(t, scale),
          opts.drop,
        ) / (scale === "F" ? FAHRENHEIT_PER_KELVIN : 1);
  const atmPa = STANDARD_ATMOSPHERE_PA;
  const p = energyProfile(profile, atmPa, realGas);
  const rows = energyRows(p, range.tempsK);
  const breakEven = equilibriumBreakEven(profile, atmPa, realGas, range);
  const drop =
    dropK === null
      ? null
      : {
          dropK,
          rows: energyRows(p, range.tempsK, dropK),
          breakEven: afterDropBreakEven(profile, atmPa, realGas, range, { drop: "typical", dropK }),
        };
  const count = profile.coldStartOption.count;
  const json = {
    profile: profile.name,
    atmosphereKPaAbsolute: atmPa / PA_PER_KPA,
    rangeC: { fromC: num(kToC(range.fromK)), toC: num(kToC(range.toK)) },
    cases: ENERGY_CASES.map((c) => ({ ...c, count: c.units === 1 ? 1 : count })),
    rows: jsonRows(rows),
    breakEven: jsonBreakEven(breakEven),
    drop:
      drop === null
        ? null
        : {
            dropC: num(drop.dropK),
            rows: jsonRows(drop.rows),
            breakEven: jsonBreakEven(drop.breakEven),
          },
  };
  const tables = (r: EnergyRow[]) => [
    `Charged to the nominal system pressure (${systemText(profile, "nominal", u)}):`,
    ...energyTable(r, "nominal", count, u),
    `Charged to the low system pressure (${systemText(profile, "low", u)}):`,
    ...energyTable(r, "low", count, u),
  ];
  const lines = [
    `Profile "${profile.name}": hydraulic start energy of 1 and ${count} accumulators at the low, nominal and high precharge lines against the required energy, real gas (Span et al. 2000), at equilibrium (accumulator at the ambient, charged to system pressure); gauge at 101.325 kPa`,
    ...tables(rows),
    `Break-even temperatures in ${showWithUnit(u.temp, kToC(range.fromK))} to ${showWithUnit(u.temp, kToC(range.toK))}, found by root finding on the real-gas model (below them a start falls short):`,
    ...breakEvenLines(breakEven, u),
  ];
  if (drop !== null) {
    lines.push(
      "",
      `After an overnight drop of ${showWithUnit(u.tempDelta, drop.dropK)} (charged that much warmer, fluid trapped, cooled to the temperature shown):`,
      ...tables(drop.rows),
      "Break-even temperatures after the drop:",
      ...breakEvenLines(drop.breakEven, u),
    );
  }
  lines.push("", ENERGY_CAUTION);
  return { text: lines.join("\n"), json };
}

/** `coldsoak energy` once its options are parsed: prints the tables or their JSON. */
export async function energyAction(planFile: string, opts: EnergyCliOptions): Promise<void> {
  const { text, json } = await energyCommand(planFile, opts);
  process.stdout.write(opts.json ? `${JSON.stringify(json, null, 2)}\n` : `${text}\n`);
}
