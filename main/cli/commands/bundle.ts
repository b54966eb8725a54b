import { stat } from 'node:fs/promises';
import { BundleError } from '../../../core/archive/bundle-format.ts';
import { readBundleFile } from '../../archive/bundle-file.ts';
import { type CliIo, type Command, EXIT_FAILED, EXIT_OK, UsageError } from '../command.ts';

const USAGE = `Usage: meridian-ledger bundle check FILE [--json]

Verifies an archive bundle: its format version, every table's row count and SHA-256, and that the
file is complete. Prints the row count per table (or JSON with --json). Exits 1 with a message
naming what is wrong and where on a damaged, truncated or foreign file.`;

async function check(args: readonly string[], io: CliIo): Promise<number> {
  const json = args.includes('--json');
  const files = args.filter((a) => a !== '--json');
  const unknown = files.find((a) => a.startsWith('-'));
  if (unknown !== undefined) throw new UsageError(`unknown option "${unknown}"`);
  if (files.length !== 1) throw new UsageError('bundle check takes exactly one FILE');
  const file = files[0];
  try {
    await stat(file);
  } catch {
    io.stderr.write(`meridian-ledger bundle check: ${file}: no such file\n`);
    return EXIT_FAILED;
  }
  try {
    const { header, manifest } = await readBundleFile(file);
    if (json) {
      const counts = Object.fromEntries(manifest.tables.map((t) => [t.name, t.rows]));
      io.stdout.write(`${JSON.stringify({ ok: true, file, formatVersion: header.formatVersion, schemaVersion: header.schemaVersion, createdUtc: header.createdUtc, producer: header.producer, tables: counts })}\n`);
    } else {
      io.stdout.write(`${file}: bundle format ${header.formatVersion}, schema ${header.schemaVersion}, written ${header.createdUtc} by ${header.producer}\n`);
      const width = Math.max(...manifest.tables.map((t) => t.name.length), 5);
      for (const table of manifest.tables) io.stdout.write(`  ${table.name.padEnd(width)}  ${String(table.rows).padStart(9)} rows  sha256 ${table.sha256.slice(0, 16)}… ok\n`);
    }
    return EXIT_OK;
  } catch (error) {
    if (!(error instanceof BundleError)) throw error;
    if (json) io.stdout.write(`${JSON.stringify({ ok: false, file, error: error.message })}\n`);
    io.stderr.write(`meridian-ledger bundle check: ${file}: ${error.message}\n`);
    return EXIT_FAILED;
  }
}

export const bundleCommand: Command = {
  name: 'bundle',
  summary: 'check an archive bundle (pack and unpack come with the archive folder format)',
  usage: USAGE,
  async run(args, io) {
    const [action, ...rest] = args;
    if (action === 'check') return check(rest, io);
    throw new UsageError(action === undefined ? 'bundle needs an action: check' : `unknown bundle action "${action}"`);
  },
};
