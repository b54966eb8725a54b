import { ArchiveDatabase, ARCHIVE_DATABASE_NAME, ARCHIVE_SCHEMA_VERSION } from './database.ts';
import { describeOpenFailure, describeNewerArchive, type ArchiveOpenFailure } from './describeOpenFailure.ts';

export type ArchiveOpenResult =
  | { readonly kind: 'open'; readonly database: ArchiveDatabase }
  | { readonly kind: 'failed'; readonly failure: ArchiveOpenFailure };

/** Dexie stores schema version v as IndexedDB version 10·v (its own convention). */
const DEXIE_VERSION_FACTOR = 10;

/** The IndexedDB version of an existing database, or null if it does not exist or cannot be listed. */
async function nativeVersionOf(name: string): Promise<number | null> {
  const factory = globalThis.indexedDB;
  if (factory === undefined || typeof factory.databases !== 'function') return null;
  const databases = await factory.databases();
  return databases.find((info) => info.name === name)?.version ?? null;
}

/**
 * Opens (and on first use creates) the archive database. Never deletes or resets anything: on
 * failure the database is left as it is and the result says what went wrong and what to do.
 *
 * A database written by a newer schema is refused before Dexie touches it: Dexie 4 would open it
 * anyway and even add missing tables, and this build would then misread rows a later upgrade
 * rewrote.
 */
export async function openArchive(
  name: string = ARCHIVE_DATABASE_NAME,
  /** Runs when the archive on disk is older than this build, before the upgrade; a failure it returns stops the open. */
  beforeUpgrade?: (fromSchemaVersion: number) => Promise<ArchiveOpenFailure | null>,
  /** Told when the upgrade itself starts (after `beforeUpgrade`), so the app can say why opening takes long. */
  onUpgradeStart?: (fromSchemaVersion: number, toSchemaVersion: number) => void,
  /**
   * Runs the upgrade somewhere else before this thread opens the archive (the app: in the worker,
   * which opens and closes it, so the window's thread never holds the upgrade's long tasks; at a
   * million transits they reached 1.3 s). A failure it throws stops the open, with its message.
   */
  upgradeElsewhere?: () => Promise<void>,
): Promise<ArchiveOpenResult> {
  let database: ArchiveDatabase | undefined;
  try {
    const nativeVersion = await nativeVersionOf(name);
    if (nativeVersion !== null && nativeVersion > ARCHIVE_SCHEMA_VERSION * DEXIE_VERSION_FACTOR) {
      const schemaVersion = nativeVersion / DEXIE_VERSION_FACTOR;
      return { kind: 'failed', failure: describeNewerArchive(schemaVersion, ARCHIVE_SCHEMA_VERSION) };
    }
    if (beforeUpgrade !== undefined && nativeVersion !== null && nativeVersion < ARCHIVE_SCHEMA_VERSION * DEXIE_VERSION_FACTOR) {
      const refusal = await beforeUpgrade(nativeVersion / DEXIE_VERSION_FACTOR);
      if (refusal !== null) return { kind: 'failed', failure: refusal };
    }
    if (nativeVersion !== null && nativeVersion < ARCHIVE_SCHEMA_VERSION * DEXIE_VERSION_FACTOR) {
      onUpgradeStart?.(nativeVersion / DEXIE_VERSION_FACTOR, ARCHIVE_SCHEMA_VERSION);
      await upgradeElsewhere?.();
    }
    database = new ArchiveDatabase(name);
    await database.open();
    return { kind: 'open', database };
  } catch (error) {
    database?.close();
    return { kind: 'failed', failure: describeOpenFailure(error) };
  }
}
