/**
 * Climate design temperatures of a base (docs/methods.md, "Climate design temperatures"): the climate
 * module's figures over the plan's `climate.years` with its `minYearShare` and cold thresholds, the
 * 1-in-10 and 1-in-30-year coldest hours (Gumbel fit to the coldest hour of each year, method of
 * moments) with their bootstrap intervals, and the mean of the base's coldest mornings.
 */
import { type DesignTemperatures, type DesignTempOptions, designTemperatures } from "../climate/index.js";
import { cToK, fToK, kToC } from "../units/index.js";
import { bootstrapResamples, statisticInterval } from "./bootstrap.js";
import { RETURN_PERIODS_YEARS } from "./monthStats.js";
import type { Plan } from "./planFile.js";
import type { BaseResult, ColdestHourResult, DesignTemperaturesResult } from "./results.js";
import type { BaseSamples } from "./samples.js";
import { gumbelMinimumReturnLevel, mean } from "./stats.js";

/** The default temperatures the hours below count under: −20, −30 and −40 in the plan's unit, K. */
export function coldThresholdsK(plan: Pick<Plan, "units" | "climate">): number[] {
  if (plan.climate.coldThresholds !== undefined) return plan.climate.coldThresholds;
  const toK = plan.units === "us" ? fToK : cToK;
  return [-20, -30, -40].map(toK);
}

/** The options of `designTemperatures` a plan sets. */
export function designTempOptions(plan: Plan): DesignTempOptions {
  return {
    years: plan.climate.years ?? null,
    minYearShare: plan.climate.minYearShare,
    coldThresholdsC: coldThresholdsK(plan).map(kToC),
  };
}

/**
 * The coldest hour of each year with its 1-in-10 and 1-in-30-year values (Gumbel, method of moments)
 * and their 90 % intervals from a seeded bootstrap over the years (stream `label`).
 */
export function coldestHourReturnLevels(
  coldest: DesignTemperatures["coldestHour"],
  seed: number,
  label: string,
): ColdestHourResult {
  const minima = coldest.byYear.map((y) => y.tempC);
  const resamples = bootstrapResamples(seed, label, minima.length);
  const level = (years: number) => ({
    value: gumbelMinimumReturnLevel(minima, years),
    interval: statisticInterval(minima, resamples, (s) => gumbelMinimumReturnLevel(s, years)),
  });
  const ten = level(RETURN_PERIODS_YEARS.oneIn10);
  const thirty = level(RETURN_PERIODS_YEARS.oneIn30);
  return {
    meanC: coldest.meanC,
    oneIn10C: ten.value,
    oneIn10CLo90: ten.interval?.lo90 ?? null,
    oneIn10CHi90: ten.interval?.hi90 ?? null,
    oneIn30C: thirty.value,
    oneIn30CLo90: thirty.interval?.lo90 ?? null,
    oneIn30CHi90: thirty.interval?.hi90 ?? null,
    byYear: coldest.byYear,
  };
}

/** A base's design temperatures from its merged series, with its coldest mornings' mean. */
export function baseDesignTemperatures(
  plan: Plan,
  base: BaseSamples,
  coldestMorningByYear: BaseResult["coldestMorningByYear"],
): DesignTemperaturesResult {
  const d = designTemperatures(base.climate.series, base.climate.timeZone, designTempOptions(plan));
  const name = plan.bases[base.baseIndex]!.name;
  return {
    ...d,
    coldestHour: coldestHourReturnLevels(d.coldestHour, plan.seed, `bootstrap:${name}:coldestHour`),
    coldestMorningMeanC: mean(coldestMorningByYear.map((c) => c.tempC)),
  };
}
