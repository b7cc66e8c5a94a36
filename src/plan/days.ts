/**
 * Local days of one stay mapped onto one climate year (docs/methods.md §5), with every instant the
 * simulation needs as UTC milliseconds: local midnights, start times, hangar hours. Daylight saving
 * comes from the IANA time zone database through luxon (`zoneClockFor`); days of 23 or 25 hours keep
 * their true length.
 */
import { zoneClockFor } from "../climate/localTime.js";
import { type CivilDate, civilIso, climateDate, isoWeekday } from "./calendar.js";

export const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

export interface DayPlan {
  /** Real date of the schedule (YYYY-MM-DD). */
  realIso: string;
  /** Climate date it stands for. */
  climateIso: string;
  climateYear: number;
  /** Local calendar month of the climate date, 1–12. */
  month: number;
  flown: boolean;
  midnightUtcMs: number;
  nextMidnightUtcMs: number;
  /** Start instants (UTC ms) on flown days, ascending; the first is the preflight. */
  startsUtcMs: number[];
  /** Local hour of day of each start. */
  startHours: number[];
  /** Hangar intervals [from, to) in UTC ms. */
  hangar: [number, number][];
  /** Local hour of each grid hour from the day's first, only on days that are not 24 hours long. */
  localHours: number[] | null;
}

export interface DayOptions {
  timeZone: string;
  startMinutes: number[];
  flownWeekdays: ReadonlySet<number>;
  /**
   * The hangar's local in and out times and the months it is used (null: all year). An overnight
   * hangar's night belongs to the month of its evening, so both halves of a night go together.
   */
  hangar: { inMin: number; outMin: number; months?: ReadonlySet<number> | null } | null;
}

function previousDay(d: CivilDate): CivilDate {
  const t = new Date(Date.UTC(d.year, d.month - 1, d.day - 1));
  return { year: t.getUTCFullYear(), month: t.getUTCMonth() + 1, day: t.getUTCDate() };
}

function localInstant(d: CivilDate, minutes: number, zone: string): number {
  return zoneClockFor(zone).utcMsOfLocal(d.year, d.month, d.day, minutes);
}

/** Local hour of day (0–23) of a UTC instant. */
function localHourAt(utcMs: number, zone: string): number {
  const localMs = utcMs + zoneClockFor(zone).offsetMinAt(utcMs) * 60_000;
  return Math.floor((((localMs % DAY_MS) + DAY_MS) % DAY_MS) / HOUR_MS);
}

function nextDay(d: CivilDate): CivilDate {
  const t = new Date(Date.UTC(d.year, d.month - 1, d.day + 1));
  return { year: t.getUTCFullYear(), month: t.getUTCMonth() + 1, day: t.getUTCDate() };
}

/** Instant of local clock time `minutes` on date d: fast path on 24-hour days. */
function instantOn(
  d: CivilDate,
  midnight: number,
  dayLengthMs: number,
  minutes: number,
  zone: string,
): number {
  return dayLengthMs === 24 * HOUR_MS ? midnight + minutes * 60_000 : localInstant(d, minutes, zone);
}

/** The day's hangar in and out instants that fall between its grid hours, ascending (each ends a step). */
export function hangarBreaks(day: DayPlan): number[] {
  return day.hangar
    .flat()
    .filter((b) => b % HOUR_MS !== 0 && b > day.midnightUtcMs && b < day.nextMidnightUtcMs)
    .sort((a, b) => a - b);
}

/** Local hour of day of a UTC instant inside the day. */
export function localHourOf(day: DayPlan, utcMs: number, zone: string): number {
  if (day.localHours === null) return Math.floor((utcMs - day.midnightUtcMs) / HOUR_MS);
  const first = Math.ceil(day.midnightUtcMs / HOUR_MS) * HOUR_MS;
  const h = day.localHours[(utcMs - first) / HOUR_MS];
  return h ?? localHourAt(utcMs, zone);
}

/** A real day on a climate year: its climate date and the local midnights that bound it (UTC ms). */
export interface ClimateDay {
  date: CivilDate;
  midnightUtcMs: number;
  nextMidnightUtcMs: number;
}

/**
 * The climate date of real day `real` (real year `referenceYear` maps onto `climateYear`) and its
 * local midnight and the next one: all that the count of a window's hours needs, without the rest of
 * a `DayPlan`.
 */
export function climateDay(
  real: CivilDate,
  referenceYear: number,
  climateYear: number,
  timeZone: string,
): ClimateDay {
  const date = climateDate(real, referenceYear, climateYear);
  return {
    date,
    midnightUtcMs: localInstant(date, 0, timeZone),
    nextMidnightUtcMs: localInstant(nextDay(date), 0, timeZone),
  };
}

/**
 * The days of a stay (real dates) on climate sample `climateYear`: real year `referenceYear` maps onto
 * `climateYear`, the next real year onto the next climate year, and so on. Every stay at one base uses
 * the same reference year (the earliest arrival year there), so stays that overlap in real time see
 * the same weather in each sample (default: the stay's own arrival year).
 */
export function buildDays(
  realDays: CivilDate[],
  climateYear: number,
  opts: DayOptions,
  referenceYear = realDays[0]!.year,
): DayPlan[] {
  return realDays.map((real) => {
    const {
      date: c,
      midnightUtcMs: midnight,
      nextMidnightUtcMs: next,
    } = climateDay(real, referenceYear, climateYear, opts.timeZone);
    const len = next - midnight;
    const flown = opts.flownWeekdays.has(isoWeekday(real));
    const startsUtcMs = flown
      ? opts.startMinutes.map((m) => instantOn(c, midnight, len, m, opts.timeZone))
      : [];
    const hangar: [number, number][] = [];
    const h = opts.hangar;
    if (h !== null) {
      const used = (month: number) => !h.months || h.months.has(month);
      const inMs = instantOn(c, midnight, len, h.inMin, opts.timeZone);
      const outMs = instantOn(c, midnight, len, h.outMin, opts.timeZone);
      if (h.inMin > h.outMin) {
        if (used(previousDay(c).month)) hangar.push([midnight, outMs]);
        if (used(c.month)) hangar.push([inMs, next]);
      } else if (h.inMin < h.outMin && used(c.month)) {
        hangar.push([inMs, outMs]);
      }
    }
    let localHours: number[] | null = null;
    if (len !== 24 * HOUR_MS) {
      localHours = [];
      for (let g = Math.ceil(midnight / HOUR_MS) * HOUR_MS; g < next; g += HOUR_MS) {
        localHours.push(localHourAt(g, opts.timeZone));
      }
    }
    return {
      localHours,
      realIso: civilIso(real),
      climateIso: civilIso(c),
      climateYear: c.year,
      month: c.month,
      flown,
      midnightUtcMs: midnight,
      nextMidnightUtcMs: next,
      startsUtcMs,
      startHours: opts.startMinutes.map((m) => Math.floor(m / 60)),
      hangar,
    };
  });
}
