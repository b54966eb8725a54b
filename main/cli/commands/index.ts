import type { Command } from '../command.ts';

/** Every subcommand, in the order `--help` lists them. Later commands register here. */
export const COMMANDS: readonly Command[] = [];
