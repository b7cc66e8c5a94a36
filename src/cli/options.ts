/**
 * Command-line options that hold quantities with units: the same grammar as the plan file
 * (`units/parse.ts`), with errors that name the option instead of a file line.
 */
import { InputError } from "../errors.js";
import type { PlanFile, ProfileInput } from "../plan/planFile.js";
import {
  cToK,
  fToK,
  kToC,
  parseTemperatureDifferenceOnScale,
  parseTemperatureOnScale,
  QuantityError,
  showWithUnit,
  type TemperatureScale,
  unitSystem,
} from "../units/index.js";

/**
 * Parses an option's text with one of the units parsers. A malformed quantity becomes the one-line
 * usage error `<option>: <what was wrong>; e.g. <example>` (InputError, exit 2).
 */
export function parseOption<T>(option: string, example: string, parse: (text: string) => T, text: string): T {
  try {
    return parse(text);
  } catch (err) {
    if (err instanceof QuantityError) throw new InputError(`${option}: ${err.message}; e.g. ${example}`);
    throw err;
  }
}

/** The plan's profile named by `--profile` (default: its first), or a usage error listing the names. */
export function profileOption(plan: Pick<PlanFile, "profiles">, name: string | undefined): ProfileInput {
  const profile = name === undefined ? plan.profiles[0]! : plan.profiles.find((p) => p.name === name);
  if (profile === undefined) {
    throw new InputError(
      `--profile: unknown profile "${name}"; the plan has ${plan.profiles.map((p) => `"${p.name}"`).join(", ")}`,
    );
  }
  return profile;
}

/** `--from`, `--to`, `--step` as written (temperatures in the plan's unit, or with their unit). */
export interface TemperatureRangeOptions {
  from?: string;
  to?: string;
  step?: string;
}

/** A table's temperatures: in the plan's unit (°F or °C) as shown, and in kelvin. */
export interface TemperatureRange {
  temps: number[];
  tempsK: number[];
  fromK: number;
  toK: number;
}

/** A temperature option in the plan's unit: a bare number (-40) or a temperature with its unit (-40C). */
function tempOption(option: string, text: string | undefined, fallback: number, scale: TemperatureScale) {
  if (text === undefined) return fallback;
  const example = `${option} -40 (the plan's unit) or ${option} -40C`;
  return parseOption(option, example, (t) => parseTemperatureOnScale(t, scale), text);
}

/**
 * The temperatures of `--from`, `--to` and `--step` in the plan's units (defaults −60 to 140 °F, or
 * −50 to 60 °C, in steps of 10): the `band` and `energy` commands' range, at most 10,000 rows,
 * between 150 K and 450 K.
 */
export function temperatureRangeOption(
  plan: Pick<PlanFile, "units">,
  opts: TemperatureRangeOptions,
): TemperatureRange {
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
  const toK = us ? fToK : cToK;
  if (toK(from) < 150 || toK(to) > 450) {
    const u = unitSystem(plan.units);
    throw new InputError(
      `--from/--to: expected temperatures between ${showWithUnit(u.temp, kToC(150))} and ${showWithUnit(u.temp, kToC(450))}`,
    );
  }
  return { temps, tempsK: temps.map(toK), fromK: toK(from), toK: toK(to) };
}

/** A table for the terminal: every column right-aligned to its widest cell, two spaces apart. */
export function alignedLines(header: string[], body: string[][]): string[] {
  const widths = header.map((h, c) => Math.max(h.length, ...body.map((b) => b[c]!.length)));
  const line = (cells: string[]) => cells.map((x, c) => x.padStart(widths[c]!)).join("  ");
  return [line(header), ...body.map(line)];
}
