/**
 * The four INVENTED weather stations of the demo scenario and the climate each one is generated with.
 *
 * Everything here is invented for the demo: station ids, names and the monthly targets. The targets are
 * shaped like the published normals of the four climate types (temperate maritime, cold continental,
 * Arctic coastal, hot desert) so that the demo behaves like a real deployment would, but they are not
 * the normals of any real station. Coordinates are plausible rural points (not any airfield's position),
 * chosen only so that the time-zone lookup gives a sensible zone.
 *
 * Ids: the USAF field uses the 9997xx block with WBAN 99999. NOAA uses 999999 as its "no USAF number"
 * placeholder, and we know of no station listed under these combinations (see sample-data/README.md).
 */

/** Twelve values, January to December. */
export type Monthly = readonly [
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
];

export interface DemoStation {
  /** USAF catalogue field (6 characters), invented. */
  usaf: string;
  /** WBAN field (5 digits); 99999 = none. */
  wban: string;
  /** Invented station name (upper case, as station lists write them). */
  name: string;
  /** Name of the demo base that uses the station. */
  baseName: string;
  /** What the station stands for in the scenario. */
  role: string;
  latDeg: number;
  lonDeg: number;
  elevationM: number;
  /** Minute past the hour of the routine (FM-15) report; ≥ 31 means it belongs to the next hour. */
  routineMinute: number;
  /** Quality code written on good temperatures ("1" or "5", both kept by the quality rules, docs/methods.md §4). */
  goodQualityCode: string;

  /** Target monthly mean air temperature, °C (all hours, cold outbreaks included). */
  monthlyMeanC: Monthly;
  /** Target mean amplitude (max − min) of the diurnal cycle, °C, at the month's mean cloudiness. */
  monthlyDiurnalRangeC: Monthly;
  /** Mean cloud fraction 0–1; clear days get a wider diurnal range, overcast days a narrower one. */
  monthlyCloudFraction: Monthly;
  /** Extra warmth of an overcast hour over a clear one, °C (clear winter nights are colder). */
  monthlyCloudWarmingC: Monthly;
  /** Standard deviation of the synoptic (multi-day) anomaly, °C. */
  monthlySynopticSdC: Monthly;
  /** E-folding time of the synoptic anomaly (AR(1) process), hours. */
  synopticTauHours: number;
  /** Expected number of cold-outbreak onsets per month. */
  monthlyOutbreaks: Monthly;
  /** Nominal mean depth of a cold outbreak, °C: 3 °C plus an exponential excess, capped at twice this. */
  outbreakDepthMeanC: number;
  /** Mean dew-point depression, °C. */
  monthlyDewDepressionC: Monthly;
  /** Prevailing wind direction, degrees, and mean wind speed, m/s. */
  prevailingWindDeg: number;
  meanWindMps: number;
}

/** Temperate maritime home base: mild wet winters, dry warm summers. */
export const VELDMOOR: DemoStation = {
  usaf: "999701",
  wban: "99999",
  name: "VELDMOOR FIELD",
  baseName: "Veldmoor",
  role: "temperate home base",
  latDeg: 45.063,
  lonDeg: -123.152,
  elevationM: 61,
  routineMinute: 53,
  goodQualityCode: "5",
  monthlyMeanC: [5.0, 6.0, 8.2, 10.4, 13.8, 16.9, 20.0, 20.1, 17.2, 12.3, 7.6, 4.4],
  monthlyDiurnalRangeC: [6.5, 7.5, 9.0, 11.0, 12.5, 13.5, 15.5, 15.5, 15.0, 12.0, 7.5, 6.0],
  monthlyCloudFraction: [0.85, 0.8, 0.78, 0.72, 0.65, 0.55, 0.3, 0.3, 0.4, 0.62, 0.82, 0.87],
  monthlyCloudWarmingC: [2.5, 2.5, 1.5, 1, 0.5, 0, 0, 0, 0.5, 1, 2, 2.5],
  monthlySynopticSdC: [3.2, 3.0, 2.6, 2.4, 2.4, 2.4, 2.2, 2.2, 2.4, 2.5, 2.9, 3.3],
  synopticTauHours: 60,
  monthlyOutbreaks: [0.4, 0.3, 0.1, 0, 0, 0, 0, 0, 0, 0, 0.2, 0.4],
  outbreakDepthMeanC: 5,
  monthlyDewDepressionC: [2.0, 2.5, 3.5, 4.5, 5.5, 7.0, 9.5, 9.5, 8.0, 4.5, 2.5, 2.0],
  prevailingWindDeg: 200,
  meanWindMps: 3.5,
};

/** Cold continental forward base: long hard winters with Arctic outbreaks, warm short summers. */
export const KORRASH: DemoStation = {
  usaf: "999702",
  wban: "99999",
  name: "KORRASH PLAIN",
  baseName: "Korrash",
  role: "cold continental forward base",
  latDeg: 52.418,
  lonDeg: -105.912,
  elevationM: 507,
  routineMinute: 0,
  goodQualityCode: "1",
  monthlyMeanC: [-15.5, -13.0, -6.0, 4.0, 11.2, 16.0, 18.6, 17.6, 11.4, 4.2, -5.6, -13.4],
  monthlyDiurnalRangeC: [9.0, 10.0, 10.5, 12.5, 13.5, 12.5, 12.5, 13.5, 13.5, 11.5, 8.5, 8.5],
  monthlyCloudFraction: [0.6, 0.6, 0.6, 0.6, 0.55, 0.55, 0.45, 0.45, 0.5, 0.6, 0.7, 0.65],
  monthlyCloudWarmingC: [5, 5, 4, 2, 1, 0, 0, 0, 1, 2, 4, 5],
  monthlySynopticSdC: [5.5, 5.5, 5.0, 4.2, 3.5, 3.0, 2.8, 3.0, 3.6, 4.2, 5.0, 5.5],
  synopticTauHours: 72,
  monthlyOutbreaks: [1.2, 1.0, 0.6, 0.1, 0, 0, 0, 0, 0, 0.1, 0.5, 1.0],
  outbreakDepthMeanC: 7,
  monthlyDewDepressionC: [2.5, 2.8, 3.5, 6.0, 8.0, 7.5, 7.0, 7.5, 7.0, 5.5, 3.0, 2.5],
  prevailingWindDeg: 290,
  meanWindMps: 4.5,
};

/** Arctic coastal base: polar night, sea-ice winter, cool foggy summer on open water. */
export const ISKARRA: DemoStation = {
  usaf: "999703",
  wban: "99999",
  name: "ISKARRA SPIT",
  baseName: "Iskarra",
  role: "Arctic coastal base",
  latDeg: 70.612,
  lonDeg: -153.284,
  elevationM: 9,
  routineMinute: 53,
  goodQualityCode: "5",
  monthlyMeanC: [-25.5, -26.8, -25.2, -16.5, -5.5, 2.5, 5.5, 4.0, -0.8, -9.8, -18.5, -23.5],
  monthlyDiurnalRangeC: [2.0, 3.0, 6.0, 7.0, 5.0, 4.5, 5.0, 4.0, 3.0, 2.5, 2.0, 1.5],
  monthlyCloudFraction: [0.5, 0.5, 0.5, 0.55, 0.75, 0.8, 0.85, 0.88, 0.88, 0.8, 0.65, 0.55],
  monthlyCloudWarmingC: [6, 6, 5, 3, 1, 0, 0, 0, 0.5, 2, 4, 6],
  monthlySynopticSdC: [5.2, 5.2, 5.0, 4.2, 3.0, 2.0, 2.0, 2.0, 2.5, 3.8, 4.8, 5.2],
  synopticTauHours: 72,
  monthlyOutbreaks: [0.5, 0.5, 0.4, 0.1, 0, 0, 0, 0, 0, 0, 0.2, 0.4],
  outbreakDepthMeanC: 7,
  monthlyDewDepressionC: [2.0, 2.0, 2.2, 2.5, 2.0, 1.5, 1.5, 1.5, 1.5, 1.8, 2.0, 2.0],
  prevailingWindDeg: 70,
  meanWindMps: 5.5,
};

/** Hot dry base: desert, mild sunny winters with the odd frosty night, very hot summers. */
export const SABRETH: DemoStation = {
  usaf: "999704",
  wban: "99999",
  name: "SABRETH FLATS",
  baseName: "Sabreth",
  role: "hot dry base",
  latDeg: 33.127,
  lonDeg: -113.388,
  elevationM: 290,
  routineMinute: 56,
  goodQualityCode: "1",
  monthlyMeanC: [12.5, 14.8, 18.5, 22.8, 27.8, 32.6, 34.9, 34.3, 31.2, 24.4, 17.0, 11.9],
  monthlyDiurnalRangeC: [15.5, 16.0, 16.5, 17.5, 18.0, 18.0, 14.5, 14.5, 15.5, 17.0, 16.5, 15.5],
  monthlyCloudFraction: [0.3, 0.3, 0.25, 0.15, 0.1, 0.05, 0.25, 0.25, 0.15, 0.15, 0.2, 0.3],
  monthlyCloudWarmingC: [1.5, 1.5, 1, 0.5, 0, 0, 0, 0, 0, 0.5, 1, 1.5],
  monthlySynopticSdC: [3.0, 3.0, 2.8, 2.5, 2.0, 1.6, 1.4, 1.4, 1.8, 2.4, 2.8, 3.0],
  synopticTauHours: 60,
  monthlyOutbreaks: [0.25, 0.2, 0.05, 0, 0, 0, 0, 0, 0, 0, 0.1, 0.25],
  outbreakDepthMeanC: 5,
  monthlyDewDepressionC: [10, 11, 14, 18, 22, 25, 16, 15, 17, 17, 13, 10],
  prevailingWindDeg: 250,
  meanWindMps: 3.0,
};

export const DEMO_STATIONS: readonly DemoStation[] = [VELDMOOR, KORRASH, ISKARRA, SABRETH];

/** First and last generated year (UTC). */
export const DEMO_FIRST_YEAR = 2011;
export const DEMO_LAST_YEAR = 2020;
/** The seed every committed file was generated with. */
export const DEMO_SEED = 20270101;

/** "USAF-WBAN", the id the climate reader reports. */
export function stationId(station: DemoStation): string {
  return `${station.usaf}-${station.wban}`;
}
