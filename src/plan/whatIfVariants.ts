/**
 * The what-if variants (docs/methods.md, "What-if variants"): each is the plan run again over the same
 * climate with one thing changed. A variant is a pure edit of the plan's settings, of the stays, of the
 * gas amount the technician services to, or of the energy a start needs; its name is what the plan's
 * `whatIf:` list and the results use.
 */
import type { HangarInput, Plan } from "./planFile.js";
import type { Stay } from "./schedule.js";

/** The names of the variants, in the order they are run and reported. */
export const WHAT_IF_NAMES = [
  "precharge-low",
  "precharge-high",
  "energy-minus-10",
  "energy-plus-10",
  "tau-half",
  "tau-double",
  "hangar",
  "first-start-later",
  "option-all",
] as const;

export type WhatIfName = (typeof WHAT_IF_NAMES)[number];

/** Multipliers of the required energy of the two energy variants. */
export const ENERGY_FACTORS = { "energy-minus-10": 0.9, "energy-plus-10": 1.1 } as const;
/** Multipliers of the thermal time constant. */
export const TAU_FACTORS = { "tau-half": 0.5, "tau-double": 2 } as const;
/** Minutes the first start of each day moves later. */
export const FIRST_START_LATER_MIN = 120;

/**
 * The heated hangar a base without one is given by the "hangar" variant: held at 10 °C (50 °F) or the
 * outdoor air where warmer, from 20:00 to 06:00 local, every month.
 */
export const DEFAULT_HANGAR = {
  kind: "heated",
  heatedTo: 283.15,
  in: 20 * 60,
  out: 6 * 60,
  months: null,
} as const satisfies HangarInput;

/** What a variant changes, applied by the what-if runner. */
export interface VariantEdit {
  /** The plan's settings (a copy; the original is never changed). */
  plan: Plan;
  stays: Stay[];
  /** The gas amount on arrival and after every servicing: the reference (nominal) or a tolerance line. */
  servicedTo: "nominal" | "low" | "high";
  /** Multiplier of the required energy of every start. */
  energyFactor: number;
}

/** One variant as the methods and the report describe it. */
export interface VariantDescription {
  name: WhatIfName;
  label: string;
  description: string;
}

const clock = (min: number) =>
  `${String(Math.floor(min / 60)).padStart(2, "0")}:${String(min % 60).padStart(2, "0")}`;

/** Each variant's label and what it changes, in words (the methods list them). */
export const VARIANT_DESCRIPTIONS: readonly VariantDescription[] = [
  {
    name: "precharge-low",
    label: "Precharge at the low tolerance line",
    description:
      "the gas amount on arrival and after every servicing is the amount through the reference minus its tolerance, instead of the reference; checks, tolerance and band are unchanged",
  },
  {
    name: "precharge-high",
    label: "Precharge at the high tolerance line",
    description:
      "the gas amount on arrival and after every servicing is the amount through the reference plus its tolerance",
  },
  {
    name: "energy-minus-10",
    label: "Required energy −10 %",
    description: `the start-energy table × ${ENERGY_FACTORS["energy-minus-10"]}`,
  },
  {
    name: "energy-plus-10",
    label: "Required energy +10 %",
    description: `the start-energy table × ${ENERGY_FACTORS["energy-plus-10"]}`,
  },
  {
    name: "tau-half",
    label: "Thermal time constant ×0.5",
    description: `every profile's thermal time constant × ${TAU_FACTORS["tau-half"]}`,
  },
  {
    name: "tau-double",
    label: "Thermal time constant ×2",
    description: `every profile's thermal time constant × ${TAU_FACTORS["tau-double"]}`,
  },
  {
    name: "hangar",
    label: "Hangar off, or a heated hangar where none",
    description: `a base with an overnight hangar goes without it; a base without one gets a heated hangar held at 10 °C (50 °F) or the outdoor air where warmer, from ${clock(DEFAULT_HANGAR.in)} to ${clock(DEFAULT_HANGAR.out)} local, every month`,
  },
  {
    name: "first-start-later",
    label: "First start 2 h later",
    description: `the first start of each day (the preflight) ${FIRST_START_LATER_MIN / 60} h later, at most 23:59; later starts at or before it are left out`,
  },
  {
    name: "option-all",
    label: "Cold-start option on every aircraft",
    description: "every stay with the cold-start option fitted",
  },
];

export function variantDescription(name: WhatIfName): VariantDescription {
  return VARIANT_DESCRIPTIONS.find((v) => v.name === name)!;
}

/** A variant's label at one base: the hangar variant says whether it takes the hangar away or adds one. */
export function variantLabel(name: WhatIfName, base: { hangar?: HangarInput | undefined }): string {
  if (name !== "hangar") return variantDescription(name).label;
  return base.hangar === undefined ? "Heated hangar overnight (10 °C, 50 °F)" : "Hangar off";
}

/** The start times with the first moved later (capped at 23:59), later ones at or before it left out. */
function laterFirstStart(startTimes: number[]): number[] {
  const first = Math.min(startTimes[0]! + FIRST_START_LATER_MIN, 24 * 60 - 1);
  return [first, ...startTimes.slice(1).filter((m) => m > first)];
}

/**
 * The edit of one variant on one base's plan: `baseIndex` names the base whose hangar the "hangar"
 * variant switches. The baseline (null) changes nothing.
 */
export function variantEdit(
  name: WhatIfName | null,
  plan: Plan,
  stays: Stay[],
  baseIndex: number,
): VariantEdit {
  const edit: VariantEdit = { plan, stays, servicedTo: "nominal", energyFactor: 1 };
  switch (name) {
    case null:
      return edit;
    case "precharge-low":
      return { ...edit, servicedTo: "low" };
    case "precharge-high":
      return { ...edit, servicedTo: "high" };
    case "energy-minus-10":
    case "energy-plus-10":
      return { ...edit, energyFactor: ENERGY_FACTORS[name] };
    case "tau-half":
    case "tau-double": {
      const f = TAU_FACTORS[name];
      const profiles = plan.profiles.map((p) => ({ ...p, thermalTimeConstant: p.thermalTimeConstant * f }));
      return { ...edit, plan: { ...plan, profiles } };
    }
    case "hangar": {
      const bases = plan.bases.map((b, i) => {
        if (i !== baseIndex) return b;
        const { hangar, ...rest } = b;
        return hangar === undefined ? { ...rest, hangar: { ...DEFAULT_HANGAR } } : rest;
      });
      return { ...edit, plan: { ...plan, bases } };
    }
    case "first-start-later": {
      const operations = { ...plan.operations, startTimes: laterFirstStart(plan.operations.startTimes) };
      return { ...edit, plan: { ...plan, operations } };
    }
    case "option-all":
      return { ...edit, stays: stays.map((s) => ({ ...s, coldStartOption: true })) };
  }
}
