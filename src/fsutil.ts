import { randomBytes } from "node:crypto";
import { mkdir, readFile, rename, rm, writeFile } from "node:fs/promises";
import { dirname, join } from "node:path";
import { inputError } from "./errors.js";

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

/** Reads a user's text input file; a missing or unreadable file is an input error naming it. */
export async function readInputText(file: string, what: string): Promise<string> {
  try {
    return await readFile(file, "utf8");
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why =
      code === "ENOENT" ? "no such file" : code === "EISDIR" ? "is a folder, not a file" : (code ?? "error");
    throw inputError(file, undefined, undefined, `cannot read ${what}: ${why}`);
  }
}
