#!/usr/bin/env node
// Entry point of the `meridian-ledger` command. It runs the TypeScript sources directly through
// tsx, so the command works straight after `npm ci` with no build step.
import { register } from 'tsx/esm/api';

register();
// A reader that stops early (`| head`) closes the pipe; that is not an error of ours.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}
const { runCli } = await import('./cli.ts');
const code = await runCli(process.argv.slice(2), {
  stdin: process.stdin,
  stdout: process.stdout,
  stderr: process.stderr,
});
process.exitCode = code;
