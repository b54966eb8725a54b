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
};

/** The row a database first written at `fromVersion` must hold once upgraded to `toVersion`. */
export function expectedAfterUpgrade(fromVersion: number, toVersion: number, table: string, row: Row): Row {
  let upgraded = row;
  for (let version = fromVersion + 1; version <= toVersion; version += 1) {
    const step = UPGRADE_TO[version];
    if (step !== undefined) upgraded = step(table, upgraded);
  }
  return upgraded;
}
