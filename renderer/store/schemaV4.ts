import { SCHEMA_V3 } from './schemaV3.ts';

/**
 * Schema version 4 of the archive database. SHIPPED once released: never edit; a change goes
 * into schemaV5.ts.
 *
 * Changes from version 3:
 * - the table `transits` (one record per transit) is replaced by `transitGroups`: up to 64
 *   transits of one star, close in time, per record (TransitGroupRecord in transitGroups.ts, the
 *   only module that reads or writes it). IndexedDB in Chromium costs about 55 µs for every record
 *   written whatever its size, so a million transits took about 90–100 s to write as rows (an
 *   import or a restore) and take 12–15 s as groups (measured, README "The archive at scale").
 * - indexes: `[starId+firstUtcMjd]` (a star's time range), `[starId+transitCount]` (a star's count
 *   from index keys alone), `*nightIds` (a night's transits) and `*importIds` (an import's),
 *   multi-entry over the distinct values of the group's transits.
 *
 * The transit rows themselves are unchanged, so a bundle holds the same `transits` rows as at
 * version 3. The upgrade from version 3 (upgradeToV4 in transitGroups.ts) groups every stored row.
 */
export const SCHEMA_V4 = {
  ...SCHEMA_V3,
  transits: null,
  transitGroups: 'id, [starId+firstUtcMjd], [starId+transitCount], *nightIds, *importIds',
} as const;
