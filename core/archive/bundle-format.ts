/**
 * The archive bundle, version 1: the whole archive as JSON lines, compressed with gzip by the
 * platform that writes it (main: zlib; renderer: CompressionStream). Layout, one JSON value a line:
 *
 *   line 1            header  {"format":"meridian-ledger-bundle","formatVersion":1,"schemaVersion":…,
 *                              "createdUtc":…,"producer":…}
 *   per table         {"$table":"<name>"} then one line per row (bundle-values.ts encoding)
 *   last line         manifest {"$manifest":{"tables":[{"name","rows","sha256"}…],"lines":N}}
 *
 * Each table's checksum is SHA-256 of the UTF-8 bytes of its row lines, each followed by "\n".
 * The manifest comes last so a bundle can be written as a stream; a truncated bundle lacks it and
 * is refused. Readers refuse a newer formatVersion with a message naming both versions.
 */
export const BUNDLE_FORMAT = 'meridian-ledger-bundle';

/**
 * A table a bundle may carry that is not part of the archive: a simulated archive's known truth
 * (one row), which `bundle pack` keeps so that `bundle unpack` writes truth.json again. The app
 * checks it with the rest and does not restore it (it keeps no truth).
 */
export const SIMULATION_TRUTH_TABLE = 'simulationTruth';
export const BUNDLE_FORMAT_VERSION = 1;

export interface BundleHeader {
  readonly format: typeof BUNDLE_FORMAT;
  readonly formatVersion: number;
  /** Version of the archive schema the rows follow (the store's Dexie version). */
  readonly schemaVersion: number;
  /** ISO 8601 UTC time the bundle was written. */
  readonly createdUtc: string;
  /** What wrote it, e.g. "meridian-ledger 0.1.0 (cli)". */
  readonly producer: string;
}

export interface BundleTableSummary {
  readonly name: string;
  readonly rows: number;
  readonly sha256: string;
}

export interface BundleManifest {
  readonly tables: readonly BundleTableSummary[];
  /** Lines in the whole bundle including header and manifest. */
  readonly lines: number;
}

/** A problem with a bundle, naming the line (1-based) where it was found. */
export class BundleError extends Error {
  override readonly name = 'BundleError';
  constructor(
    message: string,
    readonly line: number | null,
  ) {
    super(line === null ? message : `line ${line}: ${message}`);
  }
}

/** Table names a bundle may hold: letters, digits and dashes, starting with a letter. */
export const TABLE_NAME_PATTERN = /^[A-Za-z][A-Za-z0-9-]{0,63}$/;
