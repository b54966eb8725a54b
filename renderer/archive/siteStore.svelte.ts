import type { SiteRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import type { SiteDraft } from './parseSiteForm.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';

/** The visible sites of the archive, in label order, and adding one. */
export class SiteStore {
  sites = $state.raw<readonly SiteRecord[]>([]);
  loadProblem = $state<string | null>(null);
  readonly #database: ArchiveDatabase;

  constructor(database: ArchiveDatabase) {
    this.#database = database;
  }

  async load(): Promise<void> {
    try {
      const rows = await this.#database.sites.orderBy('label').toArray();
      this.sites = rows.filter((row) => row.visibility === 'visible');
      this.loadProblem = null;
    } catch (error) {
      this.loadProblem = `The sites could not be read: ${String(error)}. Reload the app.`;
    }
  }

  /** Writes a new site and reloads the list; the returned promise rejects if the write fails. */
  async add(draft: SiteDraft): Promise<SiteRecord> {
    const now = nowUtcIso();
    const record: SiteRecord = {
      id: crypto.randomUUID(),
      ...draft,
      note: '',
      visibility: 'visible',
      createdUtc: now,
      updatedUtc: now,
    };
    await this.#database.sites.add(record);
    await this.load();
    return record;
  }
}
