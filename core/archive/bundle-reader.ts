import { BUNDLE_FORMAT, BUNDLE_FORMAT_VERSION, BundleError, type BundleHeader, type BundleManifest, TABLE_NAME_PATTERN } from './bundle-format.ts';
import { jsonLineToRow } from './bundle-values.ts';
import { Sha256 } from './sha256.ts';
import { encodeUtf8 } from '../text/utf8-encode.ts';

export type RowSink = (table: string, row: unknown) => void;

function parseJson(line: string, lineNumber: number, what: string): unknown {
  try {
    return jsonLineToRow(line);
  } catch (error) {
    throw new BundleError(`${what} is not valid JSON (${(error as Error).message})`, lineNumber);
  }
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * Reads a bundle line by line (lines without their "\n"), checking as it goes: the header first,
 * known structure, and at `finish()` the manifest's row counts and SHA-256 per table. Rows go to
 * `sink` as they are read; a caller that must not keep a damaged bundle's rows stages them and
 * commits only after `finish()` returns.
 */
export class BundleReader {
  private lineNumber = 0;
  private header: BundleHeader | null = null;
  private manifest: BundleManifest | null = null;
  private current: { name: string; rows: number; hash: Sha256 } | null = null;
  private readonly seen: { name: string; rows: number; sha256: string }[] = [];
  /** Line number of the manifest, which is also the bundle's line count. */
  private manifestLine = 0;

  constructor(private readonly sink: RowSink = () => undefined) {}

  line(text: string): void {
    this.lineNumber++;
    const n = this.lineNumber;
    if (this.manifest !== null) {
      if (text.trim() === '') return;
      throw new BundleError('text after the closing manifest', n);
    }
    if (this.header === null) {
      this.header = this.readHeader(text, n);
      return;
    }
    if (text.startsWith('{"$table":')) {
      const marker = parseJson(text, n, 'table marker');
      const name = isObject(marker) ? marker.$table : undefined;
      if (typeof name !== 'string' || !TABLE_NAME_PATTERN.test(name)) throw new BundleError('table marker without a valid table name', n);
      if (this.seen.some((t) => t.name === name) || this.current?.name === name) throw new BundleError(`table "${name}" appears twice`, n);
      this.closeTable();
      this.current = { name, rows: 0, hash: new Sha256() };
      return;
    }
    if (text.startsWith('{"$manifest":')) {
      this.closeTable();
      this.manifest = this.readManifest(text, n);
      return;
    }
    if (this.current === null) throw new BundleError('a row before any table marker', n);
    const row = parseJson(text, n, `row ${this.current.rows + 1} of table "${this.current.name}"`);
    this.current.hash.update(encodeUtf8(`${text}\n`));
    this.current.rows++;
    this.sink(this.current.name, row);
  }

  /** Verifies the manifest against what was read; throws a BundleError naming the first mismatch. */
  finish(): { header: BundleHeader; manifest: BundleManifest } {
    if (this.header === null) throw new BundleError('the bundle is empty', null);
    if (this.manifest === null) {
      throw new BundleError(`the bundle is truncated: no closing manifest after line ${this.lineNumber}`, null);
    }
    const manifest = this.manifest;
    if (manifest.lines !== this.manifestLine) {
      throw new BundleError(`the manifest counts ${manifest.lines} lines but the bundle has ${this.manifestLine}`, null);
    }
    if (manifest.tables.length !== this.seen.length) {
      throw new BundleError(`the manifest lists ${manifest.tables.length} tables but the bundle holds ${this.seen.length}`, null);
    }
    manifest.tables.forEach((expected, i) => {
      const actual = this.seen[i];
      if (actual.name !== expected.name) throw new BundleError(`table ${i + 1} is "${actual.name}" but the manifest says "${expected.name}"`, null);
      if (actual.rows !== expected.rows) throw new BundleError(`table "${actual.name}" holds ${actual.rows} rows but the manifest says ${expected.rows}`, null);
      if (actual.sha256 !== expected.sha256) throw new BundleError(`table "${actual.name}" is damaged: its SHA-256 does not match the manifest`, null);
    });
    return { header: this.header, manifest };
  }

  private readHeader(text: string, n: number): BundleHeader {
    let parsed: unknown;
    try {
      parsed = JSON.parse(text);
    } catch {
      throw new BundleError('this is not a Meridian Ledger bundle (the first line is not a JSON header)', n);
    }
    if (!isObject(parsed) || parsed.format !== BUNDLE_FORMAT) throw new BundleError('this is not a Meridian Ledger bundle (no "format" header)', n);
    const version = parsed.formatVersion;
    if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) throw new BundleError('the header has no valid formatVersion', n);
    if (version > BUNDLE_FORMAT_VERSION) {
      throw new BundleError(`the bundle has format version ${version}, newer than this program reads (${BUNDLE_FORMAT_VERSION}); update Meridian Ledger`, n);
    }
    if (typeof parsed.schemaVersion !== 'number' || typeof parsed.createdUtc !== 'string' || typeof parsed.producer !== 'string') {
      throw new BundleError('the header lacks schemaVersion, createdUtc or producer', n);
    }
    return parsed as unknown as BundleHeader;
  }

  private readManifest(text: string, n: number): BundleManifest {
    const parsed = parseJson(text, n, 'the manifest');
    const body = isObject(parsed) ? parsed.$manifest : undefined;
    if (!isObject(body) || !Array.isArray(body.tables) || typeof body.lines !== 'number') throw new BundleError('the manifest lacks tables or lines', n);
    for (const [i, table] of body.tables.entries()) {
      if (!isObject(table) || typeof table.name !== 'string' || typeof table.rows !== 'number' || typeof table.sha256 !== 'string') {
        throw new BundleError(`manifest entry ${i + 1} lacks name, rows or sha256`, n);
      }
    }
    this.manifestLine = n;
    return body as unknown as BundleManifest;
  }

  private closeTable(): void {
    if (this.current !== null) {
      this.seen.push({ name: this.current.name, rows: this.current.rows, sha256: this.current.hash.hex() });
      this.current = null;
    }
  }
}
