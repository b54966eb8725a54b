import { stat } from 'node:fs/promises';
import path from 'node:path';
import { BundleError } from '../../../core/archive/bundle-format.ts';
import { readBundleFile } from '../../archive/bundle-file.ts';
import { FolderRejectedError, packFolder, unpackBundle } from '../../archive/pack-folder.ts';
import { packageVersion } from '../package-version.ts';
import { type CliIo, type Command, EXIT_FAILED, EXIT_OK, UsageError } from '../command.ts';

const USAGE = `Usage: meridian-ledger bundle pack DIR --out FILE
       meridian-ledger bundle unpack FILE --out DIR [--force]
       meridian-ledger bundle check FILE [--json]

pack    reads an archive folder in the documented file formats (as simulate writes it) and writes
        one bundle (.mlbundle: gzip-compressed JSON lines with a SHA-256 per table) that the app
        can restore. A folder with any refused row is not packed: every row is listed on stderr.
unpack  writes the archive folder back from a bundle, byte for byte as it was packed. DIR must be
        empty or absent unless --force is given.
check   verifies a bundle: its format version, every table's row count and SHA-256, and that the
        file is complete; prints the rows per table (JSON with --json). Exits 1 with a message
        naming what is wrong and where on a damaged, truncated or foreign file.`;

function parseOut(args: readonly string[], flags: readonly string[]): { positional: string[]; out: string; flags: Set<string> } {
  const positional: string[] = [];
  const seen = new Set<string>();
  let out: string | undefined;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--out') {
      out = args[++i];
      if (out === undefined || out.startsWith('-')) throw new UsageError('--out needs a path');
    } else if (flags.includes(arg)) {
      seen.add(arg);
    } else if (arg.startsWith('-')) {
      throw new UsageError(`unknown option "${arg}"`);
    } else {
      positional.push(arg);
    }
  }
  if (out === undefined) throw new UsageError('--out is required');
  return { positional, out, flags: seen };
}

function printCounts(io: CliIo, verb: string, counts: Record<string, number>): void {
  io.stderr.write(`${verb}: ${Object.entries(counts).map(([table, n]) => `${table} ${n}`).join(', ')}\n`);
}

async function pack(args: readonly string[], io: CliIo): Promise<number> {
  const { positional, out } = parseOut(args, []);
  if (positional.length !== 1) throw new UsageError('bundle pack takes exactly one DIR');
  const dir = positional[0];
  if (!(await isDirectory(dir))) {
    io.stderr.write(`meridian-ledger bundle pack: ${dir}: not a folder\n`);
    return EXIT_FAILED;
  }
  io.stderr.write(`reading ${dir} …\n`);
  try {
    const counts = await packFolder(dir, out, `meridian-ledger ${packageVersion()} (cli)`, new Date().toISOString());
    printCounts(io, `wrote ${out}`, counts);
    return EXIT_OK;
  } catch (error) {
    if (!(error instanceof FolderRejectedError)) throw error;
    for (const r of error.rejected) io.stderr.write(`${path.join(dir, r.file)}: row ${r.row} (line ${r.line})${r.column ? `, column ${r.column}` : ''}: ${r.reason}\n`);
    io.stderr.write(`meridian-ledger bundle pack: ${error.message}\n`);
    return EXIT_FAILED;
  }
}

async function unpack(args: readonly string[], io: CliIo): Promise<number> {
  const { positional, out, flags } = parseOut(args, ['--force']);
  if (positional.length !== 1) throw new UsageError('bundle unpack takes exactly one FILE');
  const file = positional[0];
  try {
    await stat(file);
  } catch {
    io.stderr.write(`meridian-ledger bundle unpack: ${file}: no such file\n`);
    return EXIT_FAILED;
  }
  try {
    const counts = await unpackBundle(file, out, flags.has('--force'));
    printCounts(io, `wrote ${out}`, counts);
    return EXIT_OK;
  } catch (error) {
    if (!(error instanceof BundleError) && !(error instanceof RangeError) && !/not empty/.test(String(error))) throw error;
    io.stderr.write(`meridian-ledger bundle unpack: ${file}: ${(error as Error).message}\n`);
    return EXIT_FAILED;
  }
}

async function isDirectory(dir: string): Promise<boolean> {
  try {
    return (await stat(dir)).isDirectory();
  } catch {
    return false;
  }
}

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
  summary: 'pack an archive folder into a bundle, unpack it again, or check a bundle',
  usage: USAGE,
  async run(args, io) {
    const [action, ...rest] = args;
    if (action === 'check') return check(rest, io);
    if (action === 'pack') return pack(rest, io);
    if (action === 'unpack') return unpack(rest, io);
    throw new UsageError(action === undefined ? 'bundle needs an action: pack, unpack or check' : `unknown bundle action "${action}"`);
  },
};
