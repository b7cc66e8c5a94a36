/**
 * The region screen's page (`screen.html`), rendered from `screen.json` alone: a self-contained page
 * (no script, no network) with the map of the stations coloured by the months needing the cold-start
 * option (`screenMap.ts`), the stations in a table sorted by risk with their status by local month, the
 * season of need, the coldest mornings and break-even margins, and the caution of the report. Text from
 * the data is escaped by handlebars, and in the map's SVG by `escapeXml`.
 */
import type { ScreenResults, ScreenStation } from "../plan/screenResults.js";
import { formatDisplay, pct, show, showWithUnit, unitSystem } from "../units/index.js";
import { generationTime, pageEnvironment, templateText } from "./index.js";
import {
  MAP_CLASSES,
  type MapStation,
  mapClass,
  NO_DATA_COLOR,
  type StationMap,
  stationMap,
} from "./screenMap.js";
import { MONTHS, monthName, STATUS_LABEL, type Status, yearsShort } from "./shared.js";

/** Risk order: more months needing the option, then more still short with it, then the larger short share, the colder 1-in-10 morning; stations without data last. */
function riskOrder(a: ScreenStation, b: ScreenStation): number {
  const worst = (s: ScreenStation) => Math.max(0, ...s.months.map((m) => m.shortPctOne ?? 0));
  const noData = (s: ScreenStation) => (s.yearsUsed.length === 0 ? 1 : 0);
  return (
    noData(a) - noData(b) ||
    b.monthsNeedingOption.length - a.monthsNeedingOption.length ||
    b.monthsStillShort.length - a.monthsStillShort.length ||
    worst(b) - worst(a) ||
    (a.coldest1in10C ?? Number.POSITIVE_INFINITY) - (b.coldest1in10C ?? Number.POSITIVE_INFINITY) ||
    (a.station.id < b.station.id ? -1 : a.station.id > b.station.id ? 1 : 0)
  );
}

/** "Nov / Mar" (fit by, not needed after), "all year", or "–". */
function seasonText(s: ScreenStation): string {
  if (s.fitBy === null || s.notNeededAfter === null) return "–";
  if (s.monthsNeedingOption.length === 12) return "all year";
  return `${monthName(s.fitBy)} / ${monthName(s.notNeededAfter)}`;
}

function stationName(s: ScreenStation): string {
  return s.station.name ?? s.station.id;
}

/** The map's view of a station: its tooltip says the months of need, or why it has none. */
export function mapStation(s: ScreenStation): MapStation {
  const n = s.monthsNeedingOption.length;
  const state = s.yearsUsed.length === 0 ? "no-data" : s.tooFewYears ? "low" : "screened";
  const need =
    state === "no-data"
      ? "no usable climate year"
      : `${n === 0 ? "no month" : `${n} month${n === 1 ? "" : "s"}`} needing the cold-start option${n > 0 ? ` (fit by ${monthName(s.fitBy!)}, not needed after ${monthName(s.notNeededAfter!)})` : ""}; ${yearsShort(s.yearsUsed.length)}${state === "low" ? ", low confidence" : ""}`;
  return {
    id: s.station.id,
    label: `${stationName(s)} (${s.station.id}): ${need}`,
    lat: s.station.lat,
    lon: s.station.lon,
    months: n,
    state,
  };
}

/** The screen's map: every station on Natural Earth's outlines (`screenMap.ts`). */
export function screenMap(r: ScreenResults): StationMap {
  return stationMap(
    r.stations.map(mapStation),
    `Stations screened against profile ${r.profile}, coloured by the number of local months in which the cold-start option is needed`,
  );
}

/** A small constant SVG swatch of a class of the map's key. */
function swatch(fill: string, stroke: string, radius: number, hollow = false): string {
  const paint = hollow
    ? `fill="#fff" stroke="${stroke}" stroke-width="2"`
    : `fill="${fill}" stroke="${stroke}" stroke-width="0.8"`;
  return `<svg class="swatch" viewBox="0 0 20 20" width="20" height="20" aria-hidden="true"><circle cx="10" cy="10" r="${radius}" ${paint}/></svg>`;
}

const NO_DATA_SWATCH = `<svg class="swatch" viewBox="0 0 20 20" width="20" height="20" aria-hidden="true"><path d="M6 6L14 14M6 14L14 6" stroke="${NO_DATA_COLOR}" stroke-width="2"/></svg>`;

/** The view the page template lays out. */
function screenView(r: ScreenResults) {
  const u = unitSystem(r.units);
  const stations = [...r.stations].sort(riskOrder);
  const map = screenMap(r);
  const margin = (s: ScreenStation, units: 1 | 2) => {
    const b = s.breakEven.find((x) => x.units === units);
    return b?.marginC === null || b === undefined ? "–" : showWithUnit(u.tempDelta, b.marginC);
  };
  return {
    plan: r.plan,
    profile: r.profile,
    toolVersion: r.generatedBy,
    generatedAt: generationTime(),
    unitsName: u.name,
    seed: r.seed,
    years:
      r.climate.years === null
        ? "every year the data covers"
        : `${r.climate.years.from}–${r.climate.years.to}`,
    referenceYear: r.referenceYear,
    thresholdText: pct(r.thresholds.shortPct),
    outOfBandThresholdText: pct(r.thresholds.outOfBandPct),
    minYears: r.thresholds.minYears,
    counts: {
      stations: r.stations.length,
      needing: r.stations.filter((s) => s.monthsNeedingOption.length > 0).length,
      stillShort: r.stations.filter((s) => s.monthsStillShort.length > 0).length,
      tooFew: r.stations.filter((s) => s.tooFewYears && s.yearsUsed.length > 0).length,
      noData: r.stations.filter((s) => s.yearsUsed.length === 0).length,
    },
    map: { svg: map.svg },
    mapScale: map.scale === "50m" ? "1:50 m" : "1:110 m",
    mapKey: [
      ...MAP_CLASSES.map((c) => ({ swatch: { svg: swatch(c.color, "#000", c.radius) }, label: c.label })),
      {
        swatch: { svg: swatch(mapClass(3).color, mapClass(3).color, mapClass(3).radius, true) },
        label: `outlined: fewer than ${r.thresholds.minYears} usable climate years`,
      },
      { swatch: { svg: NO_DATA_SWATCH }, label: "no usable climate year" },
    ],
    months: MONTHS,
    rows: stations.map((s, i) => ({
      rank: i + 1,
      name: stationName(s),
      id: s.station.id,
      position: `${formatDisplay(s.station.lat, 3)}, ${formatDisplay(s.station.lon, 3)}, ${showWithUnit(u.length, s.station.elevationM)}`,
      years: s.yearsUsed.length === 0 ? "none" : String(s.yearsUsed.length),
      yearsNote: s.yearsUsed.length === 0 ? "no data" : s.tooFewYears ? "too few" : "",
      cells: s.months.map((m) => ({
        status: m.status as Status,
        lowConfidence: m.lowConfidence,
        title: `${monthName(m.month)}: ${STATUS_LABEL[m.status]}; ${pct(m.shortPctOne)} % of starts short with one accumulator, ${pct(m.shortPctTwo)} % with the option; ${pct(m.outOfBandPct)} % of first preflights out of band`,
      })),
      season: seasonText(s),
      stillShort: s.monthsStillShort.map(monthName).join(", ") || "–",
      coldest: show(u.temp, s.coldest1in10C),
      marginOne: margin(s, 1),
      marginTwo: margin(s, 2),
    })),
    tempUnit: u.temp.unit,
  };
}

let compiled: ReturnType<ReturnType<typeof pageEnvironment>["compile"]> | null = null;

/** Renders `screen.html` from the screen's results alone. */
export function renderScreenPage(r: ScreenResults): string {
  compiled ??= pageEnvironment().compile(templateText("screen.hbs"), { strict: true });
  const css = `${templateText("report.css")}\n${templateText("screen.css")}`;
  const hb = pageEnvironment();
  return compiled({ ...screenView(r), css: new hb.SafeString(css) });
}
