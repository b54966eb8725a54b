import type { NightQuality } from '../../archive/nightQuality.ts';
import type { NightQualityCache } from '../../archive/nightQualityCache.ts';
import { DerivedResultsDatabase } from '../../store/derivedResults.ts';

/** This build's identity (renderer/vite.config.ts): qualities another build computed are not reused. */
const BUILD_ID: string = __BUILD_ID__;

/**
 * The overview's night qualities kept between launches (store/derivedResults.ts), so that a
 * large archive is not reduced again at every start. Every call swallows its own failure: the
 * results are derived, and without them the nights are only reduced again.
 */
async function withKept<T>(archiveName: string, fallback: T, use: (kept: DerivedResultsDatabase) => Promise<T>): Promise<T> {
  const kept = new DerivedResultsDatabase(archiveName);
  try {
    return await use(kept);
  } catch {
    return fallback;
  } finally {
    kept.close();
  }
}

/** Puts every quality this build kept for the archive into `cache`; returns how many. */
export function loadKeptQualities(archiveName: string, cache: NightQualityCache): Promise<number> {
  return withKept(archiveName, 0, async (kept) => {
    const rows = (await kept.nightQualities.toArray()).filter((row) => row.buildId === BUILD_ID);
    for (const row of rows) cache.set(row.quality);
    return rows.length;
  });
}

/** Keeps the qualities just computed. */
export function keepQualities(archiveName: string, qualities: readonly NightQuality[]): Promise<void> {
  return withKept(archiveName, undefined, async (kept) => {
    await kept.nightQualities.bulkPut(qualities.map((quality) => ({ nightId: quality.nightId, buildId: BUILD_ID, quality })));
  });
}

/** Drops every kept quality whose night is not in `nightIds` (removed nights); all of them for an empty set. */
export function keepOnly(archiveName: string, nightIds: ReadonlySet<string>): Promise<void> {
  return withKept(archiveName, undefined, async (kept) => {
    if (nightIds.size === 0) { await kept.nightQualities.clear(); return; }
    const gone = (await kept.nightQualities.toCollection().primaryKeys()).filter((id) => !nightIds.has(id));
    if (gone.length > 0) await kept.nightQualities.bulkDelete(gone);
  });
}
