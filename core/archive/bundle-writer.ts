import { BUNDLE_FORMAT, BUNDLE_FORMAT_VERSION, BundleError, type BundleHeader, type BundleTableSummary, TABLE_NAME_PATTERN } from './bundle-format.ts';
import { rowToJsonLine } from './bundle-values.ts';
import { Sha256 } from './sha256.ts';
import { encodeUtf8, encodeUtf8Into } from '../text/utf8-encode.ts';

/** Where rowInto writes: room for at least `maxBytes` at `offset` of `bytes`, then how many were used. */
export interface ByteSink {
  reserve(maxBytes: number): { readonly bytes: Uint8Array; readonly offset: number };
  commit(length: number): void;
}

/**
 * Writes a bundle as a sequence of lines (each returned string ends with "\n"); the caller
 * compresses and stores them. Tables are written one after another, each once.
 */
export class BundleWriter {
  private readonly summaries: BundleTableSummary[] = [];
  private current: { name: string; rows: number; hash: Sha256 } | null = null;
  private lines = 0;
  private closed = false;

  constructor(private readonly header: Omit<BundleHeader, 'format' | 'formatVersion'>) {}

  start(): string {
    if (this.lines !== 0) throw new BundleError('BundleWriter.start: already started', null);
    return this.emit(JSON.stringify({ format: BUNDLE_FORMAT, formatVersion: BUNDLE_FORMAT_VERSION, ...this.header }));
  }

  beginTable(name: string): string {
    this.requireOpen();
    if (!TABLE_NAME_PATTERN.test(name)) throw new BundleError(`table name "${name}" is not allowed (letters, digits, dashes)`, null);
    if (this.summaries.some((s) => s.name === name) || this.current?.name === name) {
      throw new BundleError(`table "${name}" was already written`, null);
    }
    this.endTable();
    this.current = { name, rows: 0, hash: new Sha256() };
    return this.emit(JSON.stringify({ $table: name }));
  }

  row(row: unknown): string {
    const line = this.emit(this.rowLine(row));
    this.current?.hash.update(encodeUtf8(line));
    return line;
  }

  /**
   * The same line as `row`, as its UTF-8 bytes (which are also what the checksum reads): a caller
   * that collects bytes never needs the whole bundle as one string (at a million rows it would
   * pass the longest string a JavaScript engine holds, about 2^29 characters in V8).
   */
  rowBytes(row: unknown): Uint8Array {
    const bytes = encodeUtf8(this.emit(this.rowLine(row)));
    this.current?.hash.update(bytes);
    return bytes;
  }

  /**
   * The bytes of `rowBytes`, encoded straight into the caller's buffer (no array per row: at a
   * million rows the allocation and copy cost as much as the JSON).
   */
  rowInto(row: unknown, sink: ByteSink): void {
    const line = this.emit(this.rowLine(row));
    const { bytes, offset } = sink.reserve(line.length * 3);
    const end = encodeUtf8Into(line, bytes, offset);
    this.current?.hash.update(bytes.subarray(offset, end));
    sink.commit(end - offset);
  }

  private rowLine(row: unknown): string {
    this.requireOpen();
    if (this.current === null) throw new BundleError('BundleWriter.row: call beginTable first', null);
    const line = rowToJsonLine(row);
    this.current.rows++;
    return line;
  }

  /** The closing manifest line; the writer cannot be used after it. */
  finish(): string {
    this.requireOpen();
    this.endTable();
    this.closed = true;
    return this.emit(JSON.stringify({ $manifest: { tables: this.summaries, lines: this.lines + 1 } }));
  }

  private endTable(): void {
    if (this.current !== null) {
      this.summaries.push({ name: this.current.name, rows: this.current.rows, sha256: this.current.hash.hex() });
      this.current = null;
    }
  }

  private requireOpen(): void {
    if (this.lines === 0) throw new BundleError('BundleWriter: call start first', null);
    if (this.closed) throw new BundleError('BundleWriter: the bundle is already finished', null);
  }

  private emit(text: string): string {
    this.lines++;
    return `${text}\n`;
  }
}
