/**
 * Report section "Data coverage" (back matter, one block per base): the stations with their record
 * and completeness, and the quality-control counts by drop reason. Reads `BaseResult.stations`
 * (`qc` counts included), `yearsUsed` and `yearsSkipped`.
 */
import type { Results, StationResult } from "../../plan/results.js";
import { formatDisplay, pct, show, type UnitSystem } from "../../units/index.js";
import { baseAnchor, type TableRow, yearsSkippedText, yearsText } from "../shared.js";

type DropReason = keyof StationResult["qc"]["dropped"];

/** Column headers of the quality-control table, one per drop reason of the results, in column order. */
const QC_COLUMNS: Record<DropReason, string> = {
  malformed: "Malformed",
  summary: "Summary",
  otherSite: "Other site",
  missing: "Missing",
  range: "Range",
  erroneous: "Erroneous",
  suspect: "Suspect",
  duplicate: "Duplicate",
};
const QC_REASONS = Object.keys(QC_COLUMNS) as DropReason[];

export interface CoverageView {
  base: string;
  anchor: string;
  stations: TableRow[];
  /** Headers of the drop-reason columns of the quality-control table. */
  qcColumns: string[];
  qc: TableRow[];
  yearsUsed: string;
  yearsSkipped: string;
}

/** "2015-01-01T00:00:00Z" → "2015-01-01 00:00" (the column header says UTC). */
function shortUtc(iso: string): string {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2})/.exec(iso);
  return m ? `${m[1]} ${m[2]}` : iso;
}

/** A date-time kept on one line: no-break space and non-breaking hyphens (U+00A0, U+2011). */
function unbroken(text: string): string {
  return text.replace(/ /g, "\u00a0").replace(/-/g, "\u2011");
}

/** The data coverage of every base, in plan order. */
export function coverageSection(results: Results, u: UnitSystem): CoverageView[] {
  return results.bases.map((_b, i) => baseCoverage(results, i, u));
}

/** The data coverage of base `i` (0-based). */
export function baseCoverage(results: Results, i: number, u: UnitSystem): CoverageView {
  const b = results.bases[i]!;
  return {
    base: b.name,
    anchor: baseAnchor(i),
    stations: b.stations.map((s) => ({
      cells: [
        s.id,
        s.name ?? "–",
        `${formatDisplay(s.lat, 3)}, ${formatDisplay(s.lon, 3)}`,
        show(u.length, s.elevationM),
        s.timeZone,
        `${unbroken(shortUtc(s.firstUtc))} to ${unbroken(shortUtc(s.lastUtc))}`,
        formatDisplay(s.hours, 0),
        formatDisplay(s.filledHours, 0),
        pct(s.completeness * 100),
      ],
    })),
    qcColumns: QC_REASONS.map((r) => QC_COLUMNS[r]),
    qc: b.stations.map((s) => ({
      cells: [
        s.id,
        formatDisplay(s.qc.read, 0),
        formatDisplay(s.qc.kept, 0),
        ...QC_REASONS.map((r) => formatDisplay(s.qc.dropped[r], 0)),
      ],
    })),
    yearsUsed: yearsText(b.yearsUsed),
    yearsSkipped: yearsSkippedText(results, b),
  };
}
