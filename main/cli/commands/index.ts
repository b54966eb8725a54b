import type { Command } from '../command.ts';
import { bundleCommand } from './bundle.ts';

/** Every subcommand, in the order `--help` lists them. Later commands register here. */
export const COMMANDS: readonly Command[] = [bundleCommand];
