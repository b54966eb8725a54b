import { readArchiveFolder } from '../archive-folder/archive-folder.ts';
import { dateMjd } from '../archive-folder/folder-text.ts';
import type { InstrumentEventRecord, NightRecord } from '../archive/records.ts';
import { parseClockComparisons, type ClockComparisonRow } from '../formats/clock-comparisons.ts';
import { describeRejections } from '../formats/parse-result.ts';
import { parseSiteDescription, type SiteDescription } from '../formats/site-description.ts';
import { parseStarList, type StarListRow } from '../formats/star-list.ts';
import { parseTransitLog, type TransitLogRow } from '../formats/transit-log.ts';

/** What the joint solve reads from an archive folder, in the import formats the nightly reduction takes. */
export interface SolveInputs {
  readonly site: SiteDescription;
  readonly stars: readonly StarListRow[];
  readonly transits: readonly TransitLogRow[];
  readonly comparisons: readonly ClockComparisonRow[];
  /** The folder's nights (weather, level readings), by local date MJD and instrument: key `${mjd}/${instrumentId}`. */
  readonly nights: ReadonlyMap<string, NightRecord>;
  /** The instruments' events (adjustments, relevellings, clock changes …): they cut per-segment terms. */
  readonly events?: readonly InstrumentEventRecord[];
}

export function nightKey(nightDateMjd: number, instrumentId: string): string {
  return `${nightDateMjd}/${instrumentId}`;
}

/**
 * Archive folder files (as `meridian-ledger simulate` writes them; FOLDER.md) → SolveInputs, or
 * every problem found (file, row, column, reason): the folder is taken whole or not at all.
 */
export function readSolveInputs(files: ReadonlyMap<string, Uint8Array>): { inputs: SolveInputs | null; problems: string[] } {
  const folder = readArchiveFolder(files, '2000-01-01T00:00:00.000Z');
  const problems = folder.rejected.map((r) => `${r.file}${r.row > 0 ? `: row ${r.row} (line ${r.line})` : ''}${r.column ? `, column ${r.column}` : ''}: ${r.reason}`);
  if (folder.content === null || problems.length > 0) return { inputs: null, problems: problems.length > 0 ? problems : ['the folder could not be read as an archive folder (FOLDER.md)'] };
  const need = (path: string): Uint8Array => files.get(path) ?? new Uint8Array();
  const site = parseSiteDescription(need('site.json'), 'site.json');
  const stars = parseStarList(need('stars.csv'), 'stars.csv');
  const comparisons = files.has('clock-comparisons.csv') ? parseClockComparisons(need('clock-comparisons.csv'), 'clock-comparisons.csv') : { rows: [], rejected: [] };
  problems.push(...describeRejections('site.json', site.rejected), ...describeRejections('stars.csv', stars.rejected),
    ...describeRejections('clock-comparisons.csv', comparisons.rejected));
  const transits: TransitLogRow[] = [];
  for (const path of [...files.keys()].filter((p) => /^transits\/\d{4}\.csv$/.test(p)).sort()) {
    const parsed = parseTransitLog(need(path), { fileName: path });
    problems.push(...describeRejections(path, parsed.rejected));
    transits.push(...parsed.rows);
  }
  if (problems.length > 0 || site.rows.length !== 1) return { inputs: null, problems: problems.length > 0 ? problems : ['site.json must describe exactly one site'] };
  const nights = new Map(folder.content.nights.map((n) => [nightKey(dateMjd(n.localDate), n.instrumentId), n]));
  return { inputs: { site: site.rows[0], stars: stars.rows, transits, comparisons: comparisons.rows, nights, events: folder.content.events }, problems };
}
