import { describe, expect, it } from "vitest";
import {
  drawWeekdays,
  fnv1a,
  gasLossFactor,
  poissonCount,
  stream,
  unscheduledRechargeDays,
} from "../../src/plan/random.js";
import { gumbelMinimumReturnLevel, quantile } from "../../src/plan/stats.js";

describe("statistics", () => {
  it("quantiles are type 7 (linear between order statistics)", () => {
    // R: quantile(1:10, 0.9) = 9.1 and quantile(c(1,2,3,4), 0.5) = 2.5 (type 7 default; from memory).
    expect(quantile([10, 9, 8, 7, 6, 5, 4, 3, 2, 1], 0.9)).toBeCloseTo(9.1, 12);
    expect(quantile([4, 1, 3, 2], 0.5)).toBe(2.5);
    expect(quantile([], 0.5)).toBeNull();
  });

  it("Gumbel 1-in-10-year minimum: mean − K10·s with K10 = 1.3046", () => {
    // Chow, Maidment & Mays (1988), Applied Hydrology, eq. 12.3.6: K_T = −(√6/π)(0.5772 + ln ln(T/(T−1)));
    // K_10 = 1.3046. For minima (negated maxima) x_10 = mean − K_10·s.
    const minima = [-20, -25, -30, -22, -28, -18, -26];
    const m = minima.reduce((a, b) => a + b, 0) / minima.length;
    const s = Math.sqrt(minima.reduce((a, b) => a + (b - m) ** 2, 0) / (minima.length - 1));
    expect(gumbelMinimumReturnLevel(minima, 10)).toBeCloseTo(m - 1.3046 * s, 3);
    expect(gumbelMinimumReturnLevel([-20], 10)).toBeNull();
  });

  it("Gumbel 1-in-30-year minimum: mean − K30·s with K30 = 2.1887", () => {
    // Chow, Maidment & Mays (1988), eq. 12.3.6 at T = 30: K_30 = −(√6/π)(0.5772 + ln ln(30/29)) =
    // 2.1887 (the equation evaluated by hand). The same fit as the 1-in-10-year value.
    const minima = [-20, -25, -30, -22, -28, -18, -26];
    const m = minima.reduce((a, b) => a + b, 0) / minima.length;
    const s = Math.sqrt(minima.reduce((a, b) => a + (b - m) ** 2, 0) / (minima.length - 1));
    expect(gumbelMinimumReturnLevel(minima, 30)).toBeCloseTo(m - 2.1887 * s, 3);
  });
});

describe("seeded random inputs", () => {
  it("FNV-1a matches its published test vector", () => {
    // FNV-1a 32-bit of "a" is 0xe40c292c (Fowler/Noll/Vo reference test suite).
    expect(fnv1a("a")).toBe(0xe40c292c);
  });

  it("gas-loss factors are per aircraft, reproducible, and median 1 (log-normal)", () => {
    expect(gasLossFactor(7, "A01", 0.3)).toBe(gasLossFactor(7, "A01", 0.3));
    expect(gasLossFactor(7, "A01", 0.3)).not.toBe(gasLossFactor(8, "A01", 0.3));
    expect(gasLossFactor(7, "A01", 0)).toBe(1);
    // ln(factor)/σ is standard normal: over many aircraft its mean is near 0 and its sd near 1
    // (definition of the log-normal; tolerance from the standard error of 4000 draws).
    const z = Array.from({ length: 4000 }, (_, i) => Math.log(gasLossFactor(3, `X${i}`, 0.5)) / 0.5);
    const mean = z.reduce((a, b) => a + b, 0) / z.length;
    const sd = Math.sqrt(z.reduce((a, b) => a + (b - mean) ** 2, 0) / (z.length - 1));
    expect(Math.abs(mean)).toBeLessThan(0.06);
    expect(Math.abs(sd - 1)).toBeLessThan(0.05);
  });

  it("weekdays drawn from the seed: the count asked, distinct, reproducible", () => {
    const w = drawWeekdays(11, 4);
    expect(w).toHaveLength(4);
    expect(new Set(w).size).toBe(4);
    expect(drawWeekdays(11, 4)).toEqual(w);
    expect(drawWeekdays(11, 7)).toEqual([1, 2, 3, 4, 5, 6, 7]);
  });

  it("unscheduled recharges: the mean count over many seeds converges to rate × aircraft-months", () => {
    // Poisson process (definition): over N independent stays the total count is Poisson with mean
    // N·λ·months, so the sample mean's standard error is √(λ·months/N). Tolerance: 4 standard errors
    // (a false alarm about once in 16 000 runs; the draws are seeded, so the test is deterministic).
    // 0.05 per aircraft-month over a 150-day stay (a month = 365.2425/12 days): mean 0.246412.
    const rate = 0.05;
    const days = 150;
    const expected = (rate * days) / (365.2425 / 12);
    expect(expected).toBeCloseTo(0.246412, 6);
    const n = 20000;
    let total = 0;
    for (let i = 0; i < n; i++) {
      const d = unscheduledRechargeDays(i, `base|AC${i % 7}|2027-11-01|2015|${i % 3}`, rate, days);
      total += d.length;
      for (const x of d) expect(x >= 0 && x < days).toBe(true);
      expect(d).toEqual([...d].sort((a, b) => a - b));
    }
    expect(Math.abs(total / n - expected)).toBeLessThan(4 * Math.sqrt(expected / n));
  });

  it("Poisson counts: mean and variance both equal the mean, in one piece and in chunks above 100", () => {
    // Poisson distribution: E[N] = Var[N] = m. Tolerance 4 standard errors of the mean, √(m/n), and for
    // the variance 4·√(Var of the sample variance) ≈ 4·m·√(2/n + 1/(m·n)) (Poisson fourth moment).
    for (const m of [0.3, 4, 250]) {
      const u = stream(17, `poisson-test-${m}`);
      const n = 4000;
      const x = Array.from({ length: n }, () => poissonCount(u, m));
      const mean = x.reduce((a, b) => a + b, 0) / n;
      const variance = x.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1);
      expect(Math.abs(mean - m), `mean at m = ${m}`).toBeLessThan(4 * Math.sqrt(m / n));
      expect(Math.abs(variance - m), `variance at m = ${m}`).toBeLessThan(
        4 * m * Math.sqrt(2 / n + 1 / (m * n)),
      );
    }
    expect(poissonCount(stream(1, "zero"), 0)).toBe(0);
    expect(() => poissonCount(stream(1, "x"), -1)).toThrow(/Poisson mean/);
  });

  it("unscheduled recharges are reproducible, keyed by their stream, and none at rate 0", () => {
    const a = unscheduledRechargeDays(5, "Korrash|AC03|2027-12-01|2014|0", 2, 100);
    expect(unscheduledRechargeDays(5, "Korrash|AC03|2027-12-01|2014|0", 2, 100)).toEqual(a);
    expect(unscheduledRechargeDays(5, "Korrash|AC03|2027-12-01|2014|1", 2, 100)).not.toEqual(a);
    expect(unscheduledRechargeDays(6, "Korrash|AC03|2027-12-01|2014|0", 2, 100)).not.toEqual(a);
    expect(unscheduledRechargeDays(5, "Korrash|AC03|2027-12-01|2014|0", 0, 100)).toEqual([]);
  });
});
