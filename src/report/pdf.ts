/** Prints the HTML report to PDF with the system Chromium (paper from the report's @page rules). */
import { existsSync } from "node:fs";
import { resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { writeFileAtomic } from "../fsutil.js";
import { chromiumAvailable, chromiumPath, launchChromium } from "./browser.js";

export type Paper = "a4" | "letter";

/** The one-line caution repeated in every PDF page footer. */
export const PDF_FOOTER_CAUTION =
  "Planning estimates, not maintenance data: service from the approved maintenance data and the manufacturer's instructions.";

/** Footer of every printed page: the caution, then the page number. Constant markup only. */
export const PDF_FOOTER_TEMPLATE = `<div style="font-size:7px;width:100%;padding:0 12mm;display:flex;justify-content:space-between;color:#555"><span>${PDF_FOOTER_CAUTION}</span><span><span class="pageNumber"></span> / <span class="totalPages"></span></span></div>`;

/**
 * Writes `pdfPath` from `htmlPath`. Never throws for a missing browser: returns `ok: false` with a
 * one-line message, so `coldsoak plan --pdf` can still succeed with the HTML. Every request other than
 * the report file itself is blocked.
 */
export async function writePdf(
  htmlPath: string,
  pdfPath: string,
  options: { paper?: Paper } = {},
): Promise<{ ok: boolean; message: string }> {
  const exe = chromiumPath();
  if (!chromiumAvailable())
    return {
      ok: false,
      message: `no PDF: no Chromium at ${exe} (install it or set COLDSOAK_CHROMIUM); the HTML report is complete`,
    };
  if (!existsSync(htmlPath)) return { ok: false, message: `no PDF: ${htmlPath} does not exist` };
  const url = pathToFileURL(resolve(htmlPath)).href;
  let launched: Awaited<ReturnType<typeof launchChromium>> | null = null;
  try {
    launched = await launchChromium();
    const page = await launched.browser.newPage();
    await page.setRequestInterception(true);
    page.on("request", (req) => {
      if (req.url() === url) void req.continue();
      else void req.abort();
    });
    await page.goto(url, { waitUntil: "load" });
    const pdf = await page.pdf({
      format: options.paper === "letter" ? "letter" : "a4",
      printBackground: true,
      displayHeaderFooter: true,
      headerTemplate: "<span></span>",
      footerTemplate: PDF_FOOTER_TEMPLATE,
      margin: { top: "14mm", bottom: "16mm", left: "12mm", right: "12mm" },
    });
    if (pdf.length === 0) return { ok: false, message: "no PDF: the browser returned an empty file" };
    await writeFileAtomic(pdfPath, pdf);
    return { ok: true, message: `wrote ${pdfPath} (${pdf.length} bytes)` };
  } catch (err) {
    const msg = err instanceof Error ? err.message.split("\n")[0] : String(err);
    return { ok: false, message: `no PDF: ${msg}` };
  } finally {
    await launched?.close();
  }
}
