import { getContext, setContext } from 'svelte';
import type { ArchiveDatabase } from '../store/database.ts';

const KEY = Symbol('the archive a printed report reads its labels from');

/** Lets a view's descendants (the Solve results' print button) reach the open archive without threading a prop through. */
export function provideReportDatabase(database: () => ArchiveDatabase | null): void {
  setContext(KEY, database);
}

/** The archive provided by an enclosing view, or null when none was. */
export function reportDatabase(): ArchiveDatabase | null {
  const get = getContext<(() => ArchiveDatabase | null) | undefined>(KEY);
  return get?.() ?? null;
}
