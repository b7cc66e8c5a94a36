/**
 * Command-line options that hold quantities with units: the same grammar as the plan file
 * (`units/parse.ts`), with errors that name the option instead of a file line.
 */
import { InputError } from "../errors.js";
import { QuantityError } from "../units/index.js";

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
