import type { Readable, Writable } from 'node:stream';

/** The streams a command reads and writes; tests pass their own. */
export interface CliIo {
  readonly stdin: Readable;
  readonly stdout: Writable;
  readonly stderr: Writable;
}

/** One subcommand of `meridian-ledger`. `run` returns the process exit status. */
export interface Command {
  readonly name: string;
  /** One line for the command list in `--help`. */
  readonly summary: string;
  /** Full usage text printed by `meridian-ledger help NAME` and on a usage error. */
  readonly usage: string;
  run(args: readonly string[], io: CliIo): Promise<number>;
}

/** A mistake in the command line itself; the message names the argument and the fix. */
export class UsageError extends Error {
  override readonly name = 'UsageError';
}

/** Exit statuses shared by every command. */
export const EXIT_OK = 0;
export const EXIT_FAILED = 1;
export const EXIT_USAGE = 2;
