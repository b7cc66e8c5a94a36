/**
 * Stay windows on climate years (docs/methods.md §5): a schedule's real dates are mapped onto each year
 * of record by month and day. A window that crosses 31 December runs into the next climate year;
 * a real 29 February folds onto 28 February when the climate year has no 29 February (a leap climate
 * year's own 29 February stands for a real 29 February; it is not visited by stays in common years).
 */
import { DateTime } from "luxon";

/** Month names as plans and messages write them, January first. */
export const MONTH_NAMES = [
  "Jan",
  "Feb",
  "Mar",
  "Apr",
  "May",
  "Jun",
  "Jul",
  "Aug",
  "Sep",
  "Oct",
  "Nov",
  "Dec",
] as const;

export interface CivilDate {
  year: number;
  month: number; // 1–12
  day: number;
}

export function civilIso(d: CivilDate): string {
  return `${String(d.year).padStart(4, "0")}-${String(d.month).padStart(2, "0")}-${String(d.day).padStart(2, "0")}`;
}

export function isLeapYear(y: number): boolean {
  return (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
}

const DAY_MS = 86_400_000;

/** Days since 1970-01-01 of a civil date (proleptic Gregorian calendar, UTC days). */
export function dayNumber(d: CivilDate): number {
  return Date.UTC(d.year, d.month - 1, d.day) / DAY_MS;
}

/**
 * Real calendar days of a stay: from arrive up to, not including, depart (ISO dates). Civil dates
 * without a time zone: counted on the proleptic Gregorian calendar of the ECMAScript Date (UTC days).
 */
export function stayDays(arrive: string, depart: string): CivilDate[] {
  const out: CivilDate[] = [];
  const start = DateTime.fromISO(arrive, { zone: "UTC" }).toMillis();
  const end = DateTime.fromISO(depart, { zone: "UTC" }).toMillis();
  for (let ms = start; ms < end; ms += DAY_MS) {
    const d = new Date(ms);
    out.push({ year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() });
  }
  return out;
}

/** ISO weekday (Monday 1 … Sunday 7) of a real date (a civil date: no time zone involved). */
export function isoWeekday(d: CivilDate): number {
  const sundayFirst = new Date(new Date(0).setUTCFullYear(d.year, d.month - 1, d.day)).getUTCDay(); // Sunday 0 … Saturday 6
  return sundayFirst === 0 ? 7 : sundayFirst;
}

/**
 * The climate date standing for real date `d` of a stay that arrives in `arriveYear`, in the sample
 * year `climateYear` (the year the arrival maps onto). 29 February goes to 28 February unless the
 * climate year is a leap year.
 */
export function climateDate(d: CivilDate, arriveYear: number, climateYear: number): CivilDate {
  const year = climateYear + (d.year - arriveYear);
  if (d.month === 2 && d.day === 29 && !isLeapYear(year)) return { year, month: 2, day: 28 };
  return { year, month: d.month, day: d.day };
}
