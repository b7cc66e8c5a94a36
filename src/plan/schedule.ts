import { CsvError, parse } from "csv-parse/sync";
import { DateTime } from "luxon";
import { inputError } from "../errors.js";
import { readInputText } from "../fsutil.js";

export interface Stay {
  aircraft: string;
  base: string;
  /** First day of the stay, YYYY-MM-DD. */
  arrive: string;
  /** Day of departure (not part of the stay), YYYY-MM-DD. */
  depart: string;
  coldStartOption: boolean;
  profile: string;
  /** Line of the schedule file, for messages. */
  line: number;
}

const REQUIRED = ["aircraft", "base", "arrive", "depart"] as const;
const OPTIONAL = ["cold_start_option", "profile"] as const;
const YES = new Set(["yes", "y", "true", "1"]);
const NO = new Set(["no", "n", "false", "0", ""]);

/** Parses a strict calendar date; null if malformed or not a real date. */
export function parseIsoDate(text: string): DateTime | null {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(text)) return null;
  const d = DateTime.fromISO(text, { zone: "UTC" });
  return d.isValid ? d : null;
}

/**
 * Parses schedule text against the plan's base and profile names.
 * @throws InputError naming file, line and column.
 */
export function parseScheduleText(
  text: string,
  file: string,
  baseNames: string[],
  profileNames: string[],
): Stay[] {
  let rows: { record: string[]; info: { lines: number } }[];
  try {
    rows = parse(text, {
      bom: true,
      info: true,
      skip_empty_lines: true,
      trim: true,
      relax_column_count: true,
    }) as unknown as typeof rows;
  } catch (err) {
    if (err instanceof CsvError) {
      const line = typeof err["lines"] === "number" ? (err["lines"] as number) : undefined;
      throw inputError(file, line, undefined, `not valid CSV: ${err.message.replace(/^[^:]*: /, "")}`);
    }
    throw err;
  }
  const header = rows[0];
  if (header === undefined) {
    throw inputError(
      file,
      1,
      undefined,
      `empty schedule; expected a header row ${REQUIRED.join(",")}[,${OPTIONAL.join("][,")}]`,
    );
  }
  const names = header.record.map((h) => h.toLowerCase());
  const col = new Map<string, number>();
  names.forEach((n, i) => {
    if (!(REQUIRED as readonly string[]).includes(n) && !(OPTIONAL as readonly string[]).includes(n)) {
      throw inputError(
        file,
        header.info.lines,
        `column ${i + 1}`,
        `unknown column "${header.record[i]}"; expected ${[...REQUIRED, ...OPTIONAL].join(", ")}`,
      );
    }
    if (col.has(n)) throw inputError(file, header.info.lines, n, `column "${n}" appears twice`);
    col.set(n, i);
  });
  for (const r of REQUIRED) {
    if (!col.has(r)) {
      throw inputError(
        file,
        header.info.lines,
        r,
        `missing column "${r}"; expected a header row ${REQUIRED.join(",")}[,cold_start_option][,profile]`,
      );
    }
  }
  const stays: Stay[] = [];
  for (const { record, info } of rows.slice(1)) {
    const line = info.lines;
    if (record.length !== names.length) {
      throw inputError(
        file,
        line,
        undefined,
        `expected ${names.length} fields as in the header, found ${record.length}`,
      );
    }
    const get = (n: string) => (col.has(n) ? (record[col.get(n)!] ?? "") : "");
    const aircraft = get("aircraft");
    if (aircraft === "") throw inputError(file, line, "aircraft", "expected an aircraft id");
    const base = get("base");
    if (!baseNames.includes(base)) {
      throw inputError(
        file,
        line,
        "base",
        `unknown base "${base}"; the plan has ${baseNames.map((b) => `"${b}"`).join(", ")}`,
      );
    }
    const dates: DateTime[] = [];
    for (const n of ["arrive", "depart"] as const) {
      const d = parseIsoDate(get(n));
      if (d === null)
        throw inputError(file, line, n, `"${get(n)}" is not a date; expected YYYY-MM-DD, e.g. 2027-01-04`);
      dates.push(d);
    }
    if (dates[1]! <= dates[0]!) {
      throw inputError(
        file,
        line,
        "depart",
        `departure ${get("depart")} is not after arrival ${get("arrive")}`,
      );
    }
    const opt = get("cold_start_option").toLowerCase();
    if (!YES.has(opt) && !NO.has(opt)) {
      throw inputError(file, line, "cold_start_option", `"${get("cold_start_option")}"; expected yes or no`);
    }
    const profile = get("profile") || profileNames[0]!;
    if (!profileNames.includes(profile)) {
      throw inputError(
        file,
        line,
        "profile",
        `unknown profile "${profile}"; the plan has ${profileNames.map((p) => `"${p}"`).join(", ")}`,
      );
    }
    stays.push({
      aircraft,
      base,
      arrive: get("arrive"),
      depart: get("depart"),
      coldStartOption: YES.has(opt),
      profile,
      line,
    });
  }
  if (stays.length === 0)
    throw inputError(
      file,
      header.info.lines,
      undefined,
      "no stays; expected at least one row after the header",
    );
  checkOverlaps(stays, file);
  return stays;
}

/** Two stays of one aircraft overlap when one arrives before the other departs (same-day moves are fine). */
function checkOverlaps(stays: Stay[], file: string): void {
  const byAircraft = new Map<string, Stay[]>();
  for (const s of stays) byAircraft.set(s.aircraft, [...(byAircraft.get(s.aircraft) ?? []), s]);
  for (const list of byAircraft.values()) {
    const sorted = [...list].sort((a, b) =>
      a.arrive < b.arrive ? -1 : a.arrive > b.arrive ? 1 : a.line - b.line,
    );
    for (let i = 1; i < sorted.length; i++) {
      const prev = sorted[i - 1]!;
      const cur = sorted[i]!;
      if (cur.arrive < prev.depart) {
        const later = cur.line > prev.line ? cur : prev;
        const other = later === cur ? prev : cur;
        throw inputError(
          file,
          later.line,
          "arrive",
          `aircraft ${cur.aircraft}: stay ${later.arrive}…${later.depart} overlaps the stay on line ${other.line} (${other.arrive}…${other.depart}); a stay ends the day before its depart date`,
        );
      }
    }
  }
}

/** Reads and validates a schedule file. */
export async function loadSchedule(
  file: string,
  baseNames: string[],
  profileNames: string[],
): Promise<Stay[]> {
  const text = await readInputText(file, "the schedule");
  return parseScheduleText(text, file, baseNames, profileNames);
}
