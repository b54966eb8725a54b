import type { InstrumentEventRecord, InstrumentRecord, NightRecord, SiteRecord, StarRecord, TransitRecord } from '../archive/records.ts';
import { encodeUtf8 } from '../text/utf8-encode.ts';
import { decodeUtf8 } from '../formats/utf8.ts';
import type { FolderRejection } from './folder-text.ts';
import { readNightFiles, writeNightFiles } from './night-files.ts';
import { readSiteFile, writeSiteFile } from './site-file.ts';
import { readStarFile, writeStarFile } from './star-file.ts';
import { readTransitFile, writeTransitFiles } from './transit-files.ts';

/** The identity file of an archive folder (FOLDER.md). */
export const FOLDER_MANIFEST = 'archive.json';
export const FOLDER_FORMAT = 'meridian-ledger-archive-folder';
export const FOLDER_FORMAT_VERSION = 1;
export const FILES = {
  site: 'site.json', stars: 'stars.csv', nights: 'nights.csv', clock: 'clock-comparisons.csv',
  level: 'level-readings.csv', collimation: 'collimation-readings.csv', truth: 'truth.json',
} as const;
/** Transit logs: `transits/YYYY.csv`. */
export const TRANSIT_FILE_PATTERN = /^transits\/\d{4}\.csv$/;

/** Everything an archive folder holds: one site, its instruments and events, stars, nights, transits. */
export interface ArchiveContent {
  readonly site: SiteRecord;
  readonly instruments: readonly InstrumentRecord[];
  readonly events: readonly InstrumentEventRecord[];
  readonly stars: readonly StarRecord[];
  readonly nights: readonly NightRecord[];
  readonly transits: readonly TransitRecord[];
}

/**
 * Records → the folder's files (relative path → UTF-8 text), in the layout of FOLDER.md. `truth`
 * (a simulation's known truth, any JSON value) is written as truth.json when given. Throws a
 * RangeError naming the record when something cannot be written in the file formats.
 */
export function writeArchiveFolder(content: ArchiveContent, truth?: unknown): Map<string, string> {
  const files = new Map<string, string>();
  files.set(FOLDER_MANIFEST, `${JSON.stringify({ format: FOLDER_FORMAT, formatVersion: FOLDER_FORMAT_VERSION })}\n`);
  files.set(FILES.site, writeSiteFile(content.site, content.instruments, content.events));
  files.set(FILES.stars, writeStarFile(content.stars));
  const nightFiles = writeNightFiles(content.nights);
  files.set(FILES.nights, nightFiles.nights);
  files.set(FILES.clock, nightFiles.clock);
  files.set(FILES.level, nightFiles.level);
  files.set(FILES.collimation, nightFiles.collimation);
  for (const [path, text] of writeTransitFiles(content.transits, content.nights, content.instruments)) files.set(path, text);
  if (truth !== undefined) files.set(FILES.truth, `${JSON.stringify(truth, null, 1)}\n`);
  return files;
}

/** The files as bytes, for a host that writes them (e.g. with `writeFile`). */
export function encodeFolderFiles(files: ReadonlyMap<string, string>): Map<string, Uint8Array> {
  return new Map([...files].map(([path, text]) => [path, encodeUtf8(text)]));
}

export interface FolderReadResult {
  /** The records; null when the folder lacks its identity or site file (see `rejected`). */
  readonly content: ArchiveContent | null;
  readonly truth: unknown;
  /** Every refused row: file, row, line, column, reason. A folder is taken whole only when this is empty. */
  readonly rejected: readonly FolderRejection[];
  readonly warnings: readonly string[];
}

/**
 * Folder files (relative path with `/` → bytes) → records, through H4's parsers for the site
 * description, star list and transit logs and ours for the night tables. `createdUtc` stamps the
 * records. Unknown files are named in a warning. Pure: the host lists and reads the files.
 */
export function readArchiveFolder(files: ReadonlyMap<string, Uint8Array>, createdUtc: string): FolderReadResult {
  const rejected: FolderRejection[] = [];
  const warnings: string[] = [];
  const need = (path: string): Uint8Array | null => {
    const bytes = files.get(path);
    if (bytes === undefined) rejected.push({ file: path, row: 0, line: 0, column: '', reason: `${path} is missing; an archive folder needs it (FOLDER.md)` });
    return bytes ?? null;
  };
  const manifest = need(FOLDER_MANIFEST);
  if (manifest !== null) checkManifest(manifest, rejected);
  const siteBytes = need(FILES.site), starBytes = need(FILES.stars), nightBytes = need(FILES.nights);
  if (rejected.length > 0 || siteBytes === null || starBytes === null || nightBytes === null) return { content: null, truth: null, rejected, warnings };
  const audit = { createdUtc };
  const siteFile = readSiteFile(siteBytes, FILES.site, audit);
  const starFile = readStarFile(starBytes, FILES.stars, audit);
  const nightFiles = readNightFiles({ nights: nightBytes, clock: files.get(FILES.clock), level: files.get(FILES.level), collimation: files.get(FILES.collimation) }, FILES, audit);
  rejected.push(...siteFile.rejected, ...starFile.rejected, ...nightFiles.rejected);
  warnings.push(...siteFile.warnings, ...starFile.warnings, ...nightFiles.warnings);
  if (siteFile.site === null) return { content: null, truth: null, rejected, warnings };
  const transits: TransitRecord[] = [];
  const context = { nights: nightFiles.nights, instruments: siteFile.instruments, stars: starFile.stars, createdUtc };
  for (const path of [...files.keys()].filter((p) => TRANSIT_FILE_PATTERN.test(p)).sort()) {
    const read = readTransitFile(files.get(path)!, path, context);
    transits.push(...read.transits);
    rejected.push(...read.rejected);
    warnings.push(...read.warnings);
  }
  const known = new Set<string>([FOLDER_MANIFEST, ...Object.values(FILES)]);
  const unknown = [...files.keys()].filter((p) => !known.has(p) && !TRANSIT_FILE_PATTERN.test(p));
  if (unknown.length > 0) warnings.push(`files not part of an archive folder, ignored: ${unknown.sort().join(', ')}`);
  const truthBytes = files.get(FILES.truth);
  let truth: unknown = null;
  if (truthBytes !== undefined) {
    const decoded = decodeUtf8(truthBytes);
    try {
      truth = decoded.ok ? JSON.parse(decoded.text) : null;
    } catch (error) {
      rejected.push({ file: FILES.truth, row: 1, line: 0, column: '', reason: `not valid JSON: ${(error as Error).message}` });
    }
  }
  const content: ArchiveContent = { site: siteFile.site, instruments: siteFile.instruments, events: siteFile.events, stars: starFile.stars, nights: nightFiles.nights, transits };
  return { content, truth, rejected, warnings };
}

function checkManifest(bytes: Uint8Array, rejected: FolderRejection[]): void {
  const decoded = decodeUtf8(bytes);
  let value: unknown = null;
  try {
    value = decoded.ok ? JSON.parse(decoded.text) : null;
  } catch {
    value = null;
  }
  const m = value as { format?: unknown; formatVersion?: unknown } | null;
  if (m === null || typeof m !== 'object' || m.format !== FOLDER_FORMAT) {
    rejected.push({ file: FOLDER_MANIFEST, row: 1, line: 0, column: '/format', reason: `not an archive folder identity file: expected {"format":"${FOLDER_FORMAT}",…}` });
  } else if (m.formatVersion !== FOLDER_FORMAT_VERSION) {
    rejected.push({ file: FOLDER_MANIFEST, row: 1, line: 0, column: '/formatVersion', reason: `folder format version ${String(m.formatVersion)}; this version of Meridian Ledger reads version ${FOLDER_FORMAT_VERSION}: update it` });
  }
}
