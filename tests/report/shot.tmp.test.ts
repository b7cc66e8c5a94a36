import { resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { it } from "vitest";
import { launchChromium } from "../../src/report/browser.js";

it("shot", async () => {
  const l = await launchChromium();
  const page = await l.browser.newPage();
  const print = process.env.PRINT === "1";
  await page.setViewport({ width: print ? 703 : 1100, height: 900 });
  if (print) await page.emulateMediaType("print");
  await page.goto(pathToFileURL(resolve(process.env.F ?? "out/report/report-us.html")).href);
  const h = (await page.evaluate("document.body.scrollHeight")) as number;
  const w = print ? 703 : 1100;
  for (let y = 0, i = 0; y < h && i < 40; y += 1400, i++)
    await page.screenshot({
      path: `out/report/chunk-${print ? "p" : "s"}${String(i).padStart(2, "0")}.png`,
      clip: { x: 0, y, width: w, height: Math.min(1400, h - y) },
      captureBeyondViewport: true,
    });
  await l.close();
});
