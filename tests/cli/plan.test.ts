import { existsSync, readdirSync, readFileSync } from "node:fs";
import { writeFile } from "node:fs/promises";
import { join } from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { folderFiles, planText, SCHEDULE, useClimateRoot, visibleEntries } from "./planCase.js";
import { runCli } from "./runCli.js";

const run = runCli;
const { root: climateRoot, writeCase } = useClimateRoot();

describe("coldsoak plan", () => {
  it("writes results.json, one CSV per table and report.html; two runs are byte-identical", async () => {
    const c = await writeCase(planText());
    const a = await run(["plan", c.plan, "--out", c.out, "--no-cache"]);
    expect(a.err).toBe("");
    expect(a.code).toBe(0);
    const first = folderFiles(join(c.out, "minimal"));
    expect([...first.keys()]).toEqual(
      expect.arrayContaining([
        "results.json",
        "months.csv",
        "advice.csv",
        "nitrogen_stays.csv",
        "traces.csv",
        "report.html",
      ]),
    );
    expect(a.out.trim().split("\n").pop()).toBe(join(c.out, "minimal", "report.html"));
    const b = await run(["plan", c.plan, "--out", c.out, "--no-cache"]);
    expect(b.code).toBe(0);
    const second = folderFiles(join(c.out, "minimal"));
    for (const [name, text] of first) if (name !== "report.html") expect(second.get(name)).toBe(text);
    // Nothing left behind but the folder itself.
    expect(visibleEntries(c.out)).toEqual(["minimal"]);
    const r = JSON.parse(first.get("results.json")!);
    expect(r.plan).toBe("minimal");
    expect(r.climateYears).toEqual([2014, 2015, 2016]);
    expect(r.bases[0].months).toHaveLength(12);
    expect(r.bases[0].traces.worst.points).toHaveLength(37);
  });

  it("--json prints results.json", async () => {
    const c = await writeCase(planText());
    const a = await run(["plan", c.plan, "--out", c.out, "--no-cache", "--json"]);
    expect(a.code).toBe(0);
    expect(a.out).toBe(readFileSync(join(c.out, "minimal", "results.json"), "utf8"));
  });

  it("changing only the seed changes only the seeded quantities", async () => {
    // With no gas-loss spread and weekdays given by name nothing is random: only `seed` may change.
    const fixed = (seed: number) =>
      planText((t) => {
        t.seed = seed;
        t.profiles[0].gasLoss.spread = 0;
      });
    const r1 = JSON.parse(
      (
        await run([
          "plan",
          (await writeCase(fixed(1))).plan,
          "--out",
          join(climateRoot(), "s1"),
          "--no-cache",
          "--json",
        ])
      ).out,
    );
    const r2 = JSON.parse(
      (
        await run([
          "plan",
          (await writeCase(fixed(2))).plan,
          "--out",
          join(climateRoot(), "s2"),
          "--no-cache",
          "--json",
        ])
      ).out,
    );
    expect({ ...r2, seed: 1, assumptions: r1.assumptions }).toEqual(r1);
    expect(r2.assumptions.filter((a: { key: string }) => a.key !== "seed")).toEqual(
      r1.assumptions.filter((a: { key: string }) => a.key !== "seed"),
    );
    // With a spread, the gas-loss draws change, the climate-derived quantities do not.
    const spread = (seed: number) =>
      planText((t) => {
        t.seed = seed;
        t.profiles[0].gasLoss = { rate: "30 psi/month", spread: 0.5 };
      });
    const a = JSON.parse(
      (
        await run([
          "plan",
          (await writeCase(spread(1))).plan,
          "--out",
          join(climateRoot(), "s3"),
          "--no-cache",
          "--json",
        ])
      ).out,
    );
    const b = JSON.parse(
      (
        await run([
          "plan",
          (await writeCase(spread(2))).plan,
          "--out",
          join(climateRoot(), "s4"),
          "--no-cache",
          "--json",
        ])
      ).out,
    );
    expect(b.randomInputs).not.toEqual(a.randomInputs);
    expect(b.bases[0].months.map((m: { morningKPaGaugeP50: number }) => m.morningKPaGaugeP50)).not.toEqual(
      a.bases[0].months.map((m: { morningKPaGaugeP50: number }) => m.morningKPaGaugeP50),
    );
    for (const k of [
      "climateMonths",
      "dailyRangeHistogram",
      "coldestMorningByYear",
      "coldest1in10C",
      "stations",
      "yearsUsed",
    ]) {
      expect(b.bases[0][k]).toEqual(a.bases[0][k]);
    }
    expect(b.profiles).toEqual(a.profiles);
    for (let i = 0; i < 12; i++) {
      expect(b.bases[0].months[i].preflights).toBe(a.bases[0].months[i].preflights);
      expect(b.bases[0].months[i].dailyRangeP90C).toBe(a.bases[0].months[i].dailyRangeP90C);
    }
  });

  it("a failed run keeps the previous output folder and leaves nothing else", async () => {
    const c = await writeCase(planText());
    expect((await run(["plan", c.plan, "--out", c.out, "--no-cache"])).code).toBe(0);
    const before = folderFiles(join(c.out, "minimal"));
    await writeFile(
      join(c.plan, "..", "minimal-schedule.csv"),
      "aircraft,base,arrive,depart\nA01,Nowhere,2027-01-04,2027-02-01\n",
    );
    const r = await run(["plan", c.plan, "--out", c.out, "--no-cache"]);
    expect(r.code).toBe(2);
    expect(folderFiles(join(c.out, "minimal"))).toEqual(before);
    expect(visibleEntries(c.out)).toEqual(["minimal"]);
  });

  describe("input errors: one line naming file:line:field, exit code 2, no output", () => {
    const cases: [string, () => string, string, RegExp][] = [
      [
        "a malformed quantity",
        () =>
          planText((t) => {
            t.profiles[0].pump.timer = "3 minutes";
          }),
        SCHEDULE,
        /plan\.yaml:\d+:profiles\[0\]\.pump\.timer: "3 minutes": unknown or missing unit "minutes"; expected a duration/,
      ],
      [
        "an unknown key",
        () =>
          planText((t) => {
            t.operations.startTime = ["06:00"];
          }),
        SCHEDULE,
        /plan\.yaml:\d+:operations: unknown key "startTime"/,
      ],
      [
        "a missing section",
        () =>
          planText((t) => {
            delete t.nitrogen;
          }),
        SCHEDULE,
        /plan\.yaml:\d+:nitrogen: missing; expected the nitrogen section .*only "coldsoak screen" reads a plan without it/,
      ],
      [
        "a station not in the climate data",
        () =>
          planText((t) => {
            t.bases[0].stations = ["999899-99999"];
          }),
        SCHEDULE,
        /plan\.yaml:\d+:bases\[0\]\.stations\[0\]: station "999899-99999" is not in the climate data/,
      ],
      [
        "an unknown base",
        planText,
        "aircraft,base,arrive,depart\nA01,Nowhere,2027-01-04,2027-02-01\n",
        /minimal-schedule\.csv:2:base: unknown base "Nowhere"/,
      ],
      [
        "an unknown profile",
        planText,
        "aircraft,base,arrive,depart,profile\nA01,North Field,2027-01-04,2027-02-01,light\n",
        /minimal-schedule\.csv:2:profile: unknown profile "light"/,
      ],
      [
        "depart not after arrive",
        planText,
        "aircraft,base,arrive,depart\nA01,North Field,2027-01-04,2027-01-01\n",
        /minimal-schedule\.csv:2:depart: departure 2027-01-01 is not after arrival 2027-01-04/,
      ],
      [
        "overlapping stays",
        planText,
        "aircraft,base,arrive,depart\nA01,North Field,2027-01-04,2027-02-01\nA01,North Field,2027-01-20,2027-02-10\n",
        /minimal-schedule\.csv:3:arrive: aircraft A01: stay 2027-01-20…2027-02-10 overlaps the stay on line 2/,
      ],
      [
        "a malformed date",
        planText,
        "aircraft,base,arrive,depart\nA01,North Field,2027/01/04,2027-02-01\n",
        /minimal-schedule\.csv:2:arrive: "2027\/01\/04" is not a date; expected YYYY-MM-DD/,
      ],
    ];
    for (const [what, plan, schedule, message] of cases) {
      it(what, async () => {
        const c = await writeCase(plan(), schedule);
        const r = await run(["plan", c.plan, "--out", c.out, "--no-cache"]);
        expect(r.code).toBe(2);
        expect(r.err).toMatch(message);
        expect(r.err.trim().split("\n")).toHaveLength(1);
        expect(existsSync(c.out) ? readdirSync(c.out) : []).toEqual([]);
      });
    }
  });

  it("fuzzed YAML and CSV never crash and never leave a partial output folder (fast-check)", async () => {
    const base = planText();
    const lines = base.split("\n");
    const yamlMutation = fc.oneof(
      fc.record({ kind: fc.constant("drop" as const), at: fc.nat(lines.length - 1) }),
      fc.record({
        kind: fc.constant("insert" as const),
        at: fc.nat(base.length),
        text: fc.string({ maxLength: 6 }),
      }),
    );
    const csvRow = fc
      .tuple(
        fc.constantFrom("A01", "A02", ""),
        fc.constantFrom("North Field", "Nowhere", '"North Field"'),
        fc.constantFrom("2027-01-04", "2027-02-30", "2027-01-10", "x"),
        fc.constantFrom("2027-01-08", "2027-01-04", "2027-01-20"),
      )
      .map((r) => r.join(","));
    await fc.assert(
      fc.asyncProperty(yamlMutation, fc.array(csvRow, { maxLength: 3 }), async (m, rows) => {
        const text =
          m.kind === "drop"
            ? lines.filter((_, i) => i !== m.at).join("\n")
            : base.slice(0, m.at) + m.text + base.slice(m.at);
        const c = await writeCase(text, ["aircraft,base,arrive,depart", ...rows].join("\n"));
        const r = await run(["plan", c.plan, "--out", c.out, "--no-cache"]);
        expect([0, 2]).toContain(r.code);
        if (r.code === 2) {
          expect(r.err.trim().split("\n")).toHaveLength(1);
          expect(existsSync(c.out) ? readdirSync(c.out) : []).toEqual([]);
        } else {
          expect(visibleEntries(c.out)).toEqual(["minimal"]);
        }
      }),
      { numRuns: 25, seed: 12 },
    );
  });
});
