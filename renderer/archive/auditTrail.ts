import type { ArchiveDatabase } from '../store/database.ts';

/** The tables an archive edit may change (each has string ids). */
export type EditedTable = 'transits' | 'instrumentEvents';

/**
 * One line of the audit trail: who changed which row, when, and its value before and after
 * (null before = the row was created; null after = the row was removed). Kept in the `settings`
 * table under keys `audit/<ISO UTC>/<uuid>`, so key order is time order and the trail travels
 * with a bundle without a schema change.
 */
export interface AuditEntry {
  readonly atUtc: string;
  readonly editor: string;
  readonly table: EditedTable;
  readonly recordId: string;
  /** What was done, in words, e.g. "rejected the transit of Star 3 on 2024-03-05". */
  readonly summary: string;
  readonly before: unknown;
  readonly after: unknown;
}

export const AUDIT_KEY_PREFIX = 'audit/';

/** The settings key of an audit entry written at `atUtc` (ISO 8601 UTC). */
export function auditKey(atUtc: string): string {
  return `${AUDIT_KEY_PREFIX}${atUtc}/${crypto.randomUUID()}`;
}

/** The newest `limit` audit entries, newest first, read through the settings key range. */
export async function recentAuditEntries(database: ArchiveDatabase, limit: number): Promise<AuditEntry[]> {
  const rows = await database.settings
    .where('key')
    .between(AUDIT_KEY_PREFIX, `${AUDIT_KEY_PREFIX}\uffff`)
    .reverse()
    .limit(limit)
    .toArray();
  return rows.map((row) => row.value as AuditEntry);
}
