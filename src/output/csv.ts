/**
 * CSV text, one definition for every CSV the tool writes (the plan's result tables, `coldsoak climate
 * --csv`): RFC 4180 quoting, CRLF line ends, and text a spreadsheet would run as a formula neutralised.
 *
 * A text cell starting with `=`, `+`, `-`, `@`, a tab or a carriage return gets a leading apostrophe
 * (OWASP, "CSV Injection"), so `=cmd|' /C calc'!A0` reads `'=cmd|' /C calc'!A0` and is shown as text.
 * Typed numbers are never text: a negative number stays a number (`-3.5`).
 */
import { formatMachine } from "../units/index.js";

/** A cell as its table declares it: text, a number, a yes/no, or no value. */
export type Cell = string | number | boolean | null;

export interface Table {
  name: string;
  columns: string[];
  rows: Cell[][];
}

/** First characters that make a spreadsheet read a text cell as a formula. */
const FORMULA_START = /^[=+\-@\t\r]/;

/** One cell's CSV text: numbers by `formatMachine` (non-finite: empty), booleans yes/no, text neutralised. */
export function csvCell(c: Cell): string {
  if (c === null) return "";
  if (typeof c === "number") return Number.isFinite(c) ? formatMachine(c) : "";
  if (typeof c === "boolean") return c ? "yes" : "no";
  const text = FORMULA_START.test(c) ? `'${c}` : c;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The CSV text of a table: a header row, then its rows, every record ending in CRLF. */
export function toCsv(t: Table): string {
  return `${[t.columns, ...t.rows].map((r) => r.map(csvCell).join(",")).join("\r\n")}\r\n`;
}
