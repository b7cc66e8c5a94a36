import { readFileSync } from "node:fs";

/** The tool's version, read once from package.json (two folders above both src/ and dist/). */
export const TOOL_VERSION: string = (
  JSON.parse(readFileSync(new URL("../package.json", import.meta.url), "utf8")) as { version: string }
).version;
