import type { Table } from 'dexie';
import type { InstrumentEventRecord, TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { nowUtcIso } from '../store/nowUtcIso.ts';
import { recountNightTallies } from '../store/nightTallies.ts';
import { auditKey, type AuditEntry, type EditedTable } from './auditTrail.ts';

type EditedRow = TransitRecord | InstrumentEventRecord;

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

  /** Marks a transit rejected by the user (true) or restores it (false). */
  async setTransitRejected(transitId: string, userRejected: boolean, description: string): Promise<TransitRecord> {
    const verb = userRejected ? 'rejected' : 'restored';
    return this.#changeTransit(transitId, { userRejected }, `${verb} ${description}`);
  }

  /** Replaces a transit's note. */
  async setTransitNote(transitId: string, note: string, description: string): Promise<TransitRecord> {
    return this.#changeTransit(transitId, { note }, `changed the note of ${description} to "${note}"`);
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
    const table = this.#table(step.table);
    await this.#database.transaction('rw', [table, this.#database.settings, ...this.#talliesScope(step.table)], async () => {
      const current = await table.get(step.recordId);
      this.#checkUnchanged(step, current ?? null, step.after);
      if (step.before === null) await table.delete(step.recordId);
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

  async #changeTransit(transitId: string, change: Partial<Pick<TransitRecord, 'userRejected' | 'note'>>, summary: string): Promise<TransitRecord> {
    const before = await this.#database.transits.get(transitId);
    if (before === undefined) throw new Error(`transit ${transitId} is not in the archive (removed meanwhile?): reload the night`);
    const after: TransitRecord = { ...before, ...change, updatedUtc: nowUtcIso() };
    await this.#commit({ table: 'transits', recordId: transitId, before, after, summary }, before);
    return after;
  }

  async #commit(step: EditStep, expected: EditedRow | null): Promise<void> {
    const editor = this.#requireEditor();
    const table = this.#table(step.table);
    await this.#database.transaction('rw', [table, this.#database.settings, ...this.#talliesScope(step.table)], async () => {
      const current = await table.get(step.recordId);
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

  /** A transit edit also rewrites its night's tally (schema v3), in the same transaction. */
  #talliesScope(name: EditedTable) {
    return name === 'transits' ? [this.#database.transits, this.#database.nights, this.#database.nightTallies] : [];
  }

  async #keepTalliesTrue(step: EditStep): Promise<void> {
    if (step.table !== 'transits') return;
    const nights = [step.after, step.before].filter((row) => row !== null).map((row) => (row as TransitRecord).nightId);
    await recountNightTallies(this.#database, nights);
  }

  #table(name: EditedTable): Table<EditedRow, string> {
    // Both tables hold rows keyed by a string id; the union type is what the editor writes.
    return (name === 'transits' ? this.#database.transits : this.#database.instrumentEvents) as unknown as Table<EditedRow, string>;
  }
}
