/**
 * Stochastic hourly weather for the demo's invented stations.
 *
 * Hourly air temperature is the sum of
 *   1. a seasonal cycle: the station's monthly means, made continuous by piecewise-linear
 *      interpolation between mid-month anchors that are solved so that each month's average equals its
 *      target exactly (`monthlyAnchors`);
 *   2. a diurnal cycle on local solar time (minimum near 06 h, maximum near 15 h, cosine halves), whose
 *      amplitude follows the month (`monthlyDiurnalRangeC`) and the cloud cover of the hour: clear skies
 *      widen it, overcast narrows it (`diurnalCloudFactor`), normalised so the month's mean amplitude is
 *      the target;
 *   3. a cloud offset: overcast hours are warmer than clear ones in winter (zero mean by construction);
 *   4. a synoptic anomaly: a first-order autoregressive process, AR(1), with an e-folding time of a few
 *      days and a month-dependent standard deviation;
 *   5. cold outbreaks: rare events (Poisson onsets) that drop the temperature by an exponential depth
 *      over 18 hours, hold it 1–4 days and recover over 48 hours. The seasonal anchors are raised by the
 *      outbreaks' expected contribution, so monthly means still match their targets.
 * Dew point, sea-level and station pressure, wind, cloud ceiling and visibility come along so that the
 * written records look complete; only temperature is checked against targets.
 *
 * Everything is drawn from one seeded stream per station (src/demo/prng.ts); the same seed gives the
 * same hours.
 */
import { cToK } from "../units/index.js";
import { exponential, fnv1a32, mulberry32, standardNormal, type Uniform, uniformInt } from "./prng.js";
import type { DemoStation, Monthly } from "./stations.js";

const HOUR_MS = 3_600_000;

/** One simulated hour at the top of a UTC hour. */
export interface ModelHour {
  utcMs: number;
  tempC: number;
  dewPointC: number;
  seaLevelHpa: number;
  stationHpa: number;
  /** Wind direction, degrees (0 when calm). */
  windDeg: number;
  windMps: number;
  /** Cloud fraction 0–1. */
  cloud: number;
}

/**
 * Mid-month anchor values a[i] such that the month average of the piecewise-linear curve through them
 * equals target[i]. With anchors at the month centres, the average over month i is
 * 0.75·a[i] + 0.125·(a[i−1] + a[i+1]) (cyclic), a diagonally dominant system solved here by Jacobi
 * iteration (spectral radius 1/3, so 60 sweeps reach machine precision).
 */
export function monthlyAnchors(target: Monthly): number[] {
  let a = [...target];
  for (let sweep = 0; sweep < 60; sweep++) {
    a = a.map((_, i) => (target[i]! - 0.125 * (a[(i + 11) % 12]! + a[(i + 1) % 12]!)) / 0.75);
  }
  return a;
}

/**
 * Position in the year in month units, 0 ≤ x < 12: month index plus the fraction of the month elapsed.
 * Month centres sit at i + 0.5. `utcMs` is shifted to local mean solar time by the longitude.
 */
export function monthPosition(utcMs: number, lonDeg: number): number {
  const d = new Date(utcMs + (lonDeg / 15) * HOUR_MS);
  const year = d.getUTCFullYear();
  const month = d.getUTCMonth();
  const start = Date.UTC(year, month, 1);
  const end = Date.UTC(year, month + 1, 1);
  return month + (d.getTime() - start) / (end - start);
}

/** Piecewise-linear, cyclic interpolation between 12 values placed at month centres. */
export function interpolateMonthly(values: readonly number[], x: number): number {
  const s = x - 0.5;
  const i0 = Math.floor(s);
  const f = s - i0;
  const lo = values[(i0 + 12) % 12]!;
  const hi = values[(i0 + 13) % 12]!;
  return lo + (hi - lo) * f;
}

/**
 * Diurnal shape on local solar hour h (0–24): −0.5 at 06 h, +0.5 at 15 h, rising and falling along
 * cosine halves; each half averages to zero, so the shape has zero daily mean and unit range.
 */
export function diurnalShape(solarHour: number): number {
  const h = ((solarHour % 24) + 24) % 24;
  const minH = 6;
  const maxH = 15;
  if (h >= minH && h < maxH) return -0.5 * Math.cos((Math.PI * (h - minH)) / (maxH - minH));
  const sinceMax = (h - maxH + 24) % 24; // 0…15 hours of cooling
  return 0.5 * Math.cos((Math.PI * sinceMax) / (24 - (maxH - minH)));
}

/** How strongly cloud narrows the diurnal range: overcast gives (1 − k) of the clear-sky range. */
const CLOUD_RANGE_K = 0.6;

/** Diurnal-range multiplier for cloud fraction c when the month's mean fraction is meanCloud (mean 1). */
export function diurnalCloudFactor(cloud: number, meanCloud: number): number {
  return (1 - CLOUD_RANGE_K * cloud) / (1 - CLOUD_RANGE_K * meanCloud);
}

/** Standard normal distribution function, via erf (Abramowitz and Stegun 7.1.26, error < 1.5e-7). */
export function normalCdf(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * x);
  const poly =
    t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  const erf = 1 - poly * Math.exp(-x * x);
  return z >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
}

/**
 * Offset b such that E[Φ(Z + b)] = meanCloud for a standard normal Z. Since Z + b − Z' with an
 * independent Z' is N(b, 2), E[Φ(Z + b)] = Φ(b/√2); solved by bisection.
 */
export function cloudOffsetFor(meanCloud: number): number {
  const target = Math.min(0.995, Math.max(0.005, meanCloud));
  let lo = -10;
  let hi = 10;
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    if (normalCdf(mid / Math.SQRT2) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Outbreak profile: ramp down over 18 h, hold, recover over 48 h; returns 0–1 of the depth. */
export const OUTBREAK_RAMP_H = 18;
export const OUTBREAK_RECOVER_H = 48;
export const OUTBREAK_HOLD_MIN_H = 24;
export const OUTBREAK_HOLD_MAX_H = 96;
/** Outbreak depths are 3 °C plus an exponential excess, capped at twice the nominal mean depth. */
export const OUTBREAK_DEPTH_MIN_C = 3;
export const OUTBREAK_DEPTH_CAP_FACTOR = 2;

/** Draws one outbreak depth, °C: min(3 + Exp(mean − 3), 2·mean). */
export function drawOutbreakDepthC(uniform: Uniform, nominalMeanC: number): number {
  const excess = exponential(uniform, nominalMeanC - OUTBREAK_DEPTH_MIN_C);
  return Math.min(OUTBREAK_DEPTH_MIN_C + excess, OUTBREAK_DEPTH_CAP_FACTOR * nominalMeanC);
}

/** Expected depth of `drawOutbreakDepthC`: 3 + m·(1 − exp(−(cap − 3)/m)) with m = mean − 3. */
export function outbreakExpectedDepthC(nominalMeanC: number): number {
  const m = nominalMeanC - OUTBREAK_DEPTH_MIN_C;
  const cap = OUTBREAK_DEPTH_CAP_FACTOR * nominalMeanC;
  return OUTBREAK_DEPTH_MIN_C + m * (1 - Math.exp(-(cap - OUTBREAK_DEPTH_MIN_C) / m));
}

export function outbreakProfile(hoursSinceOnset: number, holdH: number): number {
  const t = hoursSinceOnset;
  if (t < 0) return 0;
  if (t < OUTBREAK_RAMP_H) return t / OUTBREAK_RAMP_H;
  if (t < OUTBREAK_RAMP_H + holdH) return 1;
  const r = t - OUTBREAK_RAMP_H - holdH;
  return r < OUTBREAK_RECOVER_H ? 1 - r / OUTBREAK_RECOVER_H : 0;
}

/** Expected °C·hours of one outbreak: depth × (ramp/2 + mean hold + recovery/2). */
export function outbreakMeanDegreeHours(depthMeanC: number): number {
  const meanHold = (OUTBREAK_HOLD_MIN_H + OUTBREAK_HOLD_MAX_H) / 2;
  return depthMeanC * (OUTBREAK_RAMP_H / 2 + meanHold + OUTBREAK_RECOVER_H / 2);
}

/**
 * Seasonal anchors for the base temperature: targets raised by the outbreaks' expected cooling in
 * each month (onsets per month × mean °C·hours / hours per month), then solved for month averages.
 */
export function baseTemperatureAnchors(station: DemoStation): number[] {
  const perOutbreak = outbreakMeanDegreeHours(outbreakExpectedDepthC(station.outbreakDepthMeanC));
  const raised = station.monthlyMeanC.map(
    (m, i) => m + (station.monthlyOutbreaks[i]! * perOutbreak) / (30.44 * 24),
  );
  return monthlyAnchors(raised as unknown as Monthly);
}

/** AR(1) coefficient for a process sampled hourly with e-folding time tauH. */
export function ar1Phi(tauH: number): number {
  return Math.exp(-1 / tauH);
}

/** Sea-level pressure reduced to station level by the hypsometric equation, R_d/g = 29.27 m/K. */
export function stationPressureHpa(seaLevelHpa: number, elevationM: number, tempC: number): number {
  const meanLayerK = cToK(tempC) + (0.0065 * elevationM) / 2;
  return seaLevelHpa * Math.exp(-elevationM / (29.27 * meanLayerK));
}

interface Outbreak {
  onsetMs: number;
  holdH: number;
  depthC: number;
}

/** The station's own random stream: mulberry32 seeded with FNV-1a of "seed:USAF-WBAN". */
export function stationStream(station: DemoStation, seed: number): Uniform {
  return mulberry32(fnv1a32(`${seed}:${station.usaf}-${station.wban}`));
}

/**
 * Simulates every UTC hour in [startUtcMs, endUtcMs). The same station, seed and interval always give
 * the same hours. The stream is also used afterwards by the record writer (QC events, specials), so
 * the caller passes it in.
 */
export function simulateHours(
  station: DemoStation,
  uniform: Uniform,
  startUtcMs: number,
  endUtcMs: number,
): ModelHour[] {
  const meanAnchors = baseTemperatureAnchors(station);
  const rangeAnchors = monthlyAnchors(station.monthlyDiurnalRangeC);
  const phiSyn = ar1Phi(station.synopticTauHours);
  const phiCloud = ar1Phi(30);
  const phiPress = ar1Phi(48);
  const phiWind = ar1Phi(12);
  const innovation = (phi: number) => Math.sqrt(1 - phi * phi);
  // States start from their stationary distributions.
  let syn = standardNormal(uniform);
  let cloudLatent = standardNormal(uniform);
  let pressLatent = standardNormal(uniform);
  let windLatent = standardNormal(uniform);
  let dirDeviation = 0;
  let outbreaks: Outbreak[] = [];
  const hours: ModelHour[] = [];
  for (let t = startUtcMs; t < endUtcMs; t += HOUR_MS) {
    const x = monthPosition(t, station.lonDeg);
    const solarHour = (((t / HOUR_MS) % 24) + station.lonDeg / 15 + 24) % 24;

    syn = phiSyn * syn + innovation(phiSyn) * standardNormal(uniform);
    cloudLatent = phiCloud * cloudLatent + innovation(phiCloud) * standardNormal(uniform);
    pressLatent = phiPress * pressLatent + innovation(phiPress) * standardNormal(uniform);
    windLatent = phiWind * windLatent + innovation(phiWind) * standardNormal(uniform);
    dirDeviation = 0.9 * dirDeviation + 25 * standardNormal(uniform);

    const meanCloud = interpolateMonthly(station.monthlyCloudFraction, x);
    const cloud = normalCdf(cloudLatent + cloudOffsetFor(meanCloud));

    const onsetsPerHour = interpolateMonthly(station.monthlyOutbreaks, x) / (30.44 * 24);
    if (uniform() < onsetsPerHour) {
      outbreaks.push({
        onsetMs: t,
        holdH: uniformInt(uniform, OUTBREAK_HOLD_MIN_H, OUTBREAK_HOLD_MAX_H),
        depthC: drawOutbreakDepthC(uniform, station.outbreakDepthMeanC),
      });
    }
    let outbreakC = 0;
    for (const o of outbreaks) outbreakC += o.depthC * outbreakProfile((t - o.onsetMs) / HOUR_MS, o.holdH);
    outbreaks = outbreaks.filter(
      (o) => (t - o.onsetMs) / HOUR_MS < OUTBREAK_RAMP_H + o.holdH + OUTBREAK_RECOVER_H,
    );

    const shape = diurnalShape(solarHour);
    const rangeC = interpolateMonthly(rangeAnchors, x) * diurnalCloudFactor(cloud, meanCloud);
    const synopticC = interpolateMonthly(station.monthlySynopticSdC, x) * syn;
    const cloudC = interpolateMonthly(station.monthlyCloudWarmingC, x) * (cloud - meanCloud);
    const tempC = interpolateMonthly(meanAnchors, x) + rangeC * shape + synopticC + cloudC - outbreakC;

    // Dew-point depression: wider in the afternoon and under clear skies, never negative.
    const depression =
      interpolateMonthly(station.monthlyDewDepressionC, x) *
      (0.6 + 0.8 * (shape + 0.5)) *
      (1.3 - 0.6 * cloud) *
      Math.exp(0.15 * standardNormal(uniform));
    const dewPointC = tempC - Math.max(0, depression);

    // Sea-level pressure: higher in cold anomalies (anticyclones), hPa.
    const seaLevelHpa = Math.min(1075, Math.max(950, 1013.5 + 7 * pressLatent - 2.5 * syn));
    const windMps = Math.max(0, station.meanWindMps * (1 + 0.5 * windLatent));
    const windDeg =
      windMps < 0.5 ? 0 : ((Math.round(station.prevailingWindDeg + dirDeviation) % 360) + 360) % 360 || 360;
    hours.push({
      utcMs: t,
      tempC,
      dewPointC,
      seaLevelHpa,
      stationHpa: stationPressureHpa(seaLevelHpa, station.elevationM, tempC),
      windDeg,
      windMps,
      cloud,
    });
  }
  return hours;
}
