/**
 * The screen's map as static inline SVG, drawn on the server: land, coastlines and borders from
 * Natural Earth (the `world-atlas` TopoJSON package, read with `topojson-client`), projected by
 * `d3-geo`, and a point per station coloured by the number of months needing the cold-start option.
 * No script, no network: the page carries the drawn paths.
 *
 * A region (every station within 60° of their centre) is drawn in a Lambert azimuthal equal-area
 * projection centred on the stations, from the 1:50 m outlines, fitted to a 3° circle around each
 * station and clipped to the frame; a spread over more of the globe is drawn whole in the Equal Earth
 * projection (Šavrič, Patterson and Jenny 2019) from the 1:110 m outlines. Classes: ColorBrewer's
 * YlOrRd sequential scheme (Brewer, Hatchard and Harrower 2003) for months with a need, the
 * Okabe–Ito blue for none; the point's size grows with the months, so classes read in greyscale too.
 */
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import {
  type GeoProjection,
  type GeoStream,
  geoAzimuthalEqualArea,
  geoCentroid,
  geoCircle,
  geoDistance,
  geoEqualEarth,
  geoGraticule10,
  geoPath,
} from "d3-geo";
import type { FeatureCollection, GeometryObject, MultiPoint, MultiPolygon, Polygon } from "geojson";
import { feature, mesh } from "topojson-client";
import type { GeometryCollection, Topology } from "topojson-specification";
import { escapeXml } from "./chartBatch.js";

/** Outline resolutions of the atlas: 1:50 m for regions, 1:110 m for the whole globe. */
export type AtlasScale = "50m" | "110m";

const requireFromHere = createRequire(import.meta.url);
const atlases = new Map<AtlasScale, Topology>();

/** The Natural Earth countries of `world-atlas` at one scale (read once per process). */
export function atlas(scale: AtlasScale): Topology {
  let topo = atlases.get(scale);
  if (topo === undefined) {
    const file = requireFromHere.resolve(`world-atlas/countries-${scale}.json`);
    topo = JSON.parse(readFileSync(file, "utf8")) as Topology;
    atlases.set(scale, topo);
  }
  return topo;
}

/** The drawn layers of the atlas at one scale: land (filled), coastlines and borders, as geometry. */
interface AtlasLayers {
  landFill: GeoJSON.FeatureCollection;
  coast: GeoJSON.MultiLineString;
  borders: GeoJSON.MultiLineString;
}

const layers = new Map<AtlasScale, AtlasLayers>();

/** The layers of the atlas at one scale (converted from TopoJSON once per process). */
function atlasLayers(scale: AtlasScale): AtlasLayers {
  let l = layers.get(scale);
  if (l === undefined) {
    const topo = atlas(scale);
    const countries = topo.objects["countries"] as GeometryCollection;
    l = {
      landFill: feature(topo, countries) as GeoJSON.FeatureCollection,
      coast: mesh(topo, countries, (a, b) => a === b),
      borders: mesh(topo, countries, (a, b) => a !== b),
    };
    layers.set(scale, l);
  }
  return l;
}

/**
 * Reads and converts the atlas at both scales ahead of the first map, so that a screen does it while
 * its workers run rather than after them. Maps are the same with or without it.
 */
export function warmAtlas(): void {
  atlasLayers("50m");
  atlasLayers("110m");
}

/** Every country outline of the atlas at one scale, named as Natural Earth names them. */
export function countryOutlines(
  scale: AtlasScale,
): FeatureCollection<Polygon | MultiPolygon, { name: string }> {
  const topo = atlas(scale);
  return feature(
    topo,
    topo.objects["countries"] as GeometryCollection<{ name: string }>,
  ) as FeatureCollection<Polygon | MultiPolygon, { name: string }>;
}

/** One station on the map. */
export interface MapStation {
  id: string;
  /** Plain text of its tooltip (escaped here). */
  label: string;
  lat: number;
  lon: number;
  /** Months needing the cold-start option, 0–12. */
  months: number;
  /** "low": fewer usable years than the plan's minimum (outlined); "no-data": no usable year (a cross). */
  state: "screened" | "low" | "no-data";
}

/** A class of the map's colour key. */
export interface MapClass {
  label: string;
  color: string;
  radius: number;
  /** Lowest and highest months of need in the class. */
  from: number;
  to: number;
}

/** The colour classes by months needing the option. */
export const MAP_CLASSES: MapClass[] = [
  { label: "none", color: "#0072B2", radius: 3.5, from: 0, to: 0 },
  { label: "1–2 months", color: "#fecc5c", radius: 4.5, from: 1, to: 2 },
  { label: "3–4 months", color: "#fd8d3c", radius: 5.5, from: 3, to: 4 },
  { label: "5–6 months", color: "#f03b20", radius: 6.5, from: 5, to: 6 },
  { label: "7–12 months", color: "#bd0026", radius: 7.5, from: 7, to: 12 },
];

/** Colour of a station without data. */
export const NO_DATA_COLOR = "#6b7280";

export function mapClass(months: number): MapClass {
  return MAP_CLASSES.find((c) => months >= c.from && months <= c.to) ?? MAP_CLASSES[MAP_CLASSES.length - 1]!;
}

/** A drawn map: its SVG, the projection and atlas scale it was drawn with, and each station's position. */
export interface StationMap {
  svg: string;
  projection: GeoProjection;
  scale: AtlasScale;
  points: { id: string; x: number; y: number }[];
}

/** Widest spread (degrees from the stations' centre) drawn as a region. */
const REGION_MAX_SPREAD_DEG = 60;
/** Radius of the circle kept in view around each station, degrees. */
const CONTEXT_RADIUS_DEG = 3;
/** Frame of the map, px, and the margin inside it. */
const WIDTH = 760;
const HEIGHT = 440;
const MARGIN = 12;

/** The projection of a set of stations (see the module comment) and the atlas scale it goes with. */
function projectionFor(coords: [number, number][]): { projection: GeoProjection; scale: AtlasScale } {
  const frame: [[number, number], [number, number]] = [
    [MARGIN, MARGIN],
    [WIDTH - MARGIN, HEIGHT - MARGIN],
  ];
  const stations: MultiPoint = { type: "MultiPoint", coordinates: coords };
  const centre = geoCentroid(stations);
  const spreadDeg = Math.max(0, ...coords.map((c) => (geoDistance(centre, c) * 180) / Math.PI));
  if (coords.length === 0 || spreadDeg > REGION_MAX_SPREAD_DEG)
    return { projection: geoEqualEarth().fitExtent(frame, { type: "Sphere" }), scale: "110m" };
  const context: GeometryObject = {
    type: "GeometryCollection",
    geometries: coords.map((c) => geoCircle().center(c).radius(CONTEXT_RADIUS_DEG)()),
  } as GeometryObject;
  const projection = geoAzimuthalEqualArea()
    .rotate([-centre[0], -centre[1]])
    .clipAngle(150)
    .fitExtent(frame, context)
    .clipExtent([
      [0, 0],
      [WIDTH, HEIGHT],
    ]);
  return { projection, scale: "50m" };
}

/** Vertices closer than this to the last one drawn are left out, px (no screen shows them apart). */
const MIN_STEP_PX = 0.7;

/**
 * A stream stage after the projection that leaves out vertices closer than MIN_STEP_PX to the last
 * one passed on; each line's first and last vertex always pass, so rings stay closed.
 */
function dropNearVertices(out: GeoStream): GeoStream {
  let lastX = 0;
  let lastY = 0;
  let pending: [number, number] | null = null;
  let first = true;
  return {
    point(x, y) {
      if (first || Math.hypot(x - lastX, y - lastY) >= MIN_STEP_PX) {
        out.point(x, y);
        [lastX, lastY, first, pending] = [x, y, false, null];
      } else pending = [x, y];
    },
    lineStart() {
      first = true;
      pending = null;
      out.lineStart();
    },
    lineEnd() {
      if (pending !== null) out.point(pending[0], pending[1]);
      pending = null;
      out.lineEnd();
    },
    polygonStart: () => out.polygonStart(),
    polygonEnd: () => out.polygonEnd(),
    sphere: () => out.sphere?.(),
  };
}

const f1 = (v: number) => (Math.round(v * 10) / 10).toString();

/** The SVG of one station's mark, placed at (x, y) by its group's translation. */
function pointSvg(s: MapStation, x: number, y: number): string {
  const open = `<g class="pt${s.state === "no-data" ? " pt-nodata" : ""}" data-station="${escapeXml(s.id)}" transform="translate(${f1(x)} ${f1(y)})"><title>${escapeXml(s.label)}</title>`;
  if (s.state === "no-data")
    return `${open}<path d="M-4 -4L4 4M-4 4L4 -4" stroke="${NO_DATA_COLOR}" stroke-width="2"/></g>`;
  const c = mapClass(s.months);
  const paint =
    s.state === "low"
      ? `fill="#fff" stroke="${c.color}" stroke-width="2"`
      : `fill="${c.color}" stroke="#000" stroke-width="0.8"`;
  return `${open}<circle r="${c.radius}" ${paint}/></g>`;
}

/**
 * Draws the stations on land, coastlines and borders. Stations needing the option in more months are
 * drawn last (on top).
 */
export function stationMap(stations: MapStation[], title: string, id = "screen-map"): StationMap {
  const coords = stations.map((s) => [s.lon, s.lat] as [number, number]);
  const { projection, scale } = projectionFor(coords);
  const layer = atlasLayers(scale);
  const path = geoPath({ stream: (out) => projection.stream(dropNearVertices(out)) }).digits(1);
  const land = path(layer.coast) ?? "";
  const landFill = path(layer.landFill) ?? "";
  const borders = path(layer.borders) ?? "";
  const points: StationMap["points"] = [];
  const order = stations
    .map((s, i) => ({ s, i }))
    .sort((a, b) => a.s.months - b.s.months || (a.s.id < b.s.id ? -1 : a.s.id > b.s.id ? 1 : 0));
  const marks: string[] = [];
  for (const { s, i } of order) {
    const xy = projection(coords[i]!);
    if (xy === null) continue;
    points.push({ id: s.id, x: xy[0], y: xy[1] });
    marks.push(pointSvg(s, xy[0], xy[1]));
  }
  const svg = [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${HEIGHT}" width="${WIDTH}" height="${HEIGHT}" role="img" aria-labelledby="${id}-title" id="${id}">`,
    `<title id="${id}-title">${escapeXml(title)}</title>`,
    `<path d="${path({ type: "Sphere" }) ?? ""}" fill="#eef4f8"/>`,
    `<path d="${path(geoGraticule10()) ?? ""}" fill="none" stroke="#d5dee6" stroke-width="0.5"/>`,
    `<path d="${landFill}" fill="#f4f1ea"/>`,
    `<path d="${borders}" fill="none" stroke="#9aa0a6" stroke-width="0.6"/>`,
    `<path d="${land}" fill="none" stroke="#5f6b75" stroke-width="0.7"/>`,
    ...marks,
    "</svg>",
  ].join("\n");
  return { svg, projection, scale, points };
}
