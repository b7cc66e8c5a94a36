/**
 * The YAML side of the plan file: the document read with its positions (an alias bomb refused), the line
 * of a YAML path, a value's text as written, and the located message of a validation issue
 * (`plan.yaml:LINE:yaml.path: "as written": what was expected`).
 */
import { type Document, isMap, isPair, isScalar, isSeq, LineCounter, parseDocument, visit } from "yaml";
import type { z } from "zod";
import { type InputError, inputError } from "../errors.js";
import { foundText, QUANTITY_TYPE_MESSAGE } from "./planQuantity.js";

/** "profiles[0].precharge.reference" */
export function yamlPathText(path: readonly PropertyKey[]): string {
  let out = "";
  for (const p of path) {
    if (typeof p === "number") out += `[${p}]`;
    else out += out === "" ? String(p) : `.${String(p)}`;
  }
  return out;
}

/** Line of a YAML path, 1-based (the nearest existing parent when absent). */
export function nodeLine(doc: Document, lc: LineCounter, path: (string | number)[]): number {
  for (let n = path.length; n >= 0; n--) {
    const node = n === 0 ? doc.contents : doc.getIn(path.slice(0, n), true);
    const range = (node as { range?: [number, number, number] } | undefined)?.range;
    if (node !== undefined && node !== null && range) return lc.linePos(range[0]).line;
  }
  return 1;
}

/** The text of a YAML node as written: a scalar's source, a collection's items joined by ", ". */
export function writtenText(node: unknown): string | null {
  if (isScalar(node)) return node.source ?? String(node.value);
  if (isSeq(node)) return node.items.map(writtenText).join(", ");
  if (isMap(node)) return node.items.map((p) => `${writtenText(p.key)}: ${writtenText(p.value)}`).join(", ");
  return null;
}

const article = (noun: string) => (/^[aeiou]/.test(noun) ? `an ${noun}` : `a ${noun}`);

/** What a validation issue says to the user. */
export function describeIssue(issue: z.core.$ZodIssue): string {
  switch (issue.code) {
    case "invalid_type": {
      const expected = issue.expected === "int" ? "whole number" : issue.expected;
      if (issue.input === undefined) {
        return `missing; expected ${expected === "nonoptional" ? "a value" : article(expected)}`;
      }
      if (typeof issue.input === "number" && (expected === "number" || expected === "whole number"))
        return `expected a finite ${expected}`; // .inf, .nan
      if (issue.message.startsWith(QUANTITY_TYPE_MESSAGE)) return issue.message;
      return `expected ${article(expected)}, found ${foundText(issue.input)}`;
    }
    case "unrecognized_keys":
      return `unknown key${issue.keys.length > 1 ? "s" : ""} ${issue.keys.map((k) => `"${k}"`).join(", ")}`;
    case "invalid_value":
      return `expected one of ${issue.values.map((v) => JSON.stringify(v)).join(", ")}`;
    case "invalid_union":
      return "expected a count 1–7 or a list of day names";
    case "too_small":
      return issue.origin === "array"
        ? `expected at least ${issue.minimum} item${Number(issue.minimum) > 1 ? "s" : ""}`
        : issue.origin === "string"
          ? "expected a non-empty text"
          : `expected a number ${issue.inclusive ? "≥" : ">"} ${issue.minimum}`;
    case "too_big":
      return `expected a number ${issue.inclusive ? "≤" : "<"} ${issue.maximum}`;
    default:
      return issue.message;
  }
}

/** The plan's YAML document with its line counter and its plain data; InputError when it is not a YAML mapping. */
export function planDocument(text: string, file: string): { doc: Document; lc: LineCounter; raw: unknown } {
  const lc = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lc, prettyErrors: false, uniqueKeys: true });
  const yamlError = doc.errors[0];
  if (yamlError !== undefined) {
    const line = lc.linePos(yamlError.pos[0]).line;
    throw inputError(file, line, undefined, `not valid YAML: ${yamlError.message.split("\n")[0]}`);
  }
  if (!isMap(doc.contents)) {
    throw inputError(
      file,
      1,
      undefined,
      "expected a YAML mapping with the keys name, climate, bases, profiles, operations, nitrogen",
    );
  }
  return { doc, lc, raw: planData(doc, lc, file) };
}

/** Expansions of YAML aliases allowed while reading a plan (the `yaml` library's resource-exhaustion guard). */
export const MAX_ALIAS_COUNT = 100;

/**
 * The plan's YAML as plain data; a file whose aliases expand beyond `MAX_ALIAS_COUNT` (an alias bomb,
 * "billion laughs") is refused at its first alias.
 */
function planData(doc: Document, lc: LineCounter, file: string): unknown {
  try {
    return doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (err) {
    if (!(err instanceof ReferenceError)) throw err;
    let where: { line: number; path: string } | null = null;
    visit(doc, {
      Alias(_key, node, path) {
        const keys = path.flatMap((n) => (isPair(n) && isScalar(n.key) ? [String(n.key.value)] : []));
        where = { line: node.range ? lc.linePos(node.range[0]).line : 1, path: keys.join(".") };
        return visit.BREAK;
      },
    });
    const at = where as { line: number; path: string } | null;
    throw inputError(
      file,
      at?.line ?? 1,
      at?.path || undefined,
      `its aliases expand more than ${MAX_ALIAS_COUNT} times (an alias bomb); expected a plan that writes its values out`,
    );
  }
}

/**
 * The issue to report: of a union (weekdays: a count or a list of names), the issue of the branch the
 * value's type chose, with its full path; any other issue as it is.
 */
function innermost(issue: z.core.$ZodIssue): z.core.$ZodIssue {
  if (issue.code !== "invalid_union") return issue;
  const branch = issue.errors.find(
    (b) => b.length > 0 && !(b[0]!.code === "invalid_type" && b[0]!.path.length === 0),
  );
  const inner = branch?.[0];
  return inner === undefined ? issue : innermost({ ...inner, path: [...issue.path, ...inner.path] });
}

/**
 * The message of an issue after the value as written, when it is a scalar and the message does not
 * start by quoting it (or the part of it at fault, as the units parsers do).
 */
function withWritten(message: string, written: string | null): string {
  if (written === null || message.startsWith('"')) return message;
  return `"${written}": ${message}`;
}

/** The located error of a validation issue, the value quoted as written where it is a scalar. */
export function issueError(
  file: string,
  doc: Document,
  lc: LineCounter,
  first: z.core.$ZodIssue,
): InputError {
  const issue = innermost(first);
  const path = issue.path.filter((p): p is string | number => typeof p !== "symbol");
  const where = issue.code === "unrecognized_keys" ? [...path, issue.keys[0]!] : path;
  const node = doc.getIn(path, true);
  const written = isScalar(node) ? writtenText(node) : null;
  return inputError(
    file,
    nodeLine(doc, lc, where),
    yamlPathText(path) || "(top)",
    withWritten(describeIssue(issue), written),
  );
}
