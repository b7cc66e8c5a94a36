import { beforeAll, describe, expect, it } from "vitest";
import type { Results } from "../../src/plan/results.js";
import { renderReport } from "../../src/report/index.js";
import { localTimeText } from "../../src/report/shared.js";
import { N2_NORMAL_DENSITY_KG_M3, N2_SCF_DENSITY_KG_M3 } from "../../src/units/index.js";
import { makeResults } from "../fixtures/report/results.js";
import { type Element, elements, inner, parseShown, type Token, textOf, tokenize } from "./html.js";

interface Rendered {
  results: Results;
  tokens: Token[];
  els: Element[];
}

async function render(units: "us" | "si"): Promise<Rendered> {
  const results = makeResults({ units });
  const tokens = tokenize(await renderReport(results));
  return { results, tokens, els: elements(tokens) };
}

function text(r: Rendered, el: Element): string {
  return textOf(inner(r.tokens, el)).replace(/\s+/g, " ").trim();
}

/** Cells of the first table in base 1 whose caption starts with `caption`: rows of cell texts. */
function table(r: Rendered, caption: string): string[][] {
  const sec = r.els.find((e) => e.attrs["id"] === "base-1")!;
  const t = elements(inner(r.tokens, sec)).find(
    (e) =>
      e.name === "table" &&
      text(r, elements(inner(r.tokens, e)).find((c) => c.name === "caption")!).startsWith(caption),
  )!;
  return elements(inner(r.tokens, t))
    .filter((e) => e.name === "tr")
    .map((tr) =>
      elements(inner(r.tokens, tr))
        .filter((c) => c.name === "td" || c.name === "th")
        .map((c) => text(r, c)),
    );
}

function axisTitles(r: Rendered): string[] {
  return r.els.filter((e) => e.attrs["class"]?.includes("role-axis-title")).map((e) => text(r, e));
}

describe("report units: the same results in US and SI", () => {
  let us: Rendered;
  let si: Rendered;
  beforeAll(async () => {
    us = await render("us");
    si = await render("si");
  });

  it("labels every temperature and pressure axis in the plan's units", () => {
    const usAxes = axisTitles(us);
    const siAxes = axisTitles(si);
    expect(usAxes.length).toBe(siAxes.length);
    expect(usAxes.some((t) => t.includes("(°F)"))).toBe(true);
    expect(usAxes.some((t) => t.includes("(psig)"))).toBe(true);
    expect(usAxes.join("|")).not.toMatch(/°C|\(bar\)/);
    expect(siAxes.some((t) => t.includes("(°C)"))).toBe(true);
    // SI gauge pressures say "bar gauge" (README, Method: absolute vs gauge explicit).
    expect(siAxes.some((t) => t.includes("(bar gauge)"))).toBe(true);
    expect(siAxes.join("|")).not.toMatch(/°F|psig/);
    for (const t of [...usAxes, ...siAxes]) {
      if (/temperature|swing/i.test(t)) expect(t).toMatch(/\((°F|°C)\)$/);
      if (/pressure|precharge/i.test(t)) expect(t).toMatch(/\((psig|bar gauge)\)$/);
    }
  });

  it("labels table headers in the plan's units", () => {
    const usHeads = us.els
      .filter((e) => e.name === "th" && e.attrs["scope"] === "col")
      .map((e) => text(us, e));
    const siHeads = si.els
      .filter((e) => e.name === "th" && e.attrs["scope"] === "col")
      .map((e) => text(si, e));
    expect(usHeads.length).toBe(siHeads.length);
    expect(usHeads.join("|")).not.toMatch(/°C|\(bar\)|\(kg\)|normal m³/);
    expect(siHeads.join("|")).not.toMatch(/°F|psig|\(lb\)|scf/);
    expect(usHeads.filter((h) => h.includes("(°F)")).length).toBe(
      siHeads.filter((h) => h.includes("(°C)")).length,
    );
  });

  it("says gauge for gauge pressures and not for pressure differences", () => {
    const heads = (r: Rendered) =>
      r.els.filter((e) => e.name === "th" && e.attrs["scope"] === "col").map((e) => text(r, e));
    const usHeads = heads(us);
    const siHeads = heads(si);
    // A gauge pressure (precharge, morning pressure): psig / bar gauge. A drop is a difference: psi / bar.
    for (const [list, gauge, diff] of [
      [usHeads, "(psig)", "(psi)"],
      [siHeads, "(bar gauge)", "(bar)"],
    ] as const) {
      const pressures = list.filter((h) => /pressure|precharge(?! checks)/i.test(h) && !/drop/i.test(h));
      const drops = list.filter((h) => /pressure drop/i.test(h));
      // The morning pressures of each base (the precharge table is a chart only, not a servicing table).
      expect(pressures.length).toBeGreaterThan(0);
      expect(drops.length).toBeGreaterThan(0);
      for (const h of pressures) expect(h.endsWith(gauge), h).toBe(true);
      for (const h of drops) expect(h.endsWith(diff), h).toBe(true);
    }
  });

  it("converts temperatures consistently: °F = °C × 9/5 + 32 within display rounding", () => {
    const f = table(us, "Monthly air temperature").slice(1);
    const c = table(si, "Monthly air temperature").slice(1);
    expect(f).toHaveLength(12);
    for (const [i, row] of f.entries()) {
      for (const col of [1, 2, 3]) {
        const fv = parseShown(row[col]!);
        const cv = parseShown(c[i]![col]!);
        expect(Math.abs((fv - 32) * (5 / 9) - cv)).toBeLessThanOrEqual(0.05 * (5 / 9) + 0.05 + 1e-9);
      }
      // Daily swing is a difference: °F = °C × 9/5.
      expect(Math.abs(parseShown(row[4]!) * (5 / 9) - parseShown(c[i]![4]!))).toBeLessThanOrEqual(0.09);
    }
  });

  it("converts pressures consistently: psig × 6.894757 = kPa = bar × 100 within display rounding", () => {
    const p = table(us, "Fill readings").slice(1);
    const b = table(si, "Fill readings").slice(1);
    let compared = 0;
    for (const [i, row] of p.entries()) {
      const psig = row[4]!.split(" / ");
      const bar = b[i]![4]!.split(" / ");
      for (const k of [0, 1, 2]) {
        if (psig[k] === "–") {
          expect(bar[k]).toBe("–");
          continue;
        }
        // Rounding: psig to 0.5 psi (3.45 kPa), bar to 0.05 bar (5 kPa).
        expect(Math.abs(parseShown(psig[k]!) * 6.894757 - parseShown(bar[k]!) * 100)).toBeLessThanOrEqual(
          8.5,
        );
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(20);
  });

  it("converts nitrogen consistently: lb ↔ kg and scf ↔ normal m³ through the same mass", () => {
    const usRows = table(us, "Nitrogen to ship").slice(1);
    const siRows = table(si, "Nitrogen to ship").slice(1);
    expect(usRows[0]![1]).toBe("lb");
    expect(siRows[0]![1]).toBe("kg");
    expect(usRows[1]![1]).toBe("scf");
    expect(siRows[1]![1]).toBe("normal m³");
    for (const col of [2, 3, 4]) {
      const lb = parseShown(usRows[0]![col]!);
      const kg = parseShown(siRows[0]![col]!);
      // NIST SP 811: 1 lb = 0.45359237 kg; rounding 0.005 lb and 0.005 kg.
      expect(Math.abs(lb * 0.45359237 - kg)).toBeLessThanOrEqual(0.0075);
      const scf = parseShown(usRows[1]![col]!);
      const nm3 = parseShown(siRows[1]![col]!);
      // Both are the same mass: scf × 1 ft³ × ρ(70 °F, 14.696 psia) = normal m³ × ρ(0 °C, 101.325 kPa),
      // 1 ft³ = 0.028316846592 m³ (NIST SP 811), ρ from the reference equation (src/units/factors.ts).
      // Display rounding: scf to 0.05 scf (0.05 × 0.0329 kg), normal m³ to 0.005 m³ (0.005 × 1.2504 kg).
      const scfKg = scf * 0.028316846592 * N2_SCF_DENSITY_KG_M3;
      expect(Math.abs(scfKg - nm3 * N2_NORMAL_DENSITY_KG_M3)).toBeLessThanOrEqual(
        0.05 * 0.0329 + 0.005 * 1.2504,
      );
    }
  });
});

describe("local time text", () => {
  it("shows an ISO local time with its UTC offset, and leaves other text alone", () => {
    // ISO 8601 / RFC 3339 offsets (common practice, no source).
    expect(localTimeText("2018-12-01T15:00:00-06:00")).toBe("2018-12-01 15:00 (UTC\u221206:00)");
    expect(localTimeText("2018-12-01T15:00:00+05:30")).toBe("2018-12-01 15:00 (UTC+05:30)");
    expect(localTimeText("2018-12-01T15:00Z")).toBe("2018-12-01 15:00 (UTC)");
    expect(localTimeText("not a time")).toBe("not a time");
  });
});
