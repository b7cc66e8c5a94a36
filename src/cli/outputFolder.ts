/**
 * The output folder `out/<name>/`, replaced as a whole: a reader, or a run killed at any instant,
 * always finds under `out/<name>` either the complete old results or the complete new ones.
 *
 * Node.js has no call that exchanges two folders, and a folder cannot be renamed over a folder that
 * holds files, so the visible name is a symbolic link:
 *
 *     out/<name>  →  .<name>.v-<host>-<pid>-<random>/   (the complete results of one run)
 *
 * A run writes every file into a new hidden version folder, makes a new link to it under a hidden
 * name, and renames that link over `out/<name>`: rename(2) replaces the old link in one step, so the
 * visible name is never missing and never points at a half-written folder. Only then is the version
 * the old link pointed at removed. Paths through the link (`out/<name>/report.html`) read as before.
 *
 * Hidden entries of this plan name left by runs that were killed are removed by the next run: those
 * whose process (the pid in the name, on this host) has ended, and any older than STALE_AFTER_MS;
 * never the one the link points at, nor those of a run still going on (concurrent runs on one output
 * root each install their own version; the last to rename its link wins).
 *
 * A real folder at `out/<name>` (written by an earlier version of the tool) is first moved aside to
 * `.<name>.p-…` and the link put in its place: the one step where a kill can leave the name missing.
 * The next run then finds the moved folder, complete, and links it back before anything else.
 */
import { createHash, randomBytes } from "node:crypto";
import { lstat, mkdir, readdir, readlink, rename, rm, symlink, writeFile } from "node:fs/promises";
import { hostname } from "node:os";
import { join } from "node:path";

/** Hidden entries of killed runs older than this are removed even when their pid is in use again. */
export const STALE_AFTER_MS = 24 * 3_600_000;
/** Leftovers of the earlier two-rename swap (`.<name>.tmp-…`, `.<name>.old-…`) older than this are removed. */
const LEGACY_STALE_AFTER_MS = 3_600_000;

/** This host, as 8 hex digits (a pid means something only on the host that gave it). */
const HOST = createHash("sha256").update(hostname()).digest("hex").slice(0, 8);

/** Steps a test may pause at (COLDSOAK_TEST_SWAP_PAUSE_MS), announced on stderr as `swap-step: <step>`. */
type Step = "writing" | "written" | "moved-aside" | "linked" | "swapped" | "cleaned";

/** Test hook: with COLDSOAK_TEST_SWAP_PAUSE_MS set, says each step on stderr and waits that long after it. */
async function step(name: Step): Promise<void> {
  const pause = Number(process.env.COLDSOAK_TEST_SWAP_PAUSE_MS ?? 0);
  if (!(pause > 0)) return;
  process.stderr.write(`swap-step: ${name}\n`);
  await new Promise((resolve) => setTimeout(resolve, pause));
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}

/**
 * Hidden entries of a plan name: `.<name>.v-…` (versions), `.<name>.l-…` (links not yet in place) and
 * `.<name>.p-…` (a real folder moved aside), each with the host, pid and a random part.
 */
function hiddenPattern(name: string): RegExp {
  return new RegExp(`^\\.${escapeRegExp(name)}\\.([vlp])-([0-9a-f]{8})-(\\d+)-[0-9a-f]+$`);
}

/** Makes a link to hidden entry `target` and renames it over the visible name, in one step. */
async function link(outRoot: string, target: string, linkName: string, visible: string): Promise<void> {
  await symlink(target, join(outRoot, linkName), "dir");
  await step("linked");
  await rename(join(outRoot, linkName), visible);
}

/**
 * When the visible name is missing, links back the folder a killed run had moved aside (the complete
 * results of an earlier version of the tool), the newest if several.
 */
async function recoverMovedAside(outRoot: string, name: string, visible: string): Promise<void> {
  if ((await lstat(visible).catch(() => null)) !== null) return;
  const pattern = hiddenPattern(name);
  const moved = (await readdir(outRoot)).filter((e) => pattern.exec(e)?.[1] === "p");
  let newest: string | null = null;
  let newestMs = -1;
  for (const e of moved) {
    const age = await ageMs(join(outRoot, e));
    if (newest === null || -age > newestMs) [newest, newestMs] = [e, -age];
  }
  if (newest !== null)
    await link(
      outRoot,
      newest,
      `.${name}.l-${HOST}-${process.pid}-${randomBytes(4).toString("hex")}`,
      visible,
    );
}

/** True while process `pid` runs on this machine. */
function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM"; // alive, owned by another user
  }
}

/** Age of an entry (from its own times, links not followed), or 0 when it is gone already. */
async function ageMs(path: string): Promise<number> {
  const st = await lstat(path).catch(() => null);
  return st === null ? 0 : Date.now() - st.mtimeMs;
}

/**
 * Removes the hidden entries of `name` left by earlier runs (see the module comment); `current` is
 * the version the visible link points at (kept).
 */
async function removeStale(outRoot: string, name: string, current: string | null): Promise<void> {
  const pattern = hiddenPattern(name);
  const legacy = new RegExp(`^\\.${escapeRegExp(name)}\\.(tmp|old)-[0-9a-f]+$`);
  for (const entry of await readdir(outRoot)) {
    if (entry === current) continue;
    const path = join(outRoot, entry);
    const m = pattern.exec(entry);
    let stale = false;
    if (m !== null) {
      const ended = m[2] === HOST && !processAlive(Number(m[3]));
      stale = ended || (await ageMs(path)) > STALE_AFTER_MS;
    } else if (legacy.test(entry)) stale = current !== null && (await ageMs(path)) > LEGACY_STALE_AFTER_MS;
    if (stale) await rm(path, { recursive: true, force: true });
  }
}

/** The hidden entry the visible link points at, or null (no link, or a real folder). */
async function linkTarget(visible: string): Promise<string | null> {
  try {
    return await readlink(visible);
  } catch {
    return null;
  }
}

export interface OutputFolderOptions {
  /** Called with the finished version folder before it is made visible (to add files made from the others). */
  beforeSwap?: (folder: string) => Promise<void>;
}

/**
 * Writes `files` (name → text) as the new `outRoot/name/` and makes it visible in one step (see the
 * module comment). Returns the visible path. On failure the old results stay and nothing new remains.
 */
export async function writeOutputFolder(
  outRoot: string,
  name: string,
  files: Map<string, string>,
  options: OutputFolderOptions = {},
): Promise<string> {
  await mkdir(outRoot, { recursive: true });
  const visible = join(outRoot, name);
  await recoverMovedAside(outRoot, name, visible);
  await removeStale(outRoot, name, await linkTarget(visible));
  const tag = `${HOST}-${process.pid}-${randomBytes(4).toString("hex")}`;
  const version = `.${name}.v-${tag}`;
  try {
    await mkdir(join(outRoot, version));
    await step("writing");
    for (const [f, text] of files) await writeFile(join(outRoot, version, f), text);
    await options.beforeSwap?.(join(outRoot, version));
    await step("written");
  } catch (err) {
    await rm(join(outRoot, version), { recursive: true, force: true });
    throw err;
  }
  const old = await linkTarget(visible);
  const movedAside = `.${name}.p-${tag}`;
  const wasFolder = (await lstat(visible).catch(() => null))?.isDirectory() ?? false;
  if (wasFolder) {
    await rename(visible, join(outRoot, movedAside));
    await step("moved-aside");
  }
  await link(outRoot, version, `.${name}.l-${tag}`, visible);
  await step("swapped");
  const replaced = wasFolder ? movedAside : old;
  if (replaced !== null && hiddenPattern(name).test(replaced) && (await linkTarget(visible)) !== replaced)
    await rm(join(outRoot, replaced), { recursive: true, force: true });
  await step("cleaned");
  return visible;
}
