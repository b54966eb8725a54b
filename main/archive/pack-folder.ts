/**
 * Archive folder ⇄ bundle (Node). `packFolder` reads a folder in the documented file formats
 * (core/archive-folder/FOLDER.md) and writes a bundle the app can restore; `unpackBundle` writes
 * the folder back. Folder → bundle → folder reproduces every file byte for byte, because the
 * folder writer is deterministic and the bundle keeps every value bit-exactly.
 */
import type { ArchiveContent } from '../../core/archive-folder/archive-folder.ts';
import { readArchiveFolder, writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import type { FolderRejection } from '../../core/archive-folder/folder-text.ts';
import { BundleError, SIMULATION_TRUTH_TABLE } from '../../core/archive/bundle-format.ts';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { readArchiveFolderFiles, writeArchiveFolderFiles } from './archive-folder-files.ts';
import { readBundleFile, writeBundleFile } from './bundle-file.ts';

/** Schema version of the store whose tables the bundle carries (renderer/store/schemaV1.ts). */
export const BUNDLE_SCHEMA_VERSION = 1;
/** Table holding a simulated archive's known truth (one row), so unpack can write truth.json again. */
export const TRUTH_TABLE = SIMULATION_TRUTH_TABLE;

const TABLE_ORDER = ['sites', 'instruments', 'instrumentEvents', 'stars', 'nights', 'transits'] as const;

export class FolderRejectedError extends Error {
  override readonly name = 'FolderRejectedError';
  constructor(readonly rejected: readonly FolderRejection[]) {
    super(`the archive folder has ${rejected.length} refused row(s); nothing was written`);
  }
}

function tableRows(content: ArchiveContent): Record<(typeof TABLE_ORDER)[number], readonly unknown[]> {
  return {
    sites: [content.site],
    instruments: content.instruments,
    instrumentEvents: content.events,
    stars: content.stars,
    nights: content.nights,
    transits: content.transits,
  };
}

export async function packFolder(dir: string, outFile: string, producer: string, nowUtc: string): Promise<Record<string, number>> {
  const read = readArchiveFolder(await readArchiveFolderFiles(dir), nowUtc);
  if (read.content === null || read.rejected.length > 0) throw new FolderRejectedError(read.rejected);
  const writer = new BundleWriter({ schemaVersion: BUNDLE_SCHEMA_VERSION, createdUtc: nowUtc, producer });
  const counts: Record<string, number> = {};
  const tables = tableRows(read.content);
  const truth = read.truth;
  function* lines(): Generator<string> {
    yield writer.start();
    for (const name of TABLE_ORDER) {
      yield writer.beginTable(name);
      for (const row of tables[name]) yield writer.row(row);
      counts[name] = tables[name].length;
    }
    if (truth !== null && truth !== undefined) {
      yield writer.beginTable(TRUTH_TABLE);
      yield writer.row({ truth });
      counts[TRUTH_TABLE] = 1;
    }
    yield writer.finish();
  }
  await writeBundleFile(outFile, lines());
  return counts;
}

export async function unpackBundle(bundleFile: string, outDir: string, replace: boolean): Promise<Record<string, number>> {
  const rows = new Map<string, unknown[]>();
  const { manifest } = await readBundleFile(bundleFile, (table, row) => {
    let list = rows.get(table);
    if (list === undefined) rows.set(table, (list = []));
    list.push(row);
  });
  const sites = rows.get('sites') ?? [];
  if (sites.length !== 1) {
    throw new BundleError(`an archive folder holds exactly one site; this bundle holds ${sites.length} (restore it in the app instead)`, null);
  }
  const known = new Set<string>([...TABLE_ORDER, TRUTH_TABLE]);
  const foreign = manifest.tables.map((t) => t.name).filter((name) => !known.has(name));
  if (foreign.length > 0) throw new BundleError(`tables ${foreign.join(', ')} have no place in an archive folder (restore the bundle in the app instead)`, null);
  const content = {
    site: sites[0],
    instruments: rows.get('instruments') ?? [],
    events: rows.get('instrumentEvents') ?? [],
    stars: rows.get('stars') ?? [],
    nights: rows.get('nights') ?? [],
    transits: rows.get('transits') ?? [],
  } as unknown as ArchiveContent;
  const truthRow = rows.get(TRUTH_TABLE)?.[0] as { truth?: unknown } | undefined;
  await writeArchiveFolderFiles(outDir, writeArchiveFolder(content, truthRow?.truth), replace);
  return Object.fromEntries(manifest.tables.map((t) => [t.name, t.rows]));
}
