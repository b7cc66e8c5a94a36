/**
 * The cylinders of one nitrogen sample at a base (docs/methods.md §7): every cylinder opened so far,
 * drawn on by the cascade of the physics module (`cascadeFill`, `drawFromCylinders`: lowest pressure
 * first), a new full cylinder opened whenever the pool cannot meet an event.
 *
 * A pool at a busy base holds hundreds of cylinders, most of them spent, and sees tens of thousands of
 * events a year. The physics functions sort every cylinder they are given by pressure, so the pool
 * hands each event only the cylinders that can give it gas, in the order they were opened; a cylinder
 * left out would have given nothing (below the draw's floor, or at a pressure no higher than the
 * receiver's plus the transfer differential, which only rises during a fill), so the result is the
 * one the whole pool gives. To find those cylinders without a scan, the pool also keeps them sorted
 * by the gas they hold, where the pressure rises with the amount (one water volume and one temperature
 * per event).
 */
import type { GasModel } from "../physics/nitrogen.js";
import {
  type Cylinder,
  cascadeFill,
  cylinderPressureAbsPa,
  drawFromCylinders,
  fullCylinder,
  type SupplySpec,
} from "../physics/supply.js";

/** Most cylinders opened for one event before it counts as one the pool cannot meet. */
export const MAX_CYLINDERS_PER_EVENT = 20;

/**
 * Relative margin below the receiver's pressure plus the differential down to which cylinders are
 * still handed to a fill: a guard far above the rounding of the pressure lookups, never a cut of gas.
 */
const FILL_MARGIN = 1e-9;

/** A cylinder of the pool with the rank it was opened in. */
interface Opened {
  cyl: Cylinder;
  rank: number;
}

export class CylinderPool {
  /** Every cylinder opened, in the order opened (their amounts change in place). */
  readonly cylinders: Cylinder[] = [];
  opened = 0;
  unreachable = 0;
  /** The same cylinders by the gas they hold, ascending. */
  private readonly byAmount: Opened[] = [];

  constructor(
    private readonly model: GasModel,
    private readonly spec: SupplySpec,
  ) {}

  /** Opens one more full cylinder. */
  private open(): void {
    const cyl = fullCylinder(this.model, this.spec);
    this.cylinders.push(cyl);
    this.insert({ cyl, rank: this.opened });
    this.opened++;
  }

  /** Index of the first cylinder by amount for which `holds` is true (`holds` rises with the amount). */
  private firstHolding(holds: (cyl: Cylinder) => boolean): number {
    let lo = 0;
    let hi = this.byAmount.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (holds(this.byAmount[mid]!.cyl)) hi = mid;
      else lo = mid + 1;
    }
    return lo;
  }

  private insert(o: Opened): void {
    const at = this.firstHolding((c) => c.amountMol > o.cyl.amountMol);
    this.byAmount.splice(at, 0, o);
  }

  /**
   * Runs `step` on the cylinders from `from` on (by amount) in the order they were opened, writes
   * their new amounts back and puts them in place again.
   */
  private useFrom<R extends { cylinders: Cylinder[] }>(from: number, step: (cylinders: Cylinder[]) => R): R {
    const taken = this.byAmount.splice(from).sort((a, b) => a.rank - b.rank);
    const r = step(taken.map((o) => o.cyl));
    taken.forEach((o, i) => {
      o.cyl.amountMol = r.cylinders[i]!.amountMol;
      this.insert(o);
    });
    return r;
  }

  /**
   * One accumulator from fromMol toward toMol through the cascade, opening cylinders while the pool
   * cannot reach the target. Returns the gas added to it and vented from the hose, mol.
   */
  fill(v0M3: number, fromMol: number, toMol: number, tempK: number): { addedMol: number; hoseMol: number } {
    const vRecM3 = v0M3 + this.spec.hoseVolumeM3;
    const { model } = this;
    let from = fromMol;
    let hoseMol = 0;
    for (let k = 0; k <= MAX_CYLINDERS_PER_EVENT; k++) {
      const receiverPa = from > 0 ? model.pressurePa(from / vRecM3, tempK) : 0;
      const floorPa = (receiverPa + this.spec.transferDifferentialPa) * (1 - FILL_MARGIN);
      const first = this.firstHolding((c) => cylinderPressureAbsPa(model, c, tempK) >= floorPa);
      const r = this.useFrom(first, (cs) => cascadeFill(model, cs, v0M3, from, toMol, tempK, this.spec));
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

  /** An amount for another use, down to the floor pressure, opening cylinders as needed. Returns mol drawn. */
  draw(amountMol: number, floorAbsPa: number, tempK: number): number {
    const floorMolM3 = this.model.densityMolM3(floorAbsPa, tempK);
    let left = amountMol;
    for (let k = 0; k <= MAX_CYLINDERS_PER_EVENT; k++) {
      // drawFromCylinders takes nothing from a cylinder holding no more than the floor's amount.
      const first = this.firstHolding((c) => c.amountMol - floorMolM3 * c.waterVolumeM3 > 0);
      const r = this.useFrom(first, (cs) => drawFromCylinders(this.model, cs, left, floorAbsPa, tempK));
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
