import { describe, expect, test } from 'vitest';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { ArchiveEditor } from '../../renderer/archive/archiveEditor.ts';
import { recentAuditEntries } from '../../renderer/archive/auditTrail.ts';
import { readEditorName, writeEditorName } from '../../renderer/archive/editorName.ts';
import type { InstrumentEventRecord } from '../../core/archive/records.ts';
import { transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { putTransitRows, transitById, updateTransitRow } from '../store/transitRows.ts';

// Invented rows (unit/store/rowFactories.ts); the checks are about the store's behaviour only.
async function openWithTransits(): Promise<ArchiveDatabase> {
  const database = new ArchiveDatabase(uniqueDatabaseName('editor'));
  await putTransitRows(database, [transitRow('t-1'), transitRow('t-2', { note: 'windy' })]);
  return database;
}

const eventRow = (id: string): InstrumentEventRecord => ({
  id, instrumentId: 'instr-1', utcMjd: 61_010.5, kind: 'relevelling', note: 'after the storm',
  visibility: 'visible', createdUtc: '2026-01-11T12:00:00.000Z', updatedUtc: '2026-01-11T12:00:00.000Z',
});

describe('ArchiveEditor', () => {
  test('setTransitRejected(transit, true) rejects, undo() restores, and both are in the audit trail', async () => {
    const database = await openWithTransits();
    const editor = new ArchiveEditor(database, () => 'R. Vance');
    await editor.setTransitRejected({ id: 't-1', nightId: 'night-1' }, true, 'the transit of Star 1');
    expect((await transitById(database, 't-1'))?.userRejected).toBe(true);
    expect(editor.undoStack).toHaveLength(1);

    const undone = await editor.undo();
    expect(undone?.summary).toBe('rejected the transit of Star 1');
    const restored = await transitById(database, 't-1');
    expect(restored).toEqual(transitRow('t-1'));
    expect(editor.undoStack).toHaveLength(0);

    const trail = await recentAuditEntries(database, 10);
    expect(trail.map((entry) => entry.summary)).toEqual(['undid: rejected the transit of Star 1', 'rejected the transit of Star 1']);
    expect(trail.every((entry) => entry.editor === 'R. Vance' && entry.recordId === 't-1')).toBe(true);
    expect((trail[1].before as { userRejected: boolean }).userRejected).toBe(false);
    expect((trail[1].after as { userRejected: boolean }).userRejected).toBe(true);
  });

  test('undo() is a stack: two edits of one transit and one of another come back in reverse order', async () => {
    const database = await openWithTransits();
    const editor = new ArchiveEditor(database, () => 'R. Vance');
    await editor.setTransitRejected({ id: 't-2', nightId: 'night-1' }, true, 'transit 2');
    await editor.setTransitNote({ id: 't-2', nightId: 'night-1' }, 'cloud at wire 3', 'transit 2');
    await editor.setTransitRejected({ id: 't-1', nightId: 'night-1' }, true, 'transit 1');
    await editor.undo();
    expect((await transitById(database, 't-1'))?.userRejected).toBe(false);
    expect((await transitById(database, 't-2'))?.note).toBe('cloud at wire 3');
    await editor.undo();
    expect((await transitById(database, 't-2'))?.note).toBe('windy');
    expect((await transitById(database, 't-2'))?.userRejected).toBe(true);
    await editor.undo();
    expect(await transitById(database, 't-2')).toEqual(transitRow('t-2', { note: 'windy' }));
    expect(await editor.undo()).toBeNull();
    expect(await recentAuditEntries(database, 100)).toHaveLength(6);
  });

  test('addInstrumentEvent writes the event and undo() removes it again', async () => {
    const database = await openWithTransits();
    const editor = new ArchiveEditor(database, () => 'R. Vance');
    await editor.addInstrumentEvent(eventRow('e-1'), 'a relevelling');
    expect(await database.instrumentEvents.count()).toBe(1);
    await editor.undo();
    expect(await database.instrumentEvents.count()).toBe(0);
    expect((await recentAuditEntries(database, 1))[0].summary).toBe('undid: added a relevelling');
  });

  test('an edit without an editor name is refused and changes nothing', async () => {
    const database = await openWithTransits();
    const editor = new ArchiveEditor(database, () => '  ');
    await expect(editor.setTransitRejected({ id: 't-1', nightId: 'night-1' }, true, 'transit 1')).rejects.toThrow(/no editor name/);
    expect((await transitById(database, 't-1'))?.userRejected).toBe(false);
    expect(await recentAuditEntries(database, 10)).toHaveLength(0);
    expect(editor.undoStack).toHaveLength(0);
  });

  test('undo() refuses when the row was changed elsewhere since, and keeps the step', async () => {
    const database = await openWithTransits();
    const editor = new ArchiveEditor(database, () => 'R. Vance');
    await editor.setTransitRejected({ id: 't-1', nightId: 'night-1' }, true, 'transit 1');
    await updateTransitRow(database, 't-1', { note: 'edited in another window', updatedUtc: '2030-01-01T00:00:00.000Z' });
    await expect(editor.undo()).rejects.toThrow(/changed since it was read/);
    expect((await transitById(database, 't-1'))?.note).toBe('edited in another window');
    expect(editor.undoStack).toHaveLength(1);
  });

  test('a missing transit is named in the error', async () => {
    const database = await openWithTransits();
    const editor = new ArchiveEditor(database, () => 'R. Vance');
    await expect(editor.setTransitRejected({ id: 't-9', nightId: 'night-1' }, true, 'transit 9')).rejects.toThrow(/transit t-9 is not in the archive/);
  });
});

describe('editor name in settings', () => {
  test('writeEditorName stores the trimmed name; an empty one is refused', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('editor-name'));
    expect(await readEditorName(database)).toBe('');
    expect(await writeEditorName(database, '  R. Vance ')).toBe('R. Vance');
    expect(await readEditorName(database)).toBe('R. Vance');
    await expect(writeEditorName(database, ' ')).rejects.toThrow(/editor name is empty/);
    expect(await readEditorName(database)).toBe('R. Vance');
  });
});
