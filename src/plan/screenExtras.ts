/**
 * The screen's figures from beside the planning engine, per station (`ScreenExtras` of `screen.ts`):
 * the climate design temperatures of the station's series (`climate/designTemps.ts`, on the plan's
 * years and share of hours, with the hours below the profile's break-even temperatures) and the
 * profile's equilibrium break-even temperatures at the station's atmosphere (`breakEven.ts`, on the
 * real-gas model over the energy range of the plan's units).
 */
import { designTemperatures } from "../climate/index.js";
import { realGas } from "../physics/nitrogen.js";
import { defaultEnergyRangeK, equilibriumBreakEven } from "./breakEven.js";
import type { PlanFile } from "./planFile.js";
import type { BreakEvenRow, ScreenExtras } from "./screen.js";

/** The break-even temperatures the margins and the hours below are taken at: nominal precharge and system pressure. */
export function nominalBreakEven(rows: BreakEvenRow[]): BreakEvenRow[] {
  return rows
    .filter((r) => r.precharge === "nominal" && r.system === "nominal")
    .sort((a, b) => a.units - b.units);
}

/** The extras of a screen of `plan` against its profile named `profile`. */
export function screenExtras(plan: PlanFile, profile: string): ScreenExtras {
  const p = plan.profiles.find((x) => x.name === profile)!;
  const range = defaultEnergyRangeK(plan.units);
  return {
    breakEvenRows: (atmPa) => equilibriumBreakEven(p, atmPa, realGas, range),
    design: (series, timeZone, rows) =>
      designTemperatures(series, timeZone, {
        years: plan.climate.years ?? null,
        minYearShare: plan.climate.minYearShare,
        coldThresholdsC: nominalBreakEven(rows).flatMap((r) => (r.ambientC === null ? [] : [r.ambientC])),
      }),
  };
}
