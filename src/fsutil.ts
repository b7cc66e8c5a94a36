import { randomBytes } from "node:crypto";
import { constants, type Stats } from "node:fs";
import { type FileHandle, mkdir, open, rename, rm, stat, writeFile } from "node:fs/promises";
import { dirname, join } from "node:path";
import { InputError, inputError } from "./errors.js";

/** Writes a file through a temporary sibling and a rename, so readers never see half a file. */
export async function writeFileAtomic(path: string, data: string | Uint8Array): Promise<void> {
  await mkdir(dirname(path), { recursive: true });
  const tmp = join(dirname(path), `.${randomBytes(6).toString("hex")}.tmp`);
  try {
    await writeFile(tmp, data);
    await rename(tmp, path);
  } catch (err) {
    await rm(tmp, { force: true });
    throw err;
  }
}

/** What a stat call tells of the kind of a file. */
export type FileKind = Pick<Stats, "isFIFO" | "isCharacterDevice" | "isBlockDevice" | "isSocket">;

/** "a named pipe (FIFO)", "a character device", … for a file that is not regular; null otherwise. */
export function specialFileKind(st: FileKind): string | null {
  if (st.isFIFO()) return "a named pipe (FIFO)";
  if (st.isCharacterDevice()) return "a character device";
  if (st.isBlockDevice()) return "a block device";
  if (st.isSocket()) return "a socket";
  return null;
}

/** Largest plan or schedule file read: real ones are a few kilobytes. */
export const MAX_TEXT_INPUT_BYTES = 16 * 1024 * 1024;

/** A byte count as the user reads it: "17825792 bytes (17.0 MiB)". */
function sizeText(bytes: number): string {
  return `${bytes} bytes (${(bytes / 1024 / 1024).toFixed(1)} MiB)`;
}

/** The reason a read failed, in words (the error code's meaning, else the system's message). */
export function readFailure(err: unknown): string {
  const e = err as NodeJS.ErrnoException;
  if (e.code === "ENOENT") return "no such file";
  if (e.code === "EISDIR") return "is a folder, not a file";
  if (e.code === "EACCES" || e.code === "EPERM") return "permission denied";
  return e.message ?? String(err);
}

/**
 * Reads a user's text input file of at most `maxBytes` bytes. A missing or unreadable file, a folder,
 * a named pipe or device (which could block or never end) and a file over the limit are input errors
 * naming the file and the reason; the file is never read beyond the limit.
 */
export async function readInputText(
  file: string,
  what: string,
  maxBytes = MAX_TEXT_INPUT_BYTES,
): Promise<string> {
  const refuse = (why: string) => inputError(file, undefined, undefined, `cannot read ${what}: ${why}`);
  const st = await stat(file).catch((err: unknown) => {
    throw refuse(readFailure(err));
  });
  if (st.isDirectory()) throw refuse("is a folder, not a file");
  const special = specialFileKind(st);
  if (special !== null) throw refuse(`is ${special}, not a regular file`);
  if (st.size > maxBytes)
    throw refuse(`it is ${sizeText(st.size)}; ${what} may hold at most ${sizeText(maxBytes)}`);
  // Opened without blocking and checked again: what was stat'ed may have been replaced since.
  let fh: FileHandle;
  try {
    fh = await open(file, constants.O_RDONLY | constants.O_NONBLOCK);
  } catch (err) {
    throw refuse(readFailure(err));
  }
  try {
    const again = await fh.stat();
    if (!again.isFile()) {
      const kind = specialFileKind(again);
      throw refuse(kind === null ? "not a regular file" : `is ${kind}, not a regular file`);
    }
    const chunks: Buffer[] = [];
    let length = 0;
    for (;;) {
      const chunk = Buffer.allocUnsafe(Math.max(64 * 1024, again.size + 1 - length));
      const { bytesRead } = await fh.read(chunk, 0, chunk.length, length);
      if (bytesRead === 0) break;
      chunks.push(chunk.subarray(0, bytesRead));
      length += bytesRead;
      if (length > maxBytes)
        throw refuse(`it holds more than ${sizeText(maxBytes)}, the most ${what} may hold`);
    }
    return Buffer.concat(chunks, length).toString("utf8");
  } catch (err) {
    if (err instanceof InputError) throw err;
    throw refuse(readFailure(err));
  } finally {
    await fh.close();
  }
}
