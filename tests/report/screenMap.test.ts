/**
 * The screen's map on the real NOAA samples (../shared/isd-samples: the four single-station files and
 * the six Finnish stations of 1901): `coldsoak screen`'s own run from the files to the page, then each
 * station's drawn point, taken back through the map's projection, must lie inside, or within 25 km of,
 * its country's outline in the 1:50 m Natural Earth outlines the map draws (point in polygon with
 * d3-geo). Skips, saying so, where the samples are absent.
 */
import { existsSync } from "node:fs";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { geoContains } from "d3-geo";
import type { MultiPolygon, Polygon, Position } from "geojson";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { parse, stringify } from "yaml";
import type { ScreenResults } from "../../src/plan/screenResults.js";
import { readScreenPlan, runScreen } from "../../src/plan/screenRun.js";
import { countryOutlines, type StationMap } from "../../src/report/screenMap.js";
import { renderScreenPage, screenMap } from "../../src/report/screenPage.js";
import { FIXTURE_TEXT } from "../plan/helpers.js";

const SAMPLES = fileURLToPath(new URL("../../../shared/isd-samples/", import.meta.url));
const HAVE_SAMPLES = existsSync(SAMPLES);
if (!HAVE_SAMPLES) console.warn(`real-sample map tests skipped: no ${SAMPLES}`);

/**
 * Each sample station's country as NOAA's station list gives it (from memory: Svalbard is Norway's;
 * 029xxx are Finnish WMO stations; the sixth Finnish station, 227070, lies on today's border at
 * Värtsilä). Natural Earth draws Åland, part of Finland, as an outline of its own.
 */
const COUNTRY: Record<string, string[]> = {
  "010060-99999": ["Norway"],
  "722540-13904": ["United States of America"],
  "725300-94846": ["United States of America"],
  "726430-14920": ["United States of America"],
  "029070-99999": ["Finland", "Åland"],
  "029500-99999": ["Finland", "Åland"],
  "029600-99999": ["Finland", "Åland"],
  "029720-99999": ["Finland", "Åland"],
  "029810-99999": ["Finland", "Åland"],
  "227070-99999": ["Finland", "Åland"],
};

/** Mean Earth radius, km (IUGG; from memory). */
const EARTH_KM = 6371.0088;

const unit = ([lon, lat]: Position): number[] => {
  const l = (lon! * Math.PI) / 180;
  const p = (lat! * Math.PI) / 180;
  return [Math.cos(p) * Math.cos(l), Math.cos(p) * Math.sin(l), Math.sin(p)];
};
const dot = (a: number[], b: number[]) => a[0]! * b[0]! + a[1]! * b[1]! + a[2]! * b[2]!;
const cross = (a: number[], b: number[]) => [
  a[1]! * b[2]! - a[2]! * b[1]!,
  a[2]! * b[0]! - a[0]! * b[2]!,
  a[0]! * b[1]! - a[1]! * b[0]!,
];
const angle = (a: number[], b: number[]) => Math.atan2(Math.hypot(...cross(a, b)), dot(a, b));

/** Great-circle distance from a point to the arc a–b, km (cross-track distance where the foot falls on the arc). */
function arcDistanceKm(p: Position, a: Position, b: Position): number {
  const [P, A, B] = [unit(p), unit(a), unit(b)];
  const n = cross(A, B);
  const len = Math.hypot(...n);
  if (len < 1e-15) return angle(P, A) * EARTH_KM;
  const s = dot(P, n) / len;
  const foot = P.map((x, i) => x - (s * n[i]!) / len);
  if (angle(A, foot) + angle(foot, B) - angle(A, B) < 1e-9) return Math.abs(Math.asin(s)) * EARTH_KM;
  return Math.min(angle(P, A), angle(P, B)) * EARTH_KM;
}

/** Distance from a point to an outline, km: 0 inside (d3-geo's spherical point in polygon). */
function outlineDistanceKm(f: { geometry: Polygon | MultiPolygon }, p: Position): number {
  if (geoContains(f as never, p as [number, number])) return 0;
  const polygons = f.geometry.type === "Polygon" ? [f.geometry.coordinates] : f.geometry.coordinates;
  let best = Number.POSITIVE_INFINITY;
  for (const rings of polygons)
    for (const ring of rings)
      for (let i = 1; i < ring.length; i++) best = Math.min(best, arcDistanceKm(p, ring[i - 1]!, ring[i]!));
  return best;
}

describe("the screen's map of the real sample stations", () => {
  let root = "";
  let results: ScreenResults;
  let map: StationMap;
  let html = "";

  beforeAll(async () => {
    if (!HAVE_SAMPLES) return;
    root = await mkdtemp(join(tmpdir(), "coldsoak-screen-map-"));
    const t = parse(FIXTURE_TEXT);
    delete t.bases;
    delete t.schedule;
    delete t.nitrogen;
    t.name = "samples";
    // The samples hold January–April (120 of 365 days, 33 %): 30 % of a year counts here, so that
    // the three stations with those months are screened.
    t.climate = { paths: ["unused"], minYearShare: 0.3, minYears: 1 };
    await writeFile(join(root, "plan.yaml"), stringify(t));
    const input = await readScreenPlan(join(root, "plan.yaml"));
    const run = await runScreen(input, "standard", [SAMPLES], { shard: null, workers: 1, cacheDir: null });
    results = run.results as ScreenResults;
    map = screenMap(results);
    html = renderScreenPage(results);
  }, 300_000);
  beforeEach((ctx) => {
    if (!HAVE_SAMPLES) ctx.skip();
  });
  afterAll(async () => {
    if (root !== "") await rm(root, { recursive: true, force: true });
  });

  it("screens all ten stations, those without a usable year shown as such", () => {
    expect(results.stations.map((s) => s.station.id).sort()).toEqual(Object.keys(COUNTRY).sort());
    // Jan–Apr 2014 at Austin, Chicago and Svalbard hold over 30 % of the year; La Crosse (5 days) and
    // 1901's three observations a day are not (ISD samples, shared/README.md).
    const screened = results.stations.filter((s) => s.yearsUsed.length > 0).map((s) => s.station.id);
    expect(screened.sort()).toEqual(["010060-99999", "722540-13904", "725300-94846"]);
    expect(map.scale).toBe("50m");
    expect(html).toContain(map.svg);
  });

  it("puts every station in or within 25 km of its country's outline (Bogskär: nearest outline Finland's)", () => {
    const outlines = countryOutlines("50m").features;
    const drawn = new Map(
      [...map.svg.matchAll(/data-station="([^"]+)" transform="translate\(([-\d.]+) ([-\d.]+)\)"/g)].map(
        (m) => [m[1]!, [Number(m[2]), Number(m[3])] as [number, number]],
      ),
    );
    expect([...drawn.keys()].sort()).toEqual(Object.keys(COUNTRY).sort());
    for (const s of results.stations) {
      const at = map.projection.invert!(drawn.get(s.station.id)!)!;
      // Drawn at 0.1 px: back within 0.05° of the station's own position (the frame spans some 40°).
      expect(Math.abs(at[0] - s.station.lon)).toBeLessThan(0.05);
      expect(Math.abs(at[1] - s.station.lat)).toBeLessThan(0.05);
      const right = COUNTRY[s.station.id]!;
      const km = Math.min(
        ...outlines.filter((f) => right.includes(f.properties.name)).map((f) => outlineDistanceKm(f, at)),
      );
      if (s.station.id === "029810-99999") {
        // Bogskär (59.50 N, 20.35 E), a skerry some 50 km south of the Åland islands that Natural Earth
        // does not draw at 1:50 m: no outline is nearer than Finland's (Åland's).
        const nearest = outlines
          .map((f) => ({ name: f.properties.name, km: outlineDistanceKm(f, at) }))
          .sort((a, b) => a.km - b.km)[0]!;
        expect(right).toContain(nearest.name);
        expect(km).toBeLessThan(60);
      } else expect(km, s.station.id).toBeLessThanOrEqual(25);
    }
  });
});
