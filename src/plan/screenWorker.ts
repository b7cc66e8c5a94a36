/**
 * Worker-thread entry of the screen (`screenPool.ts`): takes the job once ("job"), then one unit of
 * files at a time ("unit"), and sends back the unit's screened stations or its error.
 */
import { parentPort } from "node:worker_threads";
import { InputError } from "../errors.js";
import { type ScreenContext, type ScreenJob, screenContext, screenFiles } from "./screenUnit.js";

type Message = { kind: "job"; job: ScreenJob } | { kind: "unit"; id: number; files: string[] };

let ctx: ScreenContext | null = null;

parentPort?.on("message", async (msg: Message) => {
  if (msg.kind === "job") {
    ctx = screenContext(msg.job);
    return;
  }
  try {
    const result = await screenFiles(ctx!, msg.files);
    parentPort!.postMessage({ id: msg.id, result });
  } catch (err) {
    const e = err as Error;
    parentPort!.postMessage({ id: msg.id, error: { message: e.message, input: err instanceof InputError } });
  }
});
