/**
 * The overnight hangar of a base in the plan file (docs/methods.md §3, "Hangars"): its kind, heated
 * (`heatedTo`) or an unheated shelter (`timeConstant`, `offset`), its local `in` and `out` times and
 * the `months` it is used.
 */
import { z } from "zod";
import {
  parseClockMinutes,
  parseTemperatureDifferenceK,
  parseTemperatureK,
  parseTimeS,
} from "../units/index.js";
import { MONTH_NAMES } from "./calendar.js";
import { q } from "./planQuantity.js";

const clock = q(parseClockMinutes);

const monthName = z.union([z.number(), z.string()]).transform((v, ctx) => {
  const i =
    typeof v === "number"
      ? Number.isInteger(v) && v >= 1 && v <= 12
        ? v - 1
        : -1
      : MONTH_NAMES.findIndex((m) => v.length >= 3 && v.toLowerCase().startsWith(m.toLowerCase()));
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
 * `months` limits it to part of the year. The former fixed `temperature` is refused in `parsePlanText`
 * (planFile.ts).
 */
export const hangarSchema = z
  .strictObject({
    kind: z.enum(["heated", "shelter"]).optional(),
    heatedTo: q(parseTemperatureK).optional(),
    timeConstant: q(parseTimeS).optional(),
    offset: q(parseTemperatureDifferenceK).optional(),
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
