import { Dexie, type EntityTable } from 'dexie';
import type {
  EarthOrientationRecord,
  ImportRecord,
  InstrumentEventRecord,
  InstrumentRecord,
  LeapSecondRecord,
  NightRecord,
  ReductionRecord,
  SiteRecord,
  StarRecord,
} from '../../core/archive/records.ts';
import { SCHEMA_V1 } from './schemaV1.ts';
import { SCHEMA_V2, type SettingRecord } from './schemaV2.ts';
import { SCHEMA_V3 } from './schemaV3.ts';
import { SCHEMA_V4 } from './schemaV4.ts';
import { upgradeToV3, type NightTallyRecord } from './nightTallies.ts';
import { upgradeToV4, type TransitGroupRecord } from './transitGroups.ts';

/** Name of the IndexedDB database that holds the user's archive in this browser profile. */
export const ARCHIVE_DATABASE_NAME = 'meridian-ledger-archive';

/** The newest schema version this build knows; opening a newer database fails with a VersionError. */
export const ARCHIVE_SCHEMA_VERSION = 4;

/**
 * The archive database (DESIGN.md §3), one typed table per record kind.
 *
 * Versions are appended, never edited: version 1 is SCHEMA_V1; a version 2 adds
 * `this.version(2).stores(SCHEMA_V2).upgrade(tx => ...)` below it, and tests open a version-1
 * database with the new code to prove the upgrade. Inside a transaction await only the database:
 * compute first, then write.
 */
export class ArchiveDatabase extends Dexie {
  sites!: EntityTable<SiteRecord, 'id'>;
  instruments!: EntityTable<InstrumentRecord, 'id'>;
  instrumentEvents!: EntityTable<InstrumentEventRecord, 'id'>;
  stars!: EntityTable<StarRecord, 'id'>;
  nights!: EntityTable<NightRecord, 'id'>;
  /** Schema v4: the transits, in groups; read and write them only through transitGroups.ts. */
  transitGroups!: EntityTable<TransitGroupRecord, 'id'>;
  earthOrientation!: EntityTable<EarthOrientationRecord, 'mjd'>;
  leapSeconds!: EntityTable<LeapSecondRecord, 'mjd'>;
  reductions!: EntityTable<ReductionRecord, 'id'>;
  imports!: EntityTable<ImportRecord, 'id'>;
  settings!: EntityTable<SettingRecord, 'key'>;
  /** Derived (schema v3): one tally per night, kept true by every write of transits. */
  nightTallies!: EntityTable<NightTallyRecord, 'nightId'>;

  /**
   * `name` is ARCHIVE_DATABASE_NAME in the app; tests pass a unique name each. `onUpgradeProgress`
   * hears how far an upgrade that reads every transit has got (the worker posts it to the window's
   * banner: a message is sent at once, even while the upgrade's transaction holds the worker).
   */
  constructor(name: string = ARCHIVE_DATABASE_NAME, options: { readonly onUpgradeProgress?: (done: number, total: number) => void } = {}) {
    super(name);
    const progress = options.onUpgradeProgress ?? (() => {});
    this.version(1).stores(SCHEMA_V1);
    this.version(2).stores(SCHEMA_V2);
    this.version(3).stores(SCHEMA_V3).upgrade(upgradeToV3);
    this.version(4).stores(SCHEMA_V4).upgrade((transaction) => upgradeToV4(transaction, progress));
  }
}
