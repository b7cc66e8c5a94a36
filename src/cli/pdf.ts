/** `coldsoak pdf <report.html> [--out file.pdf] [--paper a4|letter]`: prints a report to PDF. */
import { existsSync, statSync } from "node:fs";
import type { Command } from "commander";
import { InputError } from "../errors.js";
import { type Paper, writePdf } from "../report/pdf.js";

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

export function registerPdf(program: Command): void {
  program
    .command("pdf")
    .description(
      "print an HTML planning report to PDF with the system Chromium (COLDSOAK_CHROMIUM or /usr/bin/chromium)",
    )
    .argument("<report>", "the report.html written by `coldsoak plan`")
    .option("--out <file>", "PDF to write (default: the report's path with .pdf)")
    .option("--paper <size>", "paper size: a4 or letter", "a4")
    .addHelpText(
      "after",
      "\nExamples:\n" +
        "  coldsoak pdf out/demo/report.html                  writes out/demo/report.pdf\n" +
        "  coldsoak pdf out/demo/report.html --paper letter --out demo-letter.pdf\n" +
        "\nNeeds Chromium: Debian's `apt-get install chromium`, or set COLDSOAK_CHROMIUM to its binary.\n" +
        "Exit codes: 0 success, 2 bad input or usage, 1 anything else, such as no browser.",
    )
    .action(async (report: string, opts: { out?: string; paper: string }) => {
      const paper = checkPdfInputs(report, opts.paper);
      const out = opts.out ?? `${report.replace(/\.html?$/i, "")}.pdf`;
      const result = await writePdf(report, out, { paper });
      if (!result.ok) throw new Error(result.message);
      process.stdout.write(`${out}\n`);
    });
}
