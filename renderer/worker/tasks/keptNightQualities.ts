import type { NightQuality } from '../../archive/nightQuality.ts';
import type { NightQualityCache } from '../../archive/nightQualityCache.ts';
import { DerivedResultsDatabase } from '../../store/derivedResults.ts';

/** This build's identity (renderer/vite.config.ts): qualities another build computed are not reused. */
const BUILD_ID: string = __BUILD_ID__;

/**
 * The overview's night qualities kept between launches (store/derivedResults.ts), so that a
 * large archive is not reduced again at every start: one connection for one pass of the
 * overview, closed by `close()`. Every call swallows its own failure: the results are derived,
 * and without them the nights are only reduced again.
 */
export class KeptNightQualities {
  readonly #kept: DerivedResultsDatabase;

  constructor(archiveName: string) {
    this.#kept = new DerivedResultsDatabase(archiveName);
  }

  /** Puts every quality this build kept for the archive into `cache`; returns how many. */
  load(cache: NightQualityCache): Promise<number> {
    return this.#quietly(0, async (kept) => {
      const rows = (await kept.nightQualities.toArray()).filter((row) => row.buildId === BUILD_ID);
      for (const row of rows) cache.set(row.quality);
      return rows.length;
    });
  }

  /** Keeps the qualities just computed. */
  keep(qualities: readonly NightQuality[]): Promise<void> {
    return this.#quietly(undefined, async (kept) => {
      await kept.nightQualities.bulkPut(qualities.map((quality) => ({ nightId: quality.nightId, buildId: BUILD_ID, quality })));
    });
  }

  /** Drops every kept quality whose night is not in `nightIds` (removed nights); all of them for an empty set. */
  keepOnly(nightIds: ReadonlySet<string>): Promise<void> {
    return this.#quietly(undefined, async (kept) => {
      if (nightIds.size === 0) { await kept.nightQualities.clear(); return; }
      const gone = (await kept.nightQualities.toCollection().primaryKeys()).filter((id) => !nightIds.has(id));
      if (gone.length > 0) await kept.nightQualities.bulkDelete(gone);
    });
  }

  close(): void {
    this.#kept.close();
  }

  async #quietly<T>(fallback: T, use: (kept: DerivedResultsDatabase) => Promise<T>): Promise<T> {
    try {
      return await use(this.#kept);
    } catch {
      return fallback;
    }
  }
}
