import { realpathSync } from "node:fs";
import { fileURLToPath } from "node:url";

/**
 * True when the module at `moduleUrl` (its `import.meta.url`) is the script Node was started with,
 * directly or through a link such as npm's `bin` symlink.
 */
export function isMainModule(moduleUrl: string): boolean {
  const script = process.argv[1];
  if (script === undefined) return false;
  try {
    return realpathSync(script) === fileURLToPath(moduleUrl);
  } catch {
    return false;
  }
}
