/**
 * JSON text for programs (results.json and the screen's JSON): key order as built, numbers with at
 * most 6 decimals (`formatMachine`), two-space indent, a final newline. The same text comes whole
 * (`machineJson`) or in pieces (`machineJsonPieces`), for a file too large to hold twice in memory.
 */
import { formatMachine } from "../units/index.js";

/** Rounds numbers that are not whole to at most 6 decimals; every other value passes unchanged. */
function machineValue(_key: string, v: unknown): unknown {
  return typeof v === "number" && !Number.isInteger(v) && Number.isFinite(v) ? Number(formatMachine(v)) : v;
}

/** JSON text for programs: key order as built, numbers with at most 6 decimals, two-space indent. */
export function machineJson(r: object): string {
  return `${JSON.stringify(r, machineValue, 2)}\n`;
}

/** Values JSON leaves out of an object and writes as null in an array. */
const omitted = (v: unknown): boolean => v === undefined || typeof v === "function" || typeof v === "symbol";

/** Objects and arrays walked here: neither with a `toJSON` of its own (JSON.stringify would call it). */
const walkable = (v: unknown): v is object =>
  v !== null && typeof v === "object" && typeof (v as { toJSON?: unknown }).toJSON !== "function";

/** The text of `v` at indent `indent`, walking `depth` more levels of objects and arrays in pieces. */
function* pieces(v: unknown, indent: string, depth: number): Generator<string> {
  if (depth === 0 || !walkable(v)) {
    // A value's own text, indented as JSON.stringify indents it inside its parents.
    yield JSON.stringify(v, machineValue, 2).replaceAll("\n", `\n${indent}`);
    return;
  }
  const inner = `${indent}  `;
  if (Array.isArray(v)) {
    if (v.length === 0) return yield "[]";
    for (let i = 0; i < v.length; i++) {
      yield `${i === 0 ? "[" : ","}\n${inner}`;
      if (omitted(v[i])) yield "null";
      else yield* pieces(v[i], inner, depth - 1);
    }
    return yield `\n${indent}]`;
  }
  const entries = Object.entries(v).filter(([, x]) => !omitted(x));
  if (entries.length === 0) return yield "{}";
  for (const [i, [k, x]] of entries.entries()) {
    yield `${i === 0 ? "{" : ","}\n${inner}${JSON.stringify(k)}: `;
    yield* pieces(x, inner, depth - 1);
  }
  yield `\n${indent}}`;
}

/**
 * `machineJson(r)` in pieces: the pieces joined are that text byte for byte. The first `depth` levels
 * of objects and arrays are written here, key by key and item by item; below them each value is one
 * piece (so no piece is larger than the largest value that deep).
 *
 * @example [...machineJsonPieces({ a: [1, 2.5] })].join("") === machineJson({ a: [1, 2.5] })
 */
export function* machineJsonPieces(r: object, depth = 4): Generator<string> {
  yield* pieces(r, "", depth);
  yield "\n";
}
