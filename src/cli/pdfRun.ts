/** `coldsoak pdf <report.html> [--out file.pdf] [--paper a4|letter]`: prints a report to PDF. */
import { existsSync, readFileSync, statSync } from "node:fs";
import { dirname } from "node:path";
import { InputError } from "../errors.js";
import { type Paper, writePdf } from "../report/pdf.js";
import { basePageCount, splitPdfNote } from "../report/split.js";

/** Checks the command's inputs; throws InputError (exit 2) saying what was expected. */
export function checkPdfInputs(report: string, paperText: string): Paper {
  if (!existsSync(report)) throw new InputError(`${report}: no such file (expected a report.html)`);
  if (!statSync(report).isFile())
    throw new InputError(`${report}: is a folder (expected the report.html file inside it)`);
  if (!/\.html?$/i.test(report))
    throw new InputError(`${report}: not an HTML file (expected the report.html written by coldsoak plan)`);
  const paper = paperText.toLowerCase();
  if (paper !== "a4" && paper !== "letter")
    throw new InputError(`--paper: expected a4 or letter, got "${paperText}"`);
  return paper;
}

export interface PdfCliOptions {
  out?: string;
  paper: string;
}

/**
 * `coldsoak pdf` once its options are parsed: prints the report to PDF and its path. Of a split report
 * (more bases than one file holds) it prints the page it is given, the fleet overview or one base's
 * page, and says on stderr that the base pages are separate.
 */
export async function pdfAction(report: string, opts: PdfCliOptions): Promise<void> {
  const paper = checkPdfInputs(report, opts.paper);
  const out = opts.out ?? `${report.replace(/\.html?$/i, "")}.pdf`;
  const result = await writePdf(report, out, { paper });
  if (!result.ok) throw new Error(result.message);
  // A split report's overview is printed alone: say so, and how to print a base's page.
  const pages = basePageCount(readFileSync(report, "utf8"));
  if (pages !== null) process.stderr.write(`note: ${splitPdfNote(pages, dirname(report))}\n`);
  process.stdout.write(`${out}\n`);
}
