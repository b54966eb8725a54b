import { readCsv } from '../../core/formats/csv.ts';
import { decodeUtf8 } from '../../core/formats/utf8.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { TRANSIT_LOG_COLUMNS } from '../../core/formats/transit-log-columns.ts';

/** Their column name → our field name; a column left out (or mapped to '') is ignored. */
export type ColumnMapping = Readonly<Record<string, string>>;

/** Our transit-log fields offered in the mapping step, each with its unit or content (FORMATS.md). */
export const TRANSIT_LOG_FIELDS: readonly { readonly name: string; readonly unit: string }[] = [
  { name: 'starId', unit: 'star id of the star list (required)' },
  { name: 'culmination', unit: 'upper | lower (required)' },
  { name: 'clamp', unit: 'east | west | none' },
  { name: 'nightDate', unit: 'local date YYYY-MM-DD' },
  { name: 'instrumentId', unit: 'instrument id' },
  { name: 'observer', unit: 'initials' },
  ...Array.from({ length: 9 }, (_, k) => ({ name: `wire${k + 1}Utc`, unit: 'ISO 8601 UTC with Z' })),
  ...Array.from({ length: 9 }, (_, k) => ({ name: `wire${k + 1}ClockS`, unit: 's from 0 h of the clock' })),
  { name: 'wireTimesUtc', unit: 'UTC times separated by ;' },
  { name: 'wireTimesClockS', unit: 'clock seconds separated by ;' },
  { name: 'micrometerTurns', unit: 'micrometer turns' },
  { name: 'offsetPx', unit: 'detector pixels' },
  { name: 'zenithDistanceDeg', unit: 'degrees, 0–90' },
  { name: 'temperatureC', unit: '°C' },
  { name: 'pressureHpa', unit: 'hPa' },
  { name: 'humidityPercent', unit: '% relative humidity' },
  { name: 'weight', unit: 'relative weight > 0' },
  { name: 'flags', unit: 'flags separated by ;' },
  { name: 'note', unit: 'free text' },
];

const OURS = new Set(TRANSIT_LOG_FIELDS.map((f) => f.name));

/** True for a header name our transit-log reader knows (so it needs no mapping). */
export function isOurTransitColumn(name: string): boolean {
  return OURS.has(name) || (TRANSIT_LOG_COLUMNS as readonly string[]).includes(name) || /^wire[1-9]\d?(Utc|ClockS)$/.test(name);
}

/** Index of the first CR or LF byte, or the length: only the header line is decoded (a log can be 100 MB). */
function firstLineEnd(bytes: Uint8Array): number {
  for (let i = 0; i < bytes.length; i++) if (bytes[i] === 0x0a || bytes[i] === 0x0d) return i;
  return bytes.length;
}

/**
 * The header of a CSV file (trimmed names), or null when it cannot be read (the parser says why).
 * Reads the first line's bytes only, so it is cheap on the main thread for any file size.
 */
export function readCsvHeader(bytes: Uint8Array): string[] | null {
  const decoded = decodeUtf8(bytes.subarray(0, firstLineEnd(bytes)));
  if (!decoded.ok) return null;
  const first = readCsv(decoded.text);
  return first.records.length === 1 && first.problems.length === 0 ? first.records[0].fields.map((f) => f.trim()) : null;
}

function quote(field: string): string {
  return /[",\r\n]/.test(field) ? `"${field.replace(/"/g, '""')}"` : field;
}

/**
 * The file with its header rewritten through `mapping` (their name → ours; unmapped columns get
 * a name that our reader lists as unknown and ignores), every other byte as it was, so row and
 * line numbers in rejections still point into the user's file. Mapping two columns to one field
 * is refused with the names.
 */
export function applyColumnMapping(bytes: Uint8Array, mapping: ColumnMapping): Uint8Array {
  const header = readCsvHeader(bytes);
  if (header === null) return bytes; // the parser reports why
  const targets = new Map<string, string>();
  const renamed = header.map((theirs) => {
    const ours = mapping[theirs];
    if (ours === undefined || ours === '') return isOurTransitColumn(theirs) && !Object.values(mapping).includes(theirs) ? theirs : `unmapped:${theirs}`;
    const earlier = targets.get(ours);
    if (earlier !== undefined) throw new Error(`Column mapping: '${earlier}' and '${theirs}' are both mapped to ${ours}; map each field once.`);
    targets.set(ours, theirs);
    return ours;
  });
  // Names unchanged: the reader trims header names, so the file reads the same as rewritten (and
  // a million-row log is not decoded and encoded again for nothing).
  if (renamed.every((name, k) => name === header[k])) return bytes;
  if (!decodeUtf8(bytes).ok) return bytes; // the parser reports the byte offset, which must stay the file's own
  const headerEnd = firstLineEnd(bytes);
  const renamedHeader = encodeUtf8(renamed.map(quote).join(','));
  const out = new Uint8Array(renamedHeader.length + bytes.length - headerEnd);
  out.set(renamedHeader);
  out.set(bytes.subarray(headerEnd), renamedHeader.length);
  return out;
}
