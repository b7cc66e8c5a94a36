/**
 * The size limits of the HTML report and the layout of a split report. Light on purpose (no templates,
 * no charts): `coldsoak pdf` reads the split marker through it.
 *
 * Up to MAX_BASES_IN_ONE_FILE bases the report is one self-contained `report.html`. Beyond it,
 * `report.html` is the fleet overview and each base has a page of its own, `bases/<nnn>.html`, named by
 * the base's position in the plan (never by its name), linked both ways with relative links so that
 * the folder can be moved or zipped. A long fleet-wide list shows its first MAX_LIST_ROWS rows and
 * points to the CSV that holds every row, whatever the number of bases.
 */
import { formatDisplay } from "../units/index.js";

/** At most this many bases in one `report.html`; a plan with more gets an overview and one page per base. */
export const MAX_BASES_IN_ONE_FILE = 12;

/**
 * At most this many rows of a long list (aircraft actions, assumptions) in a page; the rest are
 * counted, with a pointer to the CSV that holds them all.
 */
export const MAX_LIST_ROWS = 250;

/**
 * At most this many stays named in one line of the first screen (the engineer's "fit the option: …"
 * and the like); the line then says how many more there are, all in the aircraft actions.
 */
export const MAX_LINE_ITEMS = 25;

/** The folder of the base pages, beside `report.html`. */
export const BASE_PAGE_DIR = "bases";

/** Whether a plan of `baseCount` bases gets a split report. */
export function isSplit(baseCount: number): boolean {
  return baseCount > MAX_BASES_IN_ONE_FILE;
}

/** The file name of the page of base `index` (0-based): "001.html", …, "999.html", "1000.html". */
export function basePageName(index: number): string {
  return `${String(index + 1).padStart(3, "0")}.html`;
}

/** The page of base `index` relative to the overview: "bases/001.html". */
export function basePagePath(index: number): string {
  return `${BASE_PAGE_DIR}/${basePageName(index)}`;
}

/** Name of the `<meta>` by which a split overview says how many base pages it links to. */
export const SPLIT_META = "coldsoak-base-pages";

/**
 * The number of base pages a report's HTML says it links to (the `<meta>` of a split overview in its
 * head), or null for a report in one file or a base page.
 */
export function basePageCount(html: string): number | null {
  const end = html.indexOf("</head>");
  const head = end < 0 ? html.slice(0, 8192) : html.slice(0, end);
  const m = new RegExp(`<meta name="${SPLIT_META}" content="(\\d+)">`).exec(head);
  return m ? Number(m[1]) : null;
}

/** The part of a long list a page shows, and what it leaves to the CSV. */
export interface ListPart<T> {
  rows: T[];
  /** The rows left out and where they all are, or null when every row is shown. */
  more: { count: string; file: string; href: string; shown: string } | null;
}

/**
 * The first MAX_LIST_ROWS of `rows`, and the count of the rest with the CSV `file` that holds every
 * row (`href`: the file relative to the page, e.g. "../aircraft_actions.csv" from a base page).
 */
export function listPart<T>(rows: T[], file: string, href = file, limit = MAX_LIST_ROWS): ListPart<T> {
  if (rows.length <= limit) return { rows, more: null };
  return {
    rows: rows.slice(0, limit),
    more: {
      count: formatDisplay(rows.length - limit, 0),
      file,
      href,
      shown: formatDisplay(limit, 0),
    },
  };
}

/**
 * What `coldsoak pdf` and `plan --pdf` say of a split report's PDF: it holds the overview alone, and how
 * to print a base's page (`folder`: the report's folder as the user names it).
 */
export function splitPdfNote(count: number, folder: string): string {
  const first = `${folder.replace(/\/+$/, "")}/${basePagePath(0)}`;
  return `the PDF holds the fleet overview only; the ${formatDisplay(count, 0)} base pages in ${BASE_PAGE_DIR}/ are not in it (print one with: coldsoak pdf ${first})`;
}
