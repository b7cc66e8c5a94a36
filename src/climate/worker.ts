/**
 * Worker-thread entry. Two kinds of work:
 * - a whole file: reads one climate file per message and sends back its record columns;
 * - a parse session: the main thread decompresses a large file and sends its chunks ("begin",
 *   "chunk"..., "end"); the lines are parsed here as they come, and the columns sent back at the end.
 * The typed arrays are transferred, not copied.
 */
import { parentPort } from "node:worker_threads";
import { InputError } from "../errors.js";
import { columnBuffers, emptyParsedFile, type ParsedFile, trimColumns } from "./records.js";
import {
  createLineReader,
  feedLines,
  finishLines,
  type LineReader,
  type ReadOptions,
  readClimateFile,
} from "./source.js";

type Message =
  | { kind?: undefined; id: number; path: string; options: ReadOptions }
  | {
      kind: "begin";
      id: number;
      path: string;
      format: ParsedFile["format"];
      options: ReadOptions;
      capacity: number;
    }
  | { kind: "chunk"; id: number; bytes: Uint8Array }
  | { kind: "end"; id: number };

/** Chunks parsed between two acknowledgements to the main thread (its flow control). */
const ACK_EVERY = 4;

const sessions = new Map<number, { reader: LineReader; unacked: number }>();

function sendError(id: number, err: unknown): void {
  const e = err as Error;
  parentPort!.postMessage({ id, error: { message: e.message, input: err instanceof InputError } });
}

function sendFile(id: number, file: ParsedFile): void {
  parentPort!.postMessage({ id, file }, columnBuffers(file.records));
}

parentPort?.on("message", async (msg: Message) => {
  try {
    if (msg.kind === undefined) {
      const file = await readClimateFile(msg.path, msg.options);
      file.records = trimColumns(file.records); // hand over only the used part of the columns
      sendFile(msg.id, file);
    } else if (msg.kind === "begin") {
      const file = emptyParsedFile(msg.path, msg.format, msg.capacity);
      sessions.set(msg.id, { reader: createLineReader(file, msg.format, msg.options), unacked: 0 });
    } else {
      const session = sessions.get(msg.id);
      if (session === undefined) return; // a session that failed already
      if (msg.kind === "chunk") {
        feedLines(session.reader, Buffer.from(msg.bytes.buffer, msg.bytes.byteOffset, msg.bytes.byteLength));
        if (++session.unacked === ACK_EVERY) {
          parentPort!.postMessage({ id: msg.id, acked: session.unacked });
          session.unacked = 0;
        }
      } else {
        sessions.delete(msg.id);
        finishLines(session.reader);
        sendFile(msg.id, session.reader.file);
      }
    }
  } catch (err) {
    sessions.delete(msg.id);
    sendError(msg.id, err);
  }
});
