import { type CliIo, EXIT_FAILED, EXIT_OK, EXIT_USAGE, UsageError } from './command.ts';
import { COMMANDS } from './commands/index.ts';
import { packageVersion } from './package-version.ts';


function helpText(): string {
  const width = Math.max(8, ...COMMANDS.map((c) => c.name.length));
  const lines = COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`);
  return [
    'meridian-ledger — reduce and archive star transits from a fixed telescope',
    '',
    'Usage: meridian-ledger <command> [options]',
    '       meridian-ledger help <command>',
    '       meridian-ledger --help | --version',
    '',
    'Commands:',
    ...(lines.length > 0 ? lines : ['  (none yet)']),
    '',
  ].join('\n');
}

/** Runs one command line and returns the exit status; never throws. */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined || first === '--help' || first === '-h') {
    io.stdout.write(helpText());
    return first === undefined ? EXIT_USAGE : EXIT_OK;
  }
  if (first === '--version' || first === '-V') {
    io.stdout.write(`${packageVersion()}\n`);
    return EXIT_OK;
  }
  if (first === 'help') {
    const target = COMMANDS.find((c) => c.name === rest[0]);
    if (rest.length === 0) {
      io.stdout.write(helpText());
      return EXIT_OK;
    }
    if (target === undefined) {
      io.stderr.write(`meridian-ledger: no command named "${rest[0]}"; run meridian-ledger --help for the list\n`);
      return EXIT_USAGE;
    }
    io.stdout.write(`${target.usage}\n`);
    return EXIT_OK;
  }
  if (first.startsWith('-')) {
    io.stderr.write(`meridian-ledger: unknown option "${first}"; run meridian-ledger --help\n`);
    return EXIT_USAGE;
  }
  const command = COMMANDS.find((c) => c.name === first);
  if (command === undefined) {
    io.stderr.write(`meridian-ledger: unknown command "${first}"; run meridian-ledger --help for the list\n`);
    return EXIT_USAGE;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout.write(`${command.usage}\n`);
    return EXIT_OK;
  }
  try {
    return await command.run(rest, io);
  } catch (error) {
    if (error instanceof UsageError) {
      io.stderr.write(`meridian-ledger ${command.name}: ${error.message}\n\n${command.usage}\n`);
      return EXIT_USAGE;
    }
    const message = error instanceof Error ? error.message : String(error);
    io.stderr.write(`meridian-ledger ${command.name}: ${message}\n`);
    return EXIT_FAILED;
  }
}
