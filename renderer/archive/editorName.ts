import type { ArchiveDatabase } from '../store/database.ts';

/** Settings key of the name written into the audit trail with every edit. */
export const EDITOR_NAME_KEY = 'archive.editorName';

/** The stored editor name, or '' if none was given yet. */
export async function readEditorName(database: ArchiveDatabase): Promise<string> {
  const value = (await database.settings.get(EDITOR_NAME_KEY))?.value;
  return typeof value === 'string' ? value : '';
}

/** Stores the editor name (trimmed); an empty name is refused so the trail never has a blank author. */
export async function writeEditorName(database: ArchiveDatabase, name: string): Promise<string> {
  const trimmed = name.trim();
  if (trimmed === '') throw new Error('the editor name is empty: type the name to record with your edits');
  await database.settings.put({ key: EDITOR_NAME_KEY, value: trimmed });
  return trimmed;
}
