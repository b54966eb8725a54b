import { Dexie, type EntityTable } from 'dexie';
import type { NightQuality } from '../archive/nightQuality.ts';

/** One night's quality as kept between launches, with the build that computed it. */
export interface KeptNightQuality {
  readonly nightId: string;
  readonly buildId: string;
  readonly quality: NightQuality;
}

/**
 * Results derived from an archive and kept between launches so that a large archive is not
 * reduced again at every start: today the overview's nightly unit-weight errors. A database of
 * its own beside the archive (`<archive name>-derived`), never the archive: nothing here is
 * exported, backed up or migrated, and deleting it loses nothing but time (every entry is
 * recomputed from the archive). Each entry is valid only for its change key (nightQualityKey.ts)
 * and the build that computed it.
 */
export class DerivedResultsDatabase extends Dexie {
  nightQualities!: EntityTable<KeptNightQuality, 'nightId'>;

  constructor(archiveName: string) {
    super(`${archiveName}-derived`);
    this.version(1).stores({ nightQualities: 'nightId' });
  }
}
