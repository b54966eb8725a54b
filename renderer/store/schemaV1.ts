/**
 * Schema version 1 of the archive database. SHIPPED: never edit this object. A change of indexes
 * or tables goes into a new `schemaV2.ts` registered in database.ts with `.version(2).stores(...)`
 * and, where rows must be rewritten, an `.upgrade(...)` function; Dexie then migrates every
 * browser that still holds version 1.
 *
 * Only fields a query filters or sorts on are indexed (Dexie stores every other field anyway).
 * Compound indexes serve the views' queries:
 * - transits of one star in time order: `[starId+utcMjd]`;
 * - transits of one night: `nightId`;
 * - the common-mode series of one instrument: `[instrumentId+utcMjd]`;
 * - nights of one instrument by date: `[instrumentId+localDate]`, of one site: `[siteId+localDate]`;
 * - instrument events in time order: `[instrumentId+utcMjd]`;
 * - stars by programme: multi-entry `*programmes`.
 * `importId` on every importable table finds a staged import's rows to commit or sweep.
 */
export const SCHEMA_V1 = {
  sites: 'id, label, importId',
  instruments: 'id, siteId, label, importId',
  instrumentEvents: 'id, [instrumentId+utcMjd], importId',
  stars: 'id, catalogueId, label, *programmes, importId',
  nights: 'id, [instrumentId+localDate], [siteId+localDate], localDate, importId',
  transits: 'id, nightId, [starId+utcMjd], [instrumentId+utcMjd], utcMjd, importId',
  earthOrientation: 'mjd',
  leapSeconds: 'mjd',
  reductions: 'id, createdUtc, inputFingerprint',
  imports: 'id, status, startedUtc',
} as const;
