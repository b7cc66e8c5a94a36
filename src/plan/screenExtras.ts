/**
 * The screen's figures from beside the planning engine, per station: design temperatures of the
 * station's series and the profile's equilibrium break-even temperatures at the station's atmosphere
 * (`ScreenExtras` of `screen.ts`). This version of the tool computes neither: every station says so in
 * `designReason`, and its `breakEven` list is empty.
 */
import type { PlanFile } from "./planFile.js";
import type { ScreenExtras } from "./screen.js";

/** The reason given where design temperatures are not computed. */
export const DESIGN_NOT_COMPUTED = "design temperatures are not computed by this version of the tool";

/** The extras of a screen of `plan` against profile `profile`. */
export function screenExtras(_plan: PlanFile, _profile: string): ScreenExtras {
  return {
    design: () => ({ value: null, reason: DESIGN_NOT_COMPUTED }),
    breakEvenRows: () => null,
  };
}
