/** Plan-file quantities as zod schemas: a string field read into SI by a parser of the units module. */
import { z } from "zod";
import { QuantityError } from "../units/index.js";

/**
 * A string field parsed by `parser`; a parse failure becomes a zod issue at that path, and so does a
 * value `check` refuses (its message, e.g. the allowed range of `planLimits.ts`).
 */
export function q<T>(parser: (s: string) => T, check?: (value: T, text: string) => string | null) {
  return z.string().transform((s, ctx): T => {
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
