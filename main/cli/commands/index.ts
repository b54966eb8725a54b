import type { Command } from '../command.ts';
import { bundleCommand } from './bundle.ts';
import { nightCommand } from './night.ts';
import { predictCommand } from './predict.ts';
import { simulateCommand } from './simulate.ts';
import { solveCommand } from './solve.ts';

/** Every subcommand, in the order `--help` lists them. Later commands register here. */
export const COMMANDS: readonly Command[] = [bundleCommand, nightCommand, predictCommand, simulateCommand, solveCommand];
