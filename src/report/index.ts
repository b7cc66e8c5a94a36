import type { Results } from "../plan/results.js";

/** Renders the self-contained HTML planning report from `results.json` alone. (Stub: replaced by the report work.) */
export async function renderReport(results: Results): Promise<string> {
  return `<!doctype html><html><head><meta charset="utf-8"><title>coldsoak</title></head><body>${results.bases.length}</body></html>`;
}
