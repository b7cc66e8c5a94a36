/** Plan-file quantities as zod schemas: a string field read into SI by a parser of the units module. */
import { z } from "zod";
import { QuantityError } from "../units/index.js";

/** A string field parsed by `parser`; a parse failure becomes a zod issue at that path. */
export function q<T>(parser: (s: string) => T) {
  return z.string().transform((s, ctx): T => {
    try {
      return parser(s);
    } catch (err) {
      if (err instanceof QuantityError) {
        ctx.addIssue({ code: "custom", message: err.message });
        return z.NEVER;
      }
      throw err;
    }
  });
}
