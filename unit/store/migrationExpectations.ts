/**
 * What each schema upgrade is specified to do to a stored row, written from the upgrade's own
 * description (the doc comment of renderer/store/schemaV<N>.ts), not from running it.
 *
 * `UPGRADE_TO[N]` maps a row stored at version N − 1 to the row version N must hold. A version
 * that only adds tables or indexes keeps rows unchanged and has no entry. A schema version whose
 * upgrade function rewrites rows must add its entry here, or unit/store/migration.test.ts fails on
 * the first rewritten value.
 */
type Row = Readonly<Record<string, unknown>>;
type RowUpgrade = (table: string, row: Row) => Row;

const UPGRADE_TO: Readonly<Record<number, RowUpgrade>> = {
  // Version 2 adds the settings table; rows of version 1 are unchanged (schemaV2.ts).
  // Version 3 drops two transit indexes and adds the derived nightTallies table; no row is rewritten (schemaV3.ts).
  // Version 4 moves the transit rows, unchanged, into groups (schemaV4.ts): read back as rows, none differs.
};

/** The row a database first written at `fromVersion` must hold once upgraded to `toVersion`. */
/**
 * The derived tables an upgrade fills (table → rows it must hold), for a database first written at
 * `fromVersion`, worked out by hand from the fixture rows (rowsAtSchemaVersion.ts): the v1 and v2
 * row sets hold one visible transit (transit-1, not rejected, UTC MJD 60369.91234567) and one
 * staged one, which a tally does not count, both in the long-id night of 2024-02-29.
 */
export function derivedAfterUpgrade(fromVersion: number, toVersion: number, nightId: string): Readonly<Record<string, readonly Row[]>> {
  if (fromVersion >= 3 || toVersion < 3) return {};
  return {
    nightTallies: [{ nightId, instrumentId: 'instr-transit', localDate: '2024-02-29', transitCount: 1, rejectedCount: 0, firstUtcMjd: 60_369.91234567, lastUtcMjd: 60_369.91234567 }],
  };
}

export function expectedAfterUpgrade(fromVersion: number, toVersion: number, table: string, row: Row): Row {
  let upgraded = row;
  for (let version = fromVersion + 1; version <= toVersion; version += 1) {
    const step = UPGRADE_TO[version];
    if (step !== undefined) upgraded = step(table, upgraded);
  }
  return upgraded;
}
