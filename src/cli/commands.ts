import type { Command } from "commander";
import { registerBand } from "./band.js";
import { registerClimate } from "./climate.js";
import { registerPrecharge } from "./precharge.js";
import { registerPdf } from "./pdf.js";
import { registerPlan } from "./plan.js";
import { registerInit } from "./init.js";

/** Adds every sub-command to the program. Each command lives in its own file of this folder. */
export function registerCommands(program: Command): void {
  registerClimate(program);
  registerPrecharge(program);
  registerPdf(program);
  registerPlan(program);
  registerBand(program);
  registerInit(program);
}
