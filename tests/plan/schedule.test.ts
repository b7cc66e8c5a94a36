import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/errors.js";
import { parseScheduleText } from "../../src/plan/schedule.js";

const BASES = ["North Field", "South Strip"];
const PROFILES = ["standard", "heavy"];
const HEADER = "aircraft,base,arrive,depart,cold_start_option,profile";

function err(text: string): string {
  try {
    parseScheduleText(text, "s.csv", BASES, PROFILES);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  return "no error";
}

describe("schedule", () => {
  it("reads stays with defaults for the optional columns", () => {
    const stays = parseScheduleText(
      "aircraft,base,arrive,depart\nA1,North Field,2027-01-04,2027-02-01\n",
      "s.csv",
      BASES,
      PROFILES,
    );
    expect(stays).toEqual([
      {
        aircraft: "A1",
        base: "North Field",
        arrive: "2027-01-04",
        depart: "2027-02-01",
        coldStartOption: false,
        profile: "standard",
        line: 2,
      },
    ]);
  });

  it("accepts a same-day move between bases (README, Inputs: depart day is not part of the stay)", () => {
    const stays = parseScheduleText(
      `${HEADER}\nA1,North Field,2027-01-04,2027-02-01,no,standard\nA1,South Strip,2027-02-01,2027-03-01,yes,heavy\n`,
      "s.csv",
      BASES,
      PROFILES,
    );
    expect(stays.map((s) => s.coldStartOption)).toEqual([false, true]);
  });

  it("names file, line and column of each error", () => {
    expect(err(`${HEADER}\nA1,Nowhere,2027-01-04,2027-02-01,no,standard\n`)).toBe(
      's.csv:2:base: unknown base "Nowhere"; the plan has "North Field", "South Strip"',
    );
    expect(err(`${HEADER}\nA1,North Field,2027-01-04,2027-02-01,no,light\n`)).toBe(
      's.csv:2:profile: unknown profile "light"; the plan has "standard", "heavy"',
    );
    expect(err(`${HEADER}\nA1,North Field,2027-02-01,2027-02-01,no,standard\n`)).toBe(
      "s.csv:2:depart: departure 2027-02-01 is not after arrival 2027-02-01",
    );
    expect(err(`${HEADER}\nA1,North Field,2027-02-30,2027-03-01,no,standard\n`)).toBe(
      's.csv:2:arrive: "2027-02-30" is not a date; expected YYYY-MM-DD, e.g. 2027-01-04',
    );
    expect(err(`${HEADER}\nA1,North Field,4 Jan 2027,2027-03-01,no,standard\n`)).toMatch(
      /^s\.csv:2:arrive: "4 Jan 2027" is not a date/,
    );
    expect(
      err(
        `${HEADER}\nA1,North Field,2027-01-04,2027-02-01,no,standard\nA1,South Strip,2027-01-31,2027-03-01,no,standard\n`,
      ),
    ).toMatch(/^s\.csv:3:arrive: aircraft A1: stay 2027-01-31…2027-03-01 overlaps the stay on line 2/);
    expect(err(`${HEADER}\nA1,North Field,2027-01-04,2027-02-01,maybe,standard\n`)).toBe(
      's.csv:2:cold_start_option: "maybe"; expected yes or no',
    );
    expect(err("aircraft,base,arrive\nA1,North Field,2027-01-04\n")).toMatch(
      /^s\.csv:1:depart: missing column "depart"/,
    );
    expect(err(`${HEADER}\nA1,"North Field,2027-01-04\n`)).toMatch(/^s\.csv:\d+: not valid CSV/);
    expect(err("")).toMatch(/^s\.csv:1: empty schedule/);
  });

  it("never crashes on arbitrary text: a schedule or an InputError (fast-check)", () => {
    const cellish = fc.oneof(
      fc.constantFrom(
        "A1",
        "North Field",
        "South Strip",
        "2027-01-04",
        "2027-02-01",
        "yes",
        "no",
        "standard",
        "",
        '"',
        ",",
      ),
      fc.string({ maxLength: 12 }),
    );
    const row = fc.array(cellish, { minLength: 0, maxLength: 7 }).map((c) => c.join(","));
    const text = fc.array(row, { minLength: 0, maxLength: 6 }).map((rows) => [HEADER, ...rows].join("\n"));
    fc.assert(
      fc.property(fc.oneof(text, fc.string({ maxLength: 200 })), (t) => {
        try {
          parseScheduleText(t, "s.csv", BASES, PROFILES);
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          expect((e as Error).message.startsWith("s.csv:")).toBe(true);
        }
      }),
      { numRuns: 300, seed: 4 },
    );
  });
});
