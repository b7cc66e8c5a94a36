/** Plan-file quantities as zod schemas: a string field read into SI by a parser of the units module. */
import { z } from "zod";
import { QuantityError } from "../units/index.js";

/** The start of the message of a quantity written as something other than text. */
export const QUANTITY_TYPE_MESSAGE = "expected a quantity with its unit, in quotes";

/** What a YAML value is, for a message of a wrong type: "nothing", "a list", "a mapping", "a number". */
export function foundText(input: unknown): string {
  if (input === null) return "nothing";
  if (Array.isArray(input)) return "a list";
  return typeof input === "object" ? "a mapping" : `a ${typeof input}`;
}

/** The message of a quantity field holding a number, list or mapping (undefined: zod's "missing"). */
function quantityTypeError(issue: { input?: unknown }): string | undefined {
  if (issue.input === undefined) return undefined;
  return `${QUANTITY_TYPE_MESSAGE} (e.g. "4.9 L"), found ${foundText(issue.input)}`;
}

/**
 * A string field parsed by `parser`; a parse failure becomes a zod issue at that path, and so does a
 * value `check` refuses (its message, e.g. the allowed range of `planLimits.ts`).
 */
export function q<T>(parser: (s: string) => T, check?: (value: T, text: string) => string | null) {
  return z.string({ error: quantityTypeError }).transform((s, ctx): T => {
    try {
      const value = parser(s);
      const problem = check?.(value, s) ?? null;
      if (problem !== null) {
        ctx.addIssue({ code: "custom", message: problem });
        return z.NEVER;
      }
      return value;
    } catch (err) {
      if (err instanceof QuantityError) {
        ctx.addIssue({ code: "custom", message: err.message });
        return z.NEVER;
      }
      throw err;
    }
  });
}
