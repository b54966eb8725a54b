import { SCHEMA_V2 } from './schemaV2.ts';

/**
 * Schema version 3 of the archive database. SHIPPED once released: never edit; a change goes
 * into schemaV4.ts.
 *
 * Changes from version 2:
 * - `transits` drops the indexes `[instrumentId+utcMjd]` and `utcMjd`, which no query used. Every
 *   index is one more write per row: in headless Chromium on the 2-core build machine a transit
 *   cost about 300 µs to write with the five secondary indexes and about 200 µs with the three
 *   kept (`nightId`, `[starId+utcMjd]`, `importId`; measured, README "The archive at scale").
 * - a new derived table `nightTallies`, one row per night that holds at least one visible transit
 *   (NightTallyRecord in nightTallies.ts), keyed by `nightId`, indexed by
 *   `[instrumentId+localDate]`. It lets the Archive list a million transits' nights without
 *   reading a transit. Every path that writes transits keeps it true in the same transaction; it
 *   is never exported in a bundle and is rebuilt after a restore.
 *
 * The upgrade from version 2 (upgradeToV3 in nightTallies.ts) rewrites no row: it fills
 * `nightTallies` from the transits and nights already stored.
 */
export const SCHEMA_V3 = {
  ...SCHEMA_V2,
  transits: 'id, nightId, [starId+utcMjd], importId',
  nightTallies: 'nightId, [instrumentId+localDate]',
} as const;
