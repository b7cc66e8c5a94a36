/**
 * `coldsoak band <plan.yaml> [--profile NAME] [--from T --to T --step T] [--json]`: the precharge line
 * with its tolerance lines and the low/nominal/high readings at system pressure against temperature,
 * real gas and ideal (docs/methods.md §3). Temperatures in the plan's unit (°F for us, °C for si);
 * gauge pressures relative to the standard sea-level atmosphere (101.325 kPa).
 */
import { bandCurves } from "../plan/bandCurves.js";
import { loadPlan } from "../plan/planFile.js";
import {
  formatDisplay,
  formatMachine,
  pct,
  STANDARD_ATMOSPHERE_PA,
  show,
  unitSystem,
} from "../units/index.js";
import {
  alignedLines,
  profileOption,
  type TemperatureRangeOptions,
  temperatureRangeOption,
} from "./options.js";

export interface BandCliOptions extends TemperatureRangeOptions {
  profile?: string;
  json?: boolean;
}

/** The band table as the command prints it (`--json` shape, README). */
export async function bandCommand(
  planFile: string,
  opts: BandCliOptions,
): Promise<{ text: string; json: object }> {
  const plan = await loadPlan(planFile);
  const profile = profileOption(plan, opts.profile);
  const { temps, tempsK } = temperatureRangeOption(plan, opts);
  const u = unitSystem(plan.units);
  const rows = bandCurves(profile, tempsK, STANDARD_ATMOSPHERE_PA);
  const json = {
    profile: profile.name,
    rows: rows.map((r) => ({
      tempC: Number(formatMachine(r.tempC)),
      prechargeKPaGauge: Number(formatMachine(r.prechargeKPaGauge)),
      prechargeLowKPaGauge: Number(formatMachine(r.prechargeLowKPaGauge)),
      prechargeHighKPaGauge: Number(formatMachine(r.prechargeHighKPaGauge)),
      readingLowPct: Number(formatMachine(r.readingLowPct)),
      readingNominalPct: Number(formatMachine(r.readingNominalPct)),
      readingHighPct: Number(formatMachine(r.readingHighPct)),
      idealReadingNominalPct: Number(formatMachine(r.idealReadingNominalPct)),
    })),
  };
  const p = (kPa: number) => show(u.pressure, kPa);
  const pu = u.pressure.unit;
  const tu = u.temp.unit;
  const header = [
    `temp ${tu}`,
    `precharge ${pu}`,
    `low ${pu}`,
    `high ${pu}`,
    "read low %",
    "nominal %",
    "high %",
    "ideal nom %",
  ];
  const body = rows.map((r, i) => [
    formatDisplay(temps[i]!, u.temp.digits),
    p(r.prechargeKPaGauge),
    p(r.prechargeLowKPaGauge),
    p(r.prechargeHighKPaGauge),
    pct(r.readingLowPct),
    pct(r.readingNominalPct),
    pct(r.readingHighPct),
    pct(r.idealReadingNominalPct),
  ]);
  const text = [
    `Profile "${profile.name}": precharge line (tolerance lines) and readings at system pressure, real gas (ideal for comparison); gauge at 101.325 kPa`,
    ...alignedLines(header, body),
  ].join("\n");
  return { text, json };
}

/** `coldsoak band` once its options are parsed: prints the table or its JSON. */
export async function bandAction(planFile: string, opts: BandCliOptions): Promise<void> {
  const { text, json } = await bandCommand(planFile, opts);
  process.stdout.write(opts.json ? `${JSON.stringify(json, null, 2)}\n` : `${text}\n`);
}
