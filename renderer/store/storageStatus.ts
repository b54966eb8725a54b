/** The part of `navigator.storage` the app uses; tests pass their own. */
export interface StorageManagerLike {
  persist?(): Promise<boolean>;
  persisted?(): Promise<boolean>;
  estimate?(): Promise<{ usage?: number; quota?: number }>;
}

/** Whether the browser promised to keep the archive when disk space runs low. */
export type PersistenceState = 'persistent' | 'best-effort' | 'unsupported' | 'failed';

export interface StorageStatus {
  readonly persistence: PersistenceState;
  /** Bytes used by this origin, or null when the browser does not say. */
  readonly usageBytes: number | null;
  /** Bytes this origin may use, or null when the browser does not say. */
  readonly quotaBytes: number | null;
  /** Set when asking failed: the browser's message. */
  readonly errorMessage: string | null;
}

async function askPersistence(storage: StorageManagerLike): Promise<PersistenceState> {
  if (typeof storage.persist !== 'function') return 'unsupported';
  if (typeof storage.persisted === 'function' && (await storage.persisted())) return 'persistent';
  return (await storage.persist()) ? 'persistent' : 'best-effort';
}

/**
 * Asks for persistent storage (`navigator.storage.persist()`) and reads the usage estimate.
 * `storage` is undefined where the browser has no StorageManager (then everything is unsupported).
 */
export async function requestStorageStatus(storage: StorageManagerLike | undefined): Promise<StorageStatus> {
  if (storage === undefined) {
    return { persistence: 'unsupported', usageBytes: null, quotaBytes: null, errorMessage: null };
  }
  try {
    const persistence = await askPersistence(storage);
    const estimate = typeof storage.estimate === 'function' ? await storage.estimate() : {};
    return {
      persistence,
      usageBytes: estimate.usage ?? null,
      quotaBytes: estimate.quota ?? null,
      errorMessage: null,
    };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    return { persistence: 'failed', usageBytes: null, quotaBytes: null, errorMessage: message };
  }
}

/** Bytes as a short human size with binary prefixes ("1.5 MiB"); one decimal above KiB. */
export function formatBytes(bytes: number): string {
  if (!Number.isFinite(bytes) || bytes < 0) {
    throw new RangeError(`formatBytes: expected a non-negative finite byte count, got ${bytes}`);
  }
  const units = ['B', 'KiB', 'MiB', 'GiB', 'TiB'];
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit += 1;
  }
  return unit === 0 ? `${value} B` : `${value.toFixed(1)} ${units[unit]}`;
}
