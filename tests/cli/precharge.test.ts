import { afterEach, describe, expect, it, vi } from "vitest";
import { main } from "../../src/cli/main.js";
import { prechargeAnswer, prechargeJson } from "../../src/cli/prechargeRun.js";

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(process.stdout, "write").mockImplementation((s: string | Uint8Array) => {
    out.push(String(s));
    return true;
  });
  vi.spyOn(process.stderr, "write").mockImplementation((s: string | Uint8Array) => {
    err.push(String(s));
    return true;
  });
  return { out, err };
}

afterEach(() => {
  vi.restoreAllMocks();
});

describe("coldsoak precharge", () => {
  it("--json: 1450 psig at 70 °F gives ideal 1394.7 and real 1381.8 psig at 50 °F", async () => {
    // About 1390 psig (common practice, no source); ideal 1394.7 ± 0.1 (ideal gas law on absolute
    // pressures), real 1381.8 ± 0.3 (computed independently from the equation of state, tests/physics/crosscheck).
    const io = capture();
    const code = await main(["precharge", "--ref", "1450psig@70F", "--at", "50F", "--json"]);
    expect(code).toBe(0);
    const j = JSON.parse(io.out.join(""));
    expect(Object.keys(j).sort()).toEqual([
      "atTempC",
      "idealKPaGauge",
      "idealPsig",
      "realKPaGauge",
      "realPsig",
    ]);
    expect(Math.abs(j.idealPsig - 1394.7)).toBeLessThanOrEqual(0.1);
    expect(Math.abs(j.realPsig - 1381.8)).toBeLessThanOrEqual(0.3);
    // 1 psi = 6.894757 kPa (NIST SP 811, from memory)
    expect(j.realKPaGauge / j.realPsig).toBeCloseTo(6.894757, 3);
    expect(j.atTempC).toBeCloseTo(10, 9);
  });

  it("100 bar gauge at 20 °C gives 78.62 bar gauge at −30 °C (real gas)", () => {
    // Computed independently from the equation of state, ± 0.03 bar (tests/physics/crosscheck).
    const j = prechargeJson(prechargeAnswer("100bar@20C", "-30C"));
    expect(Math.abs(j.realKPaGauge / 100 - 78.62)).toBeLessThanOrEqual(0.03);
  });

  it("100 psig at 70 °F gives ideal 76.2 and real 75.7 psig at −40 °F; absolute input equals gauge + 1 atm", () => {
    // Computed independently from the equation of state (tests/physics/crosscheck); 14.696 psia = 1 atm (from memory).
    const j = prechargeJson(prechargeAnswer("100psig@70F", "-40F"));
    expect(Math.abs(j.idealPsig - 76.2)).toBeLessThanOrEqual(0.1);
    expect(Math.abs(j.realPsig - 75.7)).toBeLessThanOrEqual(0.1);
    const abs = prechargeJson(prechargeAnswer("114.696psia@70F", "-40F"));
    expect(abs.realPsig).toBeCloseTo(j.realPsig, 2);
  });

  it("elevation lowers the atmosphere: the same gauge reference holds less gas", () => {
    // ISO 2533 standard atmosphere at 1500 m, 84.56 kPa (from memory): the absolute reference is 16.8 kPa lower.
    const sea = prechargeAnswer("1450psig@70F", "50F", "0");
    const high = prechargeAnswer("1450psig@70F", "50F", "1500");
    expect((sea.refAbsPa - high.refAbsPa) / 1000).toBeCloseTo(101.325 - 84.56, 1);
  });

  it("text output shows real and ideal side by side", async () => {
    // Output format of the command (no numeric source beyond the figures above).
    const io = capture();
    const code = await main(["precharge", "--ref", "1450psig@70F", "--at", "50F"]);
    expect(code).toBe(0);
    const text = io.out.join("");
    expect(text).toMatch(/real gas\s+ideal gas/);
    expect(text).toMatch(/psig\s+1,381\.8\s+1,394\.7/);
  });

  for (const [args, pattern] of [
    [["--ref", "1450psi@70F", "--at", "50F"], /--ref: .*e\.g\. --ref 1450psig@70F/],
    [["--ref", "1450psig", "--at", "50F"], /--ref: .*e\.g\. --ref 1450psig@70F/],
    [["--ref", "1450psig@70", "--at", "50F"], /--ref: .*e\.g\./],
    [["--ref", "1450psig@70F", "--at", "fifty"], /--at: .*e\.g\. --at 50F/],
    [["--ref", "1450psig@70F", "--at", "-400F"], /--at: .*outside/],
    // Below nitrogen's critical temperature, 126.192 K = −146.96 °C (Span et al. 2000), the charge may
    // condense: −300 °F (89.3 K) gave a negative "real gas" pressure before this check.
    [["--ref", "1450psig@70F", "--at", "-300F"], /--at: .*critical temperature \(126\.192 K/],
    [["--ref", "1450psig@-200C", "--at", "50F"], /--ref: .*critical temperature/],
    [
      ["--ref", "1450psi@70F", "--at", "50F"],
      /bare "psi" is a pressure difference; say "psig" \(gauge\) or "psia" \(absolute\)/,
    ],
    [
      ["--ref", "1450psig@70F", "--at", "50F", "--elevation", "20000"],
      /^coldsoak: --elevation: 20000 m is outside/,
    ],
    [
      ["--ref", "1450psig@70F", "--at", "50F", "--elevation", "high"],
      /--elevation: .*e\.g\. --elevation 1500/,
    ],
  ] as const) {
    it(`malformed ${args.join(" ")} → one-line error with an example, exit 2`, async () => {
      // Exit codes and one-line errors: README, Outputs.
      const io = capture();
      const code = await main(["precharge", ...args]);
      expect(code).toBe(2);
      const err = io.err.join("");
      expect(err.trim().split("\n")).toHaveLength(1);
      expect(err).toMatch(pattern);
      expect(io.out.join("")).toBe("");
    });
  }

  it("accepts MPa (gauge) and MPaa (absolute), as the help says", () => {
    // 1 MPa = 10 bar exactly (SI brochure): 10 MPa gauge is the same reference as 100 bar gauge.
    const mpa = prechargeJson(prechargeAnswer("10MPa@20C", "-30C"));
    const bar = prechargeJson(prechargeAnswer("100bar@20C", "-30C"));
    expect(mpa.realKPaGauge).toBeCloseTo(bar.realKPaGauge, 6);
    // Absolute = gauge + 101.325 kPa (ISO 2533 sea level): 10.101325 MPaa is 10 MPa gauge.
    const abs = prechargeJson(prechargeAnswer("10.101325MPaa@20C", "-30C"));
    expect(abs.realKPaGauge).toBeCloseTo(bar.realKPaGauge, 3);
  });

  it("missing --at is a usage error (exit 2)", async () => {
    // README, exit codes.
    capture();
    expect(await main(["precharge", "--ref", "1450psig@70F"])).toBe(2);
  });

  it("--help shows an example", async () => {
    // Help text (no numeric source).
    const io = capture();
    const code = await main(["precharge", "--help"]);
    expect(code).toBe(0);
    expect(io.out.join("")).toContain("coldsoak precharge --ref 1450psig@70F --at 50F");
  });
});
