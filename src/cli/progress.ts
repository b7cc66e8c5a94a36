/**
 * Progress bars on stderr, drawn only on a terminal: the bar library is loaded only there
 * (`loadBars`), so a run into a pipe or a file never loads it.
 */
import type { SingleBar } from "cli-progress";

/** The progress bar library, loaded only where a bar can be drawn (stderr is a terminal). */
export type Bars = typeof import("cli-progress") | null;

/** The bar library when stderr is a terminal, else null (no bar is drawn). */
export async function loadBars(): Promise<Bars> {
  return process.stderr.isTTY ? await import("cli-progress") : null;
}

/** A progress bar labelled `label`; with `eta`, the estimated time left too. Nothing is drawn without `bars`. */
export function progressBar(
  bars: Bars,
  label: string,
  eta = false,
): { update: (done: number, total: number) => void; stop: () => void } {
  let bar: SingleBar | null = null;
  return {
    update(done, total) {
      if (bars === null) return;
      if (bar === null) {
        bar = new bars.SingleBar({
          stream: process.stderr,
          format: `${label} [{bar}] {value}/{total}${eta ? " | {eta_formatted} left" : ""}`,
          hideCursor: true,
        });
        bar.start(total, 0);
      }
      bar.update(done);
    },
    stop() {
      (bar as SingleBar | null)?.stop();
      bar = null;
    },
  };
}
