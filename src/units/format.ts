/**
 * The two ways a number becomes text, one function each:
 * - `formatDisplay`: for people (report, terminal summaries, precharge and band tables): fixed
 *   decimals, thousands grouped by commas, a true minus sign, "–" for no value;
 * - `formatMachine`: for files read by programs (CSV cells, results.json, `--json`): plain JavaScript
 *   number text with at most 6 decimals, stable so that the same inputs give byte-identical files.
 */

/**
 * Formats a number for display with fixed decimals, thousands grouped by commas, a true minus sign
 * (U+2212, as on the chart axes), and "–" for null or non-finite values. Negative zero prints as 0.
 */
export function formatDisplay(value: number | null | undefined, digits: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  let text = value.toFixed(digits);
  if (/^-0(\.0*)?$/.test(text)) text = text.slice(1);
  const [whole = "", frac] = text.split(".");
  const sign = whole.startsWith("-") ? "-" : "";
  const digitsOnly = sign ? whole.slice(1) : whole;
  const grouped = digitsOnly.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const minus = sign ? "\u2212" : "";
  return frac === undefined ? `${minus}${grouped}` : `${minus}${grouped}.${frac}`;
}

/** Formats a percentage (0–100) for display with one decimal. */
export function pct(value: number | null | undefined): string {
  return formatDisplay(value, 1);
}

/**
 * A number as machine text: integers as they are, other numbers rounded to 6 decimals and written in
 * JavaScript's shortest form ("0.5", not "0.500000"); negative zero as 0.
 */
export function formatMachine(x: number): string {
  if (Number.isInteger(x)) return String(x);
  const r = Number(x.toFixed(6));
  return String(Object.is(r, -0) ? 0 : r);
}
