import type { Command } from "commander";
import { registerBand } from "./band.js";
import { registerClimate } from "./climate.js";
import { registerEnergy } from "./energy.js";
import { registerInit } from "./init.js";
import { registerPdf } from "./pdf.js";
import { registerPlan } from "./plan.js";
import { registerPrecharge } from "./precharge.js";
import { registerScreen } from "./screen.js";
import { registerScreenMerge } from "./screenMerge.js";

/** Adds every sub-command to the program, in the order a new user meets them. */
export function registerCommands(program: Command): void {
  registerInit(program);
  registerPlan(program);
  registerScreen(program);
  registerScreenMerge(program);
  registerClimate(program);
  registerPrecharge(program);
  registerBand(program);
  registerEnergy(program);
  registerPdf(program);
}
