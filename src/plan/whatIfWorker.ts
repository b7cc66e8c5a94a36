/**
 * Worker-thread entry of the what-if runs (`whatIfRun.ts`): first an "init" message with the plan's
 * data, the stays and each base's climate, then one task per message, answered with its tallies.
 */
import { parentPort } from "node:worker_threads";
import type { BaseClimate } from "./samples.js";
import type { Stay } from "./schedule.js";
import { runTask, type WhatIfInputs, type WhatIfTask } from "./whatIf.js";
import { type PlanData, planFromData } from "./whatIfRun.js";

type Message =
  | { init: { plan: PlanData; stays: Stay[]; climates: BaseClimate[] } }
  | { id: number; task: WhatIfTask };

let inputs: WhatIfInputs | null = null;

parentPort?.on("message", (msg: Message) => {
  if ("init" in msg) {
    inputs = { plan: planFromData(msg.init.plan), stays: msg.init.stays, climates: msg.init.climates };
    return;
  }
  try {
    parentPort!.postMessage({ id: msg.id, tallies: runTask(inputs!, msg.task) });
  } catch (err) {
    parentPort!.postMessage({ id: msg.id, error: err instanceof Error ? err.message : String(err) });
  }
});
