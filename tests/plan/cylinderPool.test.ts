/**
 * The pool hands each event only the cylinders that can give it gas. Checked here against the cascade
 * run on the whole pool (every cylinder opened, in the order opened, as docs/methods.md §7 describes it):
 * the same gas added, vented, drawn, cylinders opened and amounts left, to the last bit, over a long
 * seeded sequence of servicings, full recharges from empty and other uses at changing temperatures.
 */
import { describe, expect, it } from "vitest";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { realGas } from "../../src/physics/nitrogen.js";
import {
  type Cylinder,
  cascadeFill,
  drawFromCylinders,
  fullCylinder,
  type SupplySpec,
} from "../../src/physics/supply.js";
import { CylinderPool, MAX_CYLINDERS_PER_EVENT } from "../../src/plan/cylinderPool.js";
import { stream } from "../../src/plan/random.js";
import { fToK, PA_PER_PSI } from "../../src/units/index.js";

const model = tabulatedGas(realGas);
const ATM = 101325;
// A 49.9 L cylinder filled to 2640 psig at 70 °F, 50 psi transfer differential, a 0.1 L hose: common
// practice for a nitrogen cart, no source (the test compares two ways of one computation).
const spec: SupplySpec = {
  cylinderWaterVolumeM3: 49.9e-3,
  fillAbsPa: 2640 * PA_PER_PSI + ATM,
  fillTempK: fToK(70),
  transferDifferentialPa: 50 * PA_PER_PSI,
  hoseVolumeM3: 0.1e-3,
};

/** The cascade on every cylinder of the pool, the way the pool worked before it chose cylinders. */
class WholePool {
  cylinders: Cylinder[] = [];
  opened = 0;
  unreachable = 0;

  private open(): void {
    this.cylinders = [...this.cylinders, fullCylinder(model, spec)];
    this.opened++;
  }

  fill(v0M3: number, fromMol: number, toMol: number, tempK: number) {
    let from = fromMol;
    let hoseMol = 0;
    for (let k = 0; k <= MAX_CYLINDERS_PER_EVENT; k++) {
      const r = cascadeFill(model, this.cylinders, v0M3, from, toMol, tempK, spec);
      this.cylinders = r.cylinders;
      hoseMol += r.ventedMol;
      from += r.addedMol;
      if (r.reachedTarget) break;
      if (k === MAX_CYLINDERS_PER_EVENT || (k > 0 && r.addedMol <= 0)) {
        this.unreachable++;
        break;
      }
      this.open();
    }
    return { addedMol: from - fromMol, hoseMol };
  }

  draw(amountMol: number, floorAbsPa: number, tempK: number): number {
    let left = amountMol;
    for (let k = 0; k <= MAX_CYLINDERS_PER_EVENT; k++) {
      const r = drawFromCylinders(model, this.cylinders, left, floorAbsPa, tempK);
      this.cylinders = r.cylinders;
      left -= r.drawnMol;
      if (r.reachedAmount) break;
      if (k === MAX_CYLINDERS_PER_EVENT || (k > 0 && r.drawnMol <= 0)) {
        this.unreachable++;
        break;
      }
      this.open();
    }
    return amountMol - left;
  }
}

describe("cylinder pool", () => {
  it("gives, event by event, exactly what the cascade on the whole pool gives", () => {
    const u = stream(1, "pool-test");
    const pool = new CylinderPool(model, spec);
    const whole = new WholePool();
    const v0M3 = 5e-3;
    let events = 0;
    for (let i = 0; i < 3000; i++) {
      const tempK = fToK(-20 + 100 * u());
      // A precharge near 1450 psig at 70 °F in a 5 L gas volume holds about 31 mol (common practice, no source).
      const toMol = 27 + 8 * u();
      const kind = u();
      if (kind < 0.5) {
        const from = toMol * (0.85 + 0.14 * u());
        expect(pool.fill(v0M3, from, toMol, tempK)).toEqual(whole.fill(v0M3, from, toMol, tempK));
      } else if (kind < 0.6) {
        // A full recharge from an emptied gas side.
        expect(pool.fill(v0M3, 0, toMol, tempK)).toEqual(whole.fill(v0M3, 0, toMol, tempK));
      } else {
        const floor = (1450 + 50) * PA_PER_PSI + ATM;
        const amount = 10 * u();
        expect(pool.draw(amount, floor, tempK)).toBe(whole.draw(amount, floor, tempK));
      }
      events++;
    }
    expect(events).toBe(3000);
    expect(pool.opened).toBe(whole.opened);
    expect(pool.opened).toBeGreaterThan(50);
    expect(pool.unreachable).toBe(whole.unreachable);
    expect(pool.cylinders.map((c) => c.amountMol)).toEqual(whole.cylinders.map((c) => c.amountMol));
  });
});
