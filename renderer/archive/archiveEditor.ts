import type { Table } from 'dexie';
import { getTransit, removeTransitsOfNights, replaceTransits } from '../store/transitGroups.ts';
import type { InstrumentEventRecord, TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { recountNightTallies } from '../store/nightTallies.ts';
import { auditKey, type AuditEntry, type EditedTable } from './auditTrail.ts';

type EditedRow = TransitRecord | InstrumentEventRecord;

/** How the editor reads and writes one table's rows; `like` is a version of the row (it names a transit's night). */
interface EditedRows {
  readonly scope: readonly Table[];
  get(id: string, like: EditedRow): Promise<EditedRow | undefined>;
  put(row: EditedRow): Promise<void>;
  delete(row: EditedRow): Promise<void>;
}

/** What names a transit to the editor: its id and its night (transits are found in their night). */
export type TransitKey = Pick<TransitRecord, 'id' | 'nightId'>;

/** One change the editor made and can take back: the row before (null: created) and after. */
export interface EditStep {
  readonly table: EditedTable;
  readonly recordId: string;
  readonly before: EditedRow | null;
  readonly after: EditedRow;
  readonly summary: string;
}

/**
 * Edits of archive rows with an undo stack and an audit trail. Every change and every undo is one
 * transaction that checks the row is as the editor last saw it, writes it, and appends an audit
 * entry naming the editor (so a trail line never exists without its change, nor the reverse).
 * The undo stack lives as long as this object (the Archive view's session).
 */
export class ArchiveEditor {
  readonly #database: ArchiveDatabase;
  readonly #editorName: () => string;
  readonly #undoStack: EditStep[] = [];

  /** `editorName` is read at each edit; an empty name refuses the edit with a message. */
  constructor(database: ArchiveDatabase, editorName: () => string) {
    this.#database = database;
    this.#editorName = editorName;
  }

  /** The steps that can be undone, oldest first (the last one is undone first). */
  get undoStack(): readonly EditStep[] {
    return this.#undoStack;
  }

  /** Marks a transit rejected by the user (true) or restores it (false); `transit` names it and its night. */
  async setTransitRejected(transit: TransitKey, userRejected: boolean, description: string): Promise<TransitRecord> {
    const verb = userRejected ? 'rejected' : 'restored';
    return this.#changeTransit(transit, { userRejected }, `${verb} ${description}`);
  }

  /** Replaces a transit's note. */
  async setTransitNote(transit: TransitKey, note: string, description: string): Promise<TransitRecord> {
    return this.#changeTransit(transit, { note }, `changed the note of ${description} to "${note}"`);
  }

  /** Adds an instrument event (validated beforehand by parseEventForm). */
  async addInstrumentEvent(event: InstrumentEventRecord, description: string): Promise<InstrumentEventRecord> {
    await this.#commit({ table: 'instrumentEvents', recordId: event.id, before: null, after: event, summary: `added ${description}` }, null);
    return event;
  }

  /** Takes back the last step; returns it, or null when there is nothing to undo. */
  async undo(): Promise<EditStep | null> {
    const step = this.#undoStack.at(-1);
    if (step === undefined) return null;
    const editor = this.#requireEditor();
    const now = nowUtcIso();
    const table = this.#rows(step.table);
    await this.#database.transaction('rw', [...table.scope, this.#database.settings], async () => {
      const current = await table.get(step.recordId, step.after);
      this.#checkUnchanged(step, current ?? null, step.after);
      if (step.before === null) await table.delete(step.after);
      // The row comes back exactly, stamp included, so an older step on the same row still matches.
      else await table.put(step.before);
      await this.#keepTalliesTrue(step);
      const entry: AuditEntry = {
        atUtc: now, editor, table: step.table, recordId: step.recordId,
        summary: `undid: ${step.summary}`, before: current, after: step.before,
      };
      await this.#database.settings.add({ key: auditKey(now), value: entry });
    });
    this.#undoStack.pop();
    return step;
  }

  async #changeTransit(transit: TransitKey, change: Partial<Pick<TransitRecord, 'userRejected' | 'note'>>, summary: string): Promise<TransitRecord> {
    const before = await getTransit(this.#database, transit.nightId, transit.id);
    if (before === undefined) throw new Error(`transit ${transit.id} is not in the archive (removed meanwhile?): reload the night`);
    const after: TransitRecord = { ...before, ...change, updatedUtc: nowUtcIso() };
    await this.#commit({ table: 'transits', recordId: transit.id, before, after, summary }, before);
    return after;
  }

  async #commit(step: EditStep, expected: EditedRow | null): Promise<void> {
    const editor = this.#requireEditor();
    const table = this.#rows(step.table);
    await this.#database.transaction('rw', [...table.scope, this.#database.settings], async () => {
      const current = await table.get(step.recordId, step.after);
      this.#checkUnchanged(step, current ?? null, expected);
      await table.put(step.after);
      await this.#keepTalliesTrue(step);
      const entry: AuditEntry = {
        atUtc: step.after.updatedUtc, editor, table: step.table, recordId: step.recordId,
        summary: step.summary, before: step.before, after: step.after,
      };
      await this.#database.settings.add({ key: auditKey(step.after.updatedUtc), value: entry });
    });
    this.#undoStack.push(step);
  }

  /** Refuses to overwrite a row someone else changed since it was read (another window, an import). */
  #checkUnchanged(step: EditStep, current: EditedRow | null, expected: EditedRow | null): void {
    const same = current === null ? expected === null : expected !== null && current.updatedUtc === expected.updatedUtc;
    if (!same) {
      throw new Error(`${step.table} row ${step.recordId} changed since it was read (at ${current?.updatedUtc ?? 'removal'}): reload the view and make the edit again`);
    }
  }

  #requireEditor(): string {
    const name = this.#editorName().trim();
    if (name === '') throw new Error('no editor name: type your name in "Edits recorded as" first, so the audit trail says who changed what');
    return name;
  }


  async #keepTalliesTrue(step: EditStep): Promise<void> {
    if (step.table !== 'transits') return;
    const nights = [step.after, step.before].filter((row) => row !== null).map((row) => (row as TransitRecord).nightId);
    await recountNightTallies(this.#database, nights);
  }

  /**
   * Transits are stored in groups (transitGroups.ts) and found in their night; a transit edit also
   * rewrites its night's tally (schema v3), so its scope holds nights and tallies too.
   */
  #rows(name: EditedTable): EditedRows {
    const database = this.#database;
    if (name === 'transits') {
      return {
        scope: [database.transitGroups, database.nights, database.nightTallies],
        get: (id, like) => getTransit(database, (like as TransitRecord).nightId, id),
        put: (row) => replaceTransits(database, [row as TransitRecord]),
        delete: async (row) => void await removeTransitsOfNights(database, [(row as TransitRecord).nightId], (t) => t.id === row.id),
      };
    }
    const table = database.instrumentEvents as unknown as Table<EditedRow, string>;
    return {
      scope: [table],
      get: (id) => table.get(id),
      put: async (row) => void await table.put(row),
      delete: (row) => table.delete(row.id),
    };
  }
}
