import type { NightRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { readNightTallies, type NightTallyRecord } from '../store/nightTallies.ts';
import { transitsOfImport } from '../store/transitGroups.ts';
import { AUDIT_KEY_PREFIX, type AuditEntry } from './auditTrail.ts';
import { fnv1a64 } from './nightQualityKey.ts';

/**
 * What the worker remembers between passes over one database, beside its cache of night
 * qualities: the newest audit-trail key seen, each import's status as last seen, and per night
 * the newest change that touched its transits without changing their number (an archive edit, an
 * import's commit). Lives and dies with the cache it belongs to.
 */
export class NightChangeLedger {
  /**
   * The newest audit key seen (`audit/<ISO UTC>/<uuid>`) and every key seen with its instant:
   * two edits within one millisecond sort by their random uuid, so a later one may sort first.
   */
  lastAuditKey: string | null = null;
  readonly keysAtLastInstant = new Set<string>();
  /** Bumped for each change seen, so a night's touch always changes with a new change. */
  changes = 0;
  /** False before the first pass: nothing is cached yet, so no history needs reading. */
  started = false;
  readonly importsSeen = new Map<string, string>();
  readonly touched = new Map<string, string>();

  clear(): void {
    this.lastAuditKey = null;
    this.keysAtLastInstant.clear();
    this.changes = 0;
    this.started = false;
    this.importsSeen.clear();
    this.touched.clear();
  }
}

/**
 * The cheap change key of one night: the shared context (archiveContextKey), the night record's
 * last change, its tally (tallySignature: visible and rejected transits, first and last instant)
 * and the ledger's last touch of its transits.
 */
export function nightStampKey(contextKey: string, night: NightRecord, tally: string, touch: string): string {
  return `${contextKey}:${fnv1a64(`${night.id}@${night.updatedUtc}|${tally}|${touch}`)}`;
}

/** A night's tally in one string for the change key; a night without one holds no visible transit. */
export function tallySignature(tally: NightTallyRecord | undefined): string {
  return tally === undefined ? 'n=0' : `n=${tally.transitCount}|r=${tally.rejectedCount}|${tally.firstUtcMjd}-${tally.lastUtcMjd}`;
}

/** What one read of the stamps found. */
export interface NightStamps {
  /** Each night's tallySignature, from the derived `nightTallies` table (no transit read). */
  readonly tallies: ReadonlyMap<string, string>;
  /** True when the archive was rewritten under the ledger (restore, demo removed): drop the cache. */
  readonly rewritten: boolean;
}

const importSignature = (row: { status: string; finishedUtc: string | null }) => `${row.status}@${row.finishedUtc ?? ''}`;

/**
 * Reads, in one read transaction, each night's tally and what changed since the last pass,
 * updating `ledger`. Every way a transit changes is seen: a transit added, removed, rejected or
 * restored changes its night's tally; an edit through the archive editor writes an audit entry naming
 * the transit (and its night); an import's commit or sweep changes its record in `imports`, and
 * only then are that import's rows read to find their nights. An audit entry or import record
 * that vanished means the archive was replaced (bundle restore, demo removed): `rewritten`.
 * Cost with nothing changed: the tallies (one small row per night), the imports table and one
 * audit key — where one count per night through the `nightId` index took 25–40 s at 1,000,000
 * transits in Chromium.
 */
export async function readNightStamps(database: ArchiveDatabase, nights: readonly NightRecord[], ledger: NightChangeLedger): Promise<NightStamps> {
  return database.transaction('r', [database.transitGroups, database.settings, database.imports, database.nightTallies], async () => {
    const tallyOf = new Map((await readNightTallies(database)).map((tally) => [tally.nightId, tally]));
    const tallies = new Map(nights.map((night) => [night.id, tallySignature(tallyOf.get(night.id))]));
    const imports = await database.imports.toArray();
    const auditRange = database.settings.where('key').between(AUDIT_KEY_PREFIX, `${AUDIT_KEY_PREFIX}\uffff`);
    if (!ledger.started) {
      const newest = await auditRange.clone().reverse().limit(1).primaryKeys();
      ledger.started = true;
      const key = newest[0] as string | undefined;
      if (key !== undefined) for (const row of await auditSince(database, key)) noteAuditKey(ledger, row.key);
      for (const row of imports) ledger.importsSeen.set(row.id, importSignature(row));
      return { tallies, rewritten: false };
    }
    const present = new Set(imports.map((row) => row.id));
    const vanishedImport = [...ledger.importsSeen.keys()].some((id) => !present.has(id));
    const vanishedAudit = ledger.lastAuditKey !== null && (await database.settings.get(ledger.lastAuditKey)) === undefined;
    if (vanishedImport || vanishedAudit) return { tallies, rewritten: true };
    for (const row of await auditSince(database, ledger.lastAuditKey)) {
      if (ledger.keysAtLastInstant.has(row.key)) continue;
      noteAuditKey(ledger, row.key);
      const entry = row.value as AuditEntry;
      if (entry.table !== 'transits') continue;
      const nightId = ((entry.after ?? entry.before) as { nightId?: unknown } | null)?.nightId;
      if (typeof nightId === 'string') ledger.touched.set(nightId, `edit#${++ledger.changes}`);
    }
    for (const row of imports) {
      const signature = importSignature(row);
      if (ledger.importsSeen.get(row.id) === signature) continue;
      ledger.importsSeen.set(row.id, signature);
      const touchedNights = new Set((await transitsOfImport(database, row.id)).map((t) => t.nightId));
      for (const nightId of touchedNights) ledger.touched.set(nightId, `import#${++ledger.changes}`);
    }
    return { tallies, rewritten: false };
  });
}

const instantOf = (auditKey: string) => auditKey.slice(0, auditKey.lastIndexOf('/') + 1);

/** Audit rows from the instant of `lastKey` on (all of them when null), in key order. */
function auditSince(database: ArchiveDatabase, lastKey: string | null): Promise<{ key: string; value: unknown }[]> {
  return database.settings.where('key').between(lastKey === null ? AUDIT_KEY_PREFIX : instantOf(lastKey), `${AUDIT_KEY_PREFIX}\uffff`).toArray();
}

function noteAuditKey(ledger: NightChangeLedger, key: string): void {
  if (ledger.lastAuditKey === null || instantOf(key) !== instantOf(ledger.lastAuditKey)) ledger.keysAtLastInstant.clear();
  ledger.keysAtLastInstant.add(key);
  if (ledger.lastAuditKey === null || key > ledger.lastAuditKey) ledger.lastAuditKey = key;
}
