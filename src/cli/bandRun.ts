import { InputError } from "../errors.js";
import { bandCurves } from "../plan/bandCurves.js";
import { loadPlan } from "../plan/planFile.js";
import {
  cToK,
  formatDisplay,
  formatMachine,
  fToK,
  kToC,
  parseTemperatureDifferenceOnScale,
  parseTemperatureOnScale,
  pct,
  STANDARD_ATMOSPHERE_PA,
  show,
  showWithUnit,
  type TemperatureScale,
  unitSystem,
} from "../units/index.js";
import { parseOption } from "./options.js";

export interface BandCliOptions {
  profile?: string;
  from?: string;
  to?: string;
  step?: string;
  json?: boolean;
}

/** A temperature option in the plan's unit: a bare number (-40) or a temperature with its unit (-40C). */
function tempOption(option: string, text: string | undefined, fallback: number, scale: TemperatureScale) {
  if (text === undefined) return fallback;
  const example = `${option} -40 (the plan's unit) or ${option} -40C`;
  return parseOption(option, example, (t) => parseTemperatureOnScale(t, scale), text);
}

/** The band table as the command prints it (`--json` shape, README). */
export async function bandCommand(
  planFile: string,
  opts: BandCliOptions,
): Promise<{ text: string; json: object }> {
  const plan = await loadPlan(planFile);
  const profile =
    opts.profile === undefined ? plan.profiles[0]! : plan.profiles.find((p) => p.name === opts.profile);
  if (profile === undefined) {
    throw new InputError(
      `--profile: unknown profile "${opts.profile}"; the plan has ${plan.profiles.map((p) => `"${p.name}"`).join(", ")}`,
    );
  }
  const us = plan.units === "us";
  const scale: TemperatureScale = us ? "F" : "C";
  const from = tempOption("--from", opts.from, us ? -60 : -50, scale);
  const to = tempOption("--to", opts.to, us ? 140 : 60, scale);
  const step =
    opts.step === undefined
      ? 10
      : parseOption(
          "--step",
          "--step 5 (the plan's unit) or --step 5C",
          (t) => parseTemperatureDifferenceOnScale(t, scale),
          opts.step,
        );
  if (!(step > 0)) throw new InputError(`--step: "${opts.step}"; expected a step above zero`);
  if (!(to >= from)) throw new InputError(`--to: ${to} is below --from ${from}; expected --from ≤ --to`);
  const count = Math.floor((to - from) / step + 1e-9) + 1;
  if (count > 10_000) throw new InputError(`--step: ${count} rows; expected at most 10000`);
  const temps: number[] = [];
  for (let i = 0; i < count; i++) temps.push(from + i * step);
  const u = unitSystem(plan.units);
  const toK = us ? fToK : cToK;
  if (toK(from) < 150 || toK(to) > 450) {
    throw new InputError(
      `--from/--to: expected temperatures between ${showWithUnit(u.temp, kToC(150))} and ${showWithUnit(u.temp, kToC(450))}`,
    );
  }
  const rows = bandCurves(profile, temps.map(toK), STANDARD_ATMOSPHERE_PA);
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
  const widths = header.map((h, c) => Math.max(h.length, ...body.map((b) => b[c]!.length)));
  const line = (cells: string[]) => cells.map((x, c) => x.padStart(widths[c]!)).join("  ");
  const text = [
    `Profile "${profile.name}": precharge line (tolerance lines) and readings at system pressure, real gas (ideal for comparison); gauge at 101.325 kPa`,
    line(header),
    ...body.map(line),
  ].join("\n");
  return { text, json };
}

/** `coldsoak band` once its options are parsed: prints the table or its JSON. */
export async function bandAction(planFile: string, opts: BandCliOptions): Promise<void> {
  const { text, json } = await bandCommand(planFile, opts);
  process.stdout.write(opts.json ? `${JSON.stringify(json, null, 2)}\n` : `${text}\n`);
}
