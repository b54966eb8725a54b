import type { InstrumentEventRecord, TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { ArchiveEditor } from './archiveEditor.ts';
import {
  loadInstruments, loadNightDetail, loadNightSummaries, loadStarProgramme,
  type InstrumentSummary, type NightDetail, type NightSummary, type StarSummary,
} from './archiveQueries.ts';
import { recentAuditEntries, type AuditEntry } from './auditTrail.ts';
import { readEditorName, writeEditorName } from './editorName.ts';
import type { EventDraft } from './parseEventForm.ts';

const AUDIT_LINES = 12;

/** What the Archive view shows and the edits it makes; one per open archive. */
export class ArchiveViewState {
  nights = $state.raw<readonly NightSummary[]>([]);
  detail = $state.raw<NightDetail | null>(null);
  stars = $state.raw<readonly StarSummary[]>([]);
  instruments = $state.raw<readonly InstrumentSummary[]>([]);
  audit = $state.raw<readonly AuditEntry[]>([]);
  editorName = $state('');
  /** What the next undo would take back, or null. */
  undoSummary = $state<string | null>(null);
  /** The outcome of the last edit, for the status line. */
  status = $state('');
  problem = $state<string | null>(null);
  /** Called after an edit was made (the nights' unit-weight errors are then reduced again). */
  onEdited: () => void = () => {};
  readonly databaseName: string;
  readonly #database: ArchiveDatabase;
  readonly #editor: ArchiveEditor;

  constructor(database: ArchiveDatabase) {
    this.#database = database;
    this.databaseName = database.name;
    this.#editor = new ArchiveEditor(database, () => this.editorName);
  }

  /**
   * Reads what the view shows, each part shown as soon as it is read: the nights (from their
   * tallies), instruments, editor and audit trail first; the star programme's counts (one index
   * range per star: 15–20 s of IndexedDB work at 1,000,000 transits on 2 shared cores) only then,
   * without holding the returned promise, so that they queue behind the nights' pages instead of
   * before them.
   */
  async load(): Promise<void> {
    try {
      await Promise.all([
        loadNightSummaries(this.#database).then((nights) => (this.nights = nights)),
        loadInstruments(this.#database).then((instruments) => (this.instruments = instruments)),
        readEditorName(this.#database).then((editorName) => (this.editorName = editorName)),
      ]);
      this.audit = await recentAuditEntries(this.#database, AUDIT_LINES);
      this.problem = null;
    } catch (error) {
      this.problem = `The archive could not be read: ${String(error)}. Reload the app.`;
      return;
    }
    void loadStarProgramme(this.#database).then((stars) => (this.stars = stars), (error: unknown) => {
      this.problem = `The star programme could not be read: ${String(error)}. Reload the app.`;
    });
  }

  async openNight(nightId: string): Promise<void> {
    this.detail = await loadNightDetail(this.#database, nightId);
    if (this.detail === null) this.problem = `Night ${nightId} is no longer in the archive; reload the view.`;
  }

  async saveEditorName(name: string): Promise<void> {
    await this.#run(async () => {
      this.editorName = await writeEditorName(this.#database, name);
      return `Edits are now recorded as ${this.editorName}.`;
    });
  }

  /** Words naming a transit in the trail: star, culmination and night. */
  describeTransit(transit: TransitRecord): string {
    const star = this.detail?.stars.get(transit.starId);
    const night = this.detail?.night.localDate ?? '?';
    return `the ${transit.culmination} transit of ${star?.label ?? transit.starId} on the night of ${night}`;
  }

  async setRejected(transit: TransitRecord, rejected: boolean): Promise<void> {
    await this.#run(async () => {
      await this.#editor.setTransitRejected(transit, rejected, this.describeTransit(transit));
      return `${rejected ? 'Rejected' : 'Restored'} ${this.describeTransit(transit)}.`;
    });
  }

  async setNote(transit: TransitRecord, note: string): Promise<void> {
    if (note === transit.note) return;
    await this.#run(async () => {
      await this.#editor.setTransitNote(transit, note, this.describeTransit(transit));
      return `Saved the note of ${this.describeTransit(transit)}.`;
    });
  }

  async addEvent(instrumentId: string, instrumentLabel: string, draft: EventDraft): Promise<boolean> {
    const now = nowUtcIso();
    const record: InstrumentEventRecord = {
      id: crypto.randomUUID(), instrumentId, ...draft, visibility: 'visible', createdUtc: now, updatedUtc: now,
    };
    return this.#run(async () => {
      await this.#editor.addInstrumentEvent(record, `a ${draft.kind} event to ${instrumentLabel}`);
      return `Added the ${draft.kind} event to ${instrumentLabel}; the drift model now has a segment boundary there.`;
    });
  }

  async undo(): Promise<void> {
    await this.#run(async () => {
      const step = await this.#editor.undo();
      return step === null ? 'Nothing to undo.' : `Undid: ${step.summary}.`;
    });
  }

  /** Runs an edit, then refreshes what it may have changed; returns whether the edit was made. */
  async #run(edit: () => Promise<string>): Promise<boolean> {
    let made = false;
    try {
      this.status = await edit();
      made = true;
      this.onEdited();
    } catch (error) {
      this.status = `Not changed: ${error instanceof Error ? error.message : String(error)}.`;
    }
    const stack = this.#editor.undoStack;
    this.undoSummary = stack.at(-1)?.summary ?? null;
    if (this.detail !== null) this.detail = await loadNightDetail(this.#database, this.detail.night.id);
    [this.instruments, this.audit] = await Promise.all([loadInstruments(this.#database), recentAuditEntries(this.#database, AUDIT_LINES)]);
    return made;
  }
}
