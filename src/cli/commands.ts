import type { Command } from "commander";

/** Adds every sub-command to the program. Each command lives in its own file of this folder. */
export function registerCommands(_program: Command): void {}
