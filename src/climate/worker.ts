/**
 * Worker-thread entry: reads one climate file per message and sends back its record columns
 * (the typed arrays are transferred, not copied).
 */
import { parentPort } from "node:worker_threads";
import { InputError } from "../errors.js";
import { columnBuffers, trimColumns } from "./records.js";
import { type ReadOptions, readClimateFile } from "./source.js";

parentPort?.on("message", async (msg: { id: number; path: string; options: ReadOptions }) => {
  try {
    const file = await readClimateFile(msg.path, msg.options);
    file.records = trimColumns(file.records); // hand over only the used part of the columns
    parentPort!.postMessage({ id: msg.id, file }, columnBuffers(file.records));
  } catch (err) {
    const e = err as Error;
    parentPort!.postMessage({ id: msg.id, error: { message: e.message, input: err instanceof InputError } });
  }
});
