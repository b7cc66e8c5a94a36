/**
 * `coldsoak pdf`: the command's definition (arguments, options, help). Its work, `pdfRun.ts`, with the
 * browser driver, is loaded only when the command runs.
 */
import type { Command } from "commander";
import type { PdfCliOptions } from "./pdfRun.js";

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
        "\nA report split by base (more bases than one file holds) prints the page given: its report.html\n" +
        "is the fleet overview alone (the terminal says so); print a base's page from its bases/ folder.\n" +
        "\nNeeds Chromium: Debian's `apt-get install chromium`, or set COLDSOAK_CHROMIUM to its binary.\n" +
        "Exit codes: 0 success, 2 bad input or usage, 1 anything else, such as no browser.",
    )
    .action(async (report: string, opts: PdfCliOptions) => {
      const { pdfAction } = await import("./pdfRun.js");
      await pdfAction(report, opts);
    });
}
