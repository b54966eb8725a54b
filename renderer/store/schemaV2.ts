import { SCHEMA_V1 } from './schemaV1.ts';

/**
 * Schema version 2 of the archive database: version 1 unchanged plus `settings`, one record per
 * key (`{ key, value }`), for the few things the app must remember inside the archive itself so
 * that they travel with a bundle: the date of the last export, the column mapping chosen for an
 * instrument's transit logs, the expiry of an imported leap-second list. SHIPPED once released:
 * never edit; a change goes into schemaV3.ts.
 *
 * No rows are rewritten, so the upgrade from version 1 needs no function: Dexie only creates the
 * new object store.
 */
export const SCHEMA_V2 = {
  ...SCHEMA_V1,
  settings: 'key',
} as const;

/** One remembered setting; `value` is any structured-cloneable value, owned by whoever writes the key. */
export interface SettingRecord {
  readonly key: string;
  readonly value: unknown;
}
