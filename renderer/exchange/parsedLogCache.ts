import { parseTransitLog } from '../../core/formats/transit-log.ts';
import type { ParseResult } from '../../core/formats/parse-result.ts';
import type { TransitLogRow } from '../../core/formats/transit-log.ts';

/** The last transit log parsed in this worker: the bytes it was read from and what it was checked against. */
interface CachedParse {
  readonly bytes: Uint8Array;
  readonly fileName: string;
  readonly starIdsKey: string;
  readonly result: ParseResult<TransitLogRow>;
}

let cached: CachedParse | null = null;

function sameBytes(a: Uint8Array, b: Uint8Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * parseTransitLog, remembering the last result: the validation pass and the import that follows
 * it parse the same file (a million rows take most of a minute), and the parse depends only on the
 * bytes (after the column mapping), the file name and the known star ids, all compared here. Only
 * the parse is reused; the checks against the archive (duplicates, nights) run again on every call.
 * The rows are read, never changed, by the planner. `forgetParsedLog` frees the memory.
 */
export function parseTransitLogOnce(bytes: Uint8Array, fileName: string, knownStarIds: ReadonlySet<string>): ParseResult<TransitLogRow> {
  const starIdsKey = [...knownStarIds].sort().join('\u0000');
  if (cached !== null && cached.fileName === fileName && cached.starIdsKey === starIdsKey && sameBytes(cached.bytes, bytes)) return cached.result;
  cached = null; // free the previous file before parsing the next
  const result = parseTransitLog(bytes, { fileName, knownStarIds });
  cached = { bytes, fileName, starIdsKey, result };
  return result;
}

/** Drops the remembered parse (after an import, or before any other Exchange task). */
export function forgetParsedLog(): void {
  cached = null;
}
