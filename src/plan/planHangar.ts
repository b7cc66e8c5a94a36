/**
 * The overnight hangar of a base in the plan file (docs/methods.md §3, "Hangars"): its kind, heated
 * (`heatedTo`) or an unheated shelter (`timeConstant`, `offset`), its local `in` and `out` times and
 * the `months` it is used.
 */
import { z } from "zod";
import { inputError } from "../errors.js";
import {
  parseClockMinutes,
  parseTemperatureDifferenceK,
  parseTemperatureK,
  parseTimeS,
} from "../units/index.js";
import { GAS_TEMPERATURE, limited, TEMPERATURE_OFFSET, TIME_CONSTANT } from "./planLimits.js";
import { q } from "./planQuantity.js";
import { yamlPathText } from "./planYaml.js";

const clock = q(parseClockMinutes);

const MONTH_FULL_NAMES = [
  "January",
  "February",
  "March",
  "April",
  "May",
  "June",
  "July",
  "August",
  "September",
  "October",
  "November",
  "December",
];

const monthName = z.union([z.number(), z.string()]).transform((v, ctx) => {
  // A month's name or its start of at least three letters ("Jan", "Sept", "March"), never more ("Janitor").
  const i =
    typeof v === "number"
      ? Number.isInteger(v) && v >= 1 && v <= 12
        ? v - 1
        : -1
      : MONTH_FULL_NAMES.findIndex((m) => v.length >= 3 && m.toLowerCase().startsWith(v.toLowerCase()));
  if (i < 0) {
    ctx.addIssue({ code: "custom", message: `"${v}" is not a month; expected Jan … Dec or a number 1–12` });
    return z.NEVER;
  }
  return i + 1;
});

/** Default time constant of an unheated shelter's air behind the outdoor air (docs/methods.md §3). */
export const SHELTER_TIME_CONSTANT_S = 6 * 3600;

/**
 * An overnight hangar (docs/methods.md §3, "Hangars"): `heated` holds its air at or above `heatedTo`;
 * an unheated `shelter` follows the outdoor air through its own lag `timeConstant` plus `offset`.
 * `months` limits it to part of the year. The former fixed `temperature` is refused by
 * `refuseFormerHangarKeys`.
 */
export const hangarSchema = z
  .strictObject({
    kind: z.enum(["heated", "shelter"]).optional(),
    heatedTo: limited(parseTemperatureK, GAS_TEMPERATURE).optional(),
    timeConstant: limited(parseTimeS, TIME_CONSTANT).optional(),
    offset: limited(parseTemperatureDifferenceK, TEMPERATURE_OFFSET).optional(),
    in: clock,
    out: clock,
    months: z
      .array(monthName)
      .min(1)
      .refine((m) => new Set(m).size === m.length, { message: "expected each month once" })
      .optional(),
  })
  .superRefine((h, ctx) => {
    const wrong = (key: string, message: string) => ctx.addIssue({ code: "custom", path: [key], message });
    if (h.kind === undefined) {
      wrong(
        "kind",
        "missing; expected kind: heated (with heatedTo) or kind: shelter (unheated, with timeConstant and offset)",
      );
    } else if (h.kind === "heated") {
      if (h.heatedTo === undefined)
        wrong("heatedTo", 'missing; a heated hangar needs its set point, e.g. heatedTo: "50 F"');
      if (h.timeConstant !== undefined) wrong("timeConstant", "belongs to kind: shelter, not kind: heated");
      if (h.offset !== undefined) wrong("offset", "belongs to kind: shelter, not kind: heated");
    } else if (h.heatedTo !== undefined) {
      wrong("heatedTo", "belongs to kind: heated; a shelter follows the outdoor air (timeConstant, offset)");
    }
  })
  .transform((h) => {
    const common = { in: h.in, out: h.out, months: h.months ?? null };
    return h.kind === "heated"
      ? { kind: "heated" as const, heatedTo: h.heatedTo!, ...common }
      : {
          kind: "shelter" as const,
          timeConstant: h.timeConstant ?? SHELTER_TIME_CONSTANT_S,
          offset: h.offset ?? 0,
          ...common,
        };
  });

/**
 * Keys that earlier plan files used and that now mean something else: refused with a located message
 * naming the keys that replace them (a fixed hangar temperature gave a 15 °C "heated" hangar colder than
 * July air and a −5 °C shelter colder than the air outside).
 */
export function refuseFormerHangarKeys(
  raw: unknown,
  file: string,
  lineOf: (path: (string | number)[]) => number,
): void {
  const bases = (raw as { bases?: unknown } | null)?.bases;
  if (!Array.isArray(bases)) return;
  bases.forEach((b, i) => {
    const hangar = (b as { hangar?: unknown } | null)?.hangar;
    if (hangar === null || typeof hangar !== "object" || !("temperature" in hangar)) return;
    const path = ["bases", i, "hangar", "temperature"];
    throw inputError(
      file,
      lineOf(path),
      yamlPathText(path),
      "a fixed hangar temperature is no longer read; write kind: heated with heatedTo (the set point: the inside is the warmer of it and the outdoor air), or kind: shelter (unheated: follows the outdoor air through timeConstant, default 6 h, plus offset)",
    );
  });
}
