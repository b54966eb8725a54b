import type { NightRecord } from '../../../core/archive/records.ts';
import { DEFAULT_JOINT_MODEL } from '../../../core/joint/joint-model.ts';
import { TaskCancelledError, type TaskControl } from '../../../core/task/task-control.ts';
import type { NightQuality } from '../../archive/nightQuality.ts';
import { NightQualityCache } from '../../archive/nightQualityCache.ts';
import { archiveContextKey, fnv1a64 } from '../../archive/nightQualityKey.ts';
import { NightChangeLedger, nightStampKey, readNightStamps } from '../../archive/nightQualityStamps.ts';
import { reduceStoredNights } from '../../archive/reduceStoredNights.ts';
import { ArchiveDatabase } from '../../store/database.ts';
import { transitsOfNights } from '../../store/transitGroups.ts';
import { archiveTimeScale } from './archiveTimeScale.ts';
import { KeptNightQualities } from './keptNightQualities.ts';
import { StageClock } from '../../exchange/stageClock.ts';

export interface NightQualityRequest {
  readonly kind: 'night-quality';
  readonly databaseName: string;
}

export interface NightQualityResult {
  readonly kind: 'night-quality';
  /** One entry per visible night of the archive, in no particular order. */
  readonly nights: readonly NightQuality[];
  /** Nights taken from the cache (unchanged since their last reduction) and nights reduced now. */
  readonly reused: number;
  readonly reduced: number;
}

/**
 * Nights per chunk: one folder round trip, then a yield so a cancel and the UI's messages get in.
 * 60 rather than 20 reads each transit group (up to 64 nights) about once instead of three times:
 * a simulated 1,045-night archive took 10.2 s instead of 11.2 s in headless Chromium; a chunk is
 * about 0.6 s of work, the longest a cancel waits.
 */
export const NIGHT_QUALITY_CHUNK = 60;

/**
 * The per-session cache, one per database name, held in the worker: it lives as long as the app
 * window, survives closing and reopening the Archive view, and keeps the nights finished before a
 * cancel. It starts from the qualities this build kept at earlier launches (keptNightQualities.ts,
 * a database beside the archive, never in it: out of bundles and backups), so a million-transit
 * archive is not reduced again at every start; every night computed is kept there too.
 */
interface Session { readonly cache: NightQualityCache; readonly ledger: NightChangeLedger; loaded: boolean }
const CACHES = new Map<string, Session>();

function sessionOf(databaseName: string): Session {
  let session = CACHES.get(databaseName);
  if (session === undefined) CACHES.set(databaseName, (session = { cache: new NightQualityCache(), ledger: new NightChangeLedger(), loaded: false }));
  return session;
}

/** Ends the worker's session of `databaseName` as closing the window would (tests: the next run starts like a new launch). */
export function endNightQualitySession(databaseName: string): void {
  CACHES.delete(databaseName);
}

export function nightQualityCache(databaseName: string): NightQualityCache {
  return sessionOf(databaseName).cache;
}

/**
 * Reduces every visible night of the archive whose change key (nightStampKey: context, night
 * record, its tally, last edit or import commit; no transit body read) is not in the
 * cache, in chunks of NIGHT_QUALITY_CHUNK nights with progress in nights, and returns every
 * night's quality. A cancel is seen between chunks; the nights done by then stay cached.
 */
export async function runNightQuality(request: NightQualityRequest, control: TaskControl): Promise<NightQualityResult> {
  const database = new ArchiveDatabase(request.databaseName);
  const kept = new KeptNightQualities(request.databaseName);
  try {
    const visible = <T extends { readonly visibility: string }>(rows: readonly T[]): T[] => rows.filter((r) => r.visibility === 'visible');
    const [sites, instruments, events, stars, nights] = await Promise.all([
      database.sites.toArray(), database.instruments.toArray(), database.instrumentEvents.toArray(),
      database.stars.toArray(), database.nights.toArray(),
    ]).then(([a, b, c, d, e]) => [visible(a), visible(b), visible(c), visible(d), visible(e)] as const);
    const session = sessionOf(request.databaseName);
    const { cache, ledger } = session;
    if (!session.loaded) {
      session.loaded = true;
      await kept.load(cache);
    }
    if (sites.length !== 1) {
      const reason = `the archive holds ${sites.length} visible sites; the nightly reduction reads one site (merge or remove sites first)`;
      return { kind: 'night-quality', reused: 0, reduced: 0, nights: nights.map((n) => ({ nightId: n.id, key: '', reduced: false, unitWeightError: null, unitWeightErrorTime: null, unitWeightErrorZenith: null, transitsUsed: 0, transitsRejected: 0, transitsUserRejected: 0, failure: reason })) };
    }
    // The archive's own tables (bundled with any imported IERS files), as Tonight and the joint solve use them; an
    // imported table changes every night's key, so the nights are reduced again with it.
    const { scale: timeScale, tablesKey } = await archiveTimeScale(database);
    const contextKey = fnv1a64(`${archiveContextKey(sites[0], instruments, stars)}|${tablesKey}`);
    let stamps = await readNightStamps(database, nights, ledger);
    if (stamps.rewritten) {
      cache.retainOnly(new Set());
      await kept.keepOnly(new Set());
      ledger.clear();
      stamps = await readNightStamps(database, nights, ledger);
    }
    const keys = new Map(nights.map((n) => [n.id, nightStampKey(contextKey, n, stamps.tallies.get(n.id) ?? 'n=0', ledger.touched.get(n.id) ?? '')]));
    // In instrument and date order: the transits are stored in groups of one star over up to 64
    // nights (transitGroups.ts), so consecutive nights share their groups; in id order (random for
    // nights logged in Tonight) every chunk would read groups from all over the archive.
    const stale: NightRecord[] = nights.filter((n) => cache.get(n.id, keys.get(n.id) ?? '') === undefined)
      .sort((a, b) => (a.instrumentId < b.instrumentId ? -1 : a.instrumentId > b.instrumentId ? 1 : a.localDate < b.localDate ? -1 : a.localDate > b.localDate ? 1 : 0));
    cache.retainOnly(new Set(keys.keys()));
    await kept.keepOnly(new Set(keys.keys()));
    const apriori = { wireSigmaS: DEFAULT_JOINT_MODEL.wireSigmaS, readingSigmaArcsec: DEFAULT_JOINT_MODEL.readingSigmaArcsec };
    control.reportProgress(0, stale.length);
    const clock = new StageClock(`night qualities of ${stale.length} nights`);
    for (let start = 0; start < stale.length; start += NIGHT_QUALITY_CHUNK) {
      await control.yieldToHost();
      clock.lap('waiting for the host');
      if (control.cancellation.isCancelled) throw new TaskCancelledError('the nightly reductions of the overview', start);
      const chunk = stale.slice(start, start + NIGHT_QUALITY_CHUNK);
      // Only the stale nights' transits are read, through the transit groups' nightIds index.
      const transits = visible(await transitsOfNights(database, chunk.map((n) => n.id)));
      clock.lap('read transits');
      const results = await reduceStoredNights({
        site: sites[0], instruments, events, stars, nights: chunk, transits,
      }, { timeScale, apriori, keys });
      clock.lap('reduce');
      for (const result of results) cache.set(result);
      await kept.keep(results);
      clock.lap('keep');
      control.reportProgress(Math.min(stale.length, start + chunk.length), stale.length);
    }
    if (stale.length > 0) clock.log();
    return { kind: 'night-quality', reused: nights.length - stale.length, reduced: stale.length, nights: nights.map((n) => cache.get(n.id, keys.get(n.id) ?? '')).filter((q): q is NightQuality => q !== undefined) };
  } finally {
    kept.close();
    database.close();
  }
}
