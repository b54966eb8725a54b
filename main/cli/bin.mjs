#!/usr/bin/env node
// Entry point of the `meridian-ledger` command. It runs the TypeScript sources directly through
// tsx, so the command works straight after `npm ci` with no build step.
import { register } from 'tsx/esm/api';

register();
const { runCli } = await import('./cli.ts');
const code = await runCli(process.argv.slice(2), {
  stdin: process.stdin,
  stdout: process.stdout,
  stderr: process.stderr,
});
process.exitCode = code;
