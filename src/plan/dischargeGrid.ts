/**
 * Start-discharge results of one profile on a lazily filled grid, interpolated trilinearly: the
 * hour-by-hour loop asks for thousands of discharges from states that differ little, and each exact
 * real-gas isentropic discharge (physics `startDischarge`, Span et al. 2000) costs tens of
 * microseconds. Grid nodes are computed exactly on first use and kept.
 *
 * Axes: accumulator temperature (1 K), gas amount relative to the precharge reference (0.5 %), and
 * piston position as the gas volume's share of the stroke (2 %). The interpolation error against the
 * exact discharge is checked in tests/plan/dischargeGrid.test.ts.
 */
import { type AccumulatorGeometry, type StarterSpec, startDischarge } from "../physics/accumulator.js";
import type { GasModel } from "../physics/nitrogen.js";

const T_STEP_K = 1;
const T_MIN_K = 150;
const N_STEP = 0.005;
const F_STEP = 0.02;

export interface DischargeGrid {
  /** Hydraulic energy of one unit (J) and its gas volume at the end of the discharge (m³). */
  lookup(amountMol: number, tempK: number, gasVolumeM3: number, out: Float64Array): void;
  nodes(): number;
}

export function dischargeGrid(
  model: GasModel,
  geometry: AccumulatorGeometry,
  starter: StarterSpec,
  referenceMol: number,
): DischargeGrid {
  const cache = new Map<number, Float64Array>();
  const stroke = geometry.v0M3 - geometry.vminM3;
  const nodeValue = (it: number, in_: number, iF: number): Float64Array => {
    const key = (it * 4096 + in_) * 64 + iF;
    let v = cache.get(key);
    if (v === undefined) {
      const t = T_MIN_K + it * T_STEP_K;
      const n = Math.max(in_ * N_STEP, N_STEP) * referenceMol;
      const vol = geometry.vminM3 + Math.min(1, iF * F_STEP) * stroke;
      const d = startDischarge(model, geometry, 1, n, t, vol, starter);
      v = new Float64Array([d.hydraulicEnergyJ, d.end.gasVolumeM3]);
      cache.set(key, v);
    }
    return v;
  };
  return {
    nodes: () => cache.size,
    lookup(amountMol, tempK, gasVolumeM3, out) {
      const xt = Math.max(0, (tempK - T_MIN_K) / T_STEP_K);
      const xn = Math.min(4000, Math.max(1, amountMol / referenceMol / N_STEP));
      const xf = Math.min(1 / F_STEP, Math.max(0, (gasVolumeM3 - geometry.vminM3) / stroke / F_STEP));
      const it = Math.floor(xt);
      const in_ = Math.floor(xn);
      const iF = Math.min(Math.floor(xf), Math.round(1 / F_STEP) - 1);
      const ft = xt - it;
      const fn = xn - in_;
      const ff = xf - iF;
      let e = 0;
      let v = 0;
      for (let a = 0; a < 2; a++) {
        const wa = a === 0 ? 1 - ft : ft;
        if (wa === 0) continue;
        for (let b = 0; b < 2; b++) {
          const wb = b === 0 ? 1 - fn : fn;
          if (wb === 0) continue;
          for (let c = 0; c < 2; c++) {
            const wc = c === 0 ? 1 - ff : ff;
            if (wc === 0) continue;
            const node = nodeValue(it + a, in_ + b, iF + c);
            const w = wa * wb * wc;
            e += w * node[0]!;
            v += w * node[1]!;
          }
        }
      }
      out[0] = e;
      out[1] = v;
    },
  };
}
