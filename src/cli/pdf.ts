/** `coldsoak pdf <report.html> [--out file.pdf] [--paper a4|letter]`: prints a report to PDF. */
import { existsSync } from "node:fs";
import type { Command } from "commander";
import { InputError } from "../errors.js";
import { type Paper, writePdf } from "../report/pdf.js";

export function registerPdf(program: Command): void {
  program
    .command("pdf")
    .description(
      "print an HTML planning report to PDF with the system Chromium (COLDSOAK_CHROMIUM or /usr/bin/chromium)",
    )
    .argument("<report>", "the report.html written by `coldsoak plan`")
    .option("--out <file>", "PDF to write (default: the report's path with .pdf)")
    .option("--paper <size>", "paper size: a4 or letter", "a4")
    .action(async (report: string, opts: { out?: string; paper: string }) => {
      if (!existsSync(report)) throw new InputError(`${report}: no such file (expected a report.html)`);
      const paper = opts.paper.toLowerCase();
      if (paper !== "a4" && paper !== "letter")
        throw new InputError(`--paper: expected a4 or letter, got "${opts.paper}"`);
      const out = opts.out ?? report.replace(/\.html?$/i, "") + ".pdf";
      const result = await writePdf(report, out, { paper: paper as Paper });
      if (!result.ok) throw new Error(result.message);
      process.stdout.write(`${out}\n`);
    });
}
