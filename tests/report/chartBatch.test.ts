import { beforeEach, describe, expect, it, vi } from "vitest";

// The chart renderer is replaced by a counter: these tests are about which specs get rendered, not
// about the SVG (tests/report/structure.test.ts and browser.test.ts check real charts).
const calls: string[] = [];
let failNext = false;
vi.mock("../../src/report/chartRender.js", () => ({
  specToSvg: async (spec: { description: string }) => {
    calls.push(spec.description);
    if (failNext) {
      failNext = false;
      throw new Error("renderer failed");
    }
    return `<svg viewBox="0 0 1 1"><g id="g"></g></svg>`;
  },
}));

const { RECENT_SPECS, renderChart, withChartBatch } = await import("../../src/report/chartBatch.js");

/** A spec told apart by its description alone (the renderer is a stand-in). */
const spec = (name: string) => ({ description: name }) as never;

beforeEach(() => {
  calls.length = 0;
});

describe("chart batches", () => {
  it("renders a spec once across batches while it is among the recent ones, each chart with its own ids", async () => {
    const a = await withChartBatch(() => renderChart("p1-c", "Shared, page 1", spec("shared-1"), []));
    const b = await withChartBatch(() => renderChart("p2-c", "Shared, page 2", spec("shared-1"), []));
    expect(calls).toEqual(["shared-1"]);
    expect(a.svg).toContain('id="p1-c"');
    expect(b.svg).toContain('id="p2-c"');
    expect(b.svg).toContain('<title id="p2-c-title">Shared, page 2</title>');
  });

  it("keeps a bounded number of renderings: a spec pushed out by newer ones is rendered again", async () => {
    await withChartBatch(() => renderChart("x", "x", spec("old"), []));
    for (let i = 0; i < RECENT_SPECS; i++)
      await withChartBatch(() => renderChart(`n${i}`, "n", spec(`newer-${i}`), []));
    calls.length = 0;
    await withChartBatch(() => renderChart("x2", "x", spec("old"), []));
    expect(calls).toEqual(["old"]);
  });

  it("does not keep a failed rendering: the next batch asks again", async () => {
    failNext = true;
    await expect(withChartBatch(() => renderChart("f", "f", spec("flaky"), []))).rejects.toThrow(
      /renderer failed/,
    );
    const again = await withChartBatch(() => renderChart("f2", "f", spec("flaky"), []));
    expect(calls).toEqual(["flaky", "flaky"]);
    expect(again.svg).toContain('id="f2"');
  });
});
