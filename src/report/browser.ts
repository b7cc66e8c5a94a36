/**
 * The system Chromium, driven headless through puppeteer-core: for the PDF and the browser test.
 * Path from `COLDSOAK_CHROMIUM`, else Debian's `/usr/bin/chromium`. Each launch gets a fresh profile
 * folder, removed on close, and flags that keep the browser off the network.
 */
import { accessSync, constants, statSync } from "node:fs";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import puppeteer, { type Browser } from "puppeteer-core";

export const DEFAULT_CHROMIUM = "/usr/bin/chromium";

/** Flags besides `--headless` (puppeteer adds that one for `headless: "shell"`) and the profile folder. */
export const CHROMIUM_FLAGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export function chromiumPath(env: NodeJS.ProcessEnv = process.env): string {
  const p = env["COLDSOAK_CHROMIUM"];
  return p !== undefined && p !== "" ? p : DEFAULT_CHROMIUM;
}

/** True when the Chromium path is an executable file (a folder or a plain file is not a browser). */
export function chromiumAvailable(env: NodeJS.ProcessEnv = process.env): boolean {
  const exe = chromiumPath(env);
  try {
    if (!statSync(exe).isFile()) return false;
    accessSync(exe, constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

export interface LaunchedBrowser {
  browser: Browser;
  close: () => Promise<void>;
}

/** Starts headless Chromium with a fresh profile; `close` stops it and removes the profile. */
export async function launchChromium(env: NodeJS.ProcessEnv = process.env): Promise<LaunchedBrowser> {
  const profile = await mkdtemp(join(tmpdir(), "coldsoak-chromium-"));
  let browser: Browser;
  try {
    browser = await puppeteer.launch({
      executablePath: chromiumPath(env),
      headless: "shell", // passes plain --headless
      args: [...CHROMIUM_FLAGS, `--user-data-dir=${profile}`],
    });
  } catch (err) {
    await rm(profile, { recursive: true, force: true });
    throw err;
  }
  return {
    browser,
    close: async () => {
      await browser.close().catch(() => undefined);
      await rm(profile, { recursive: true, force: true });
    },
  };
}
