/** A storage failure in words for the user: what happened and what to do. */
export interface StorageErrorMessage {
  readonly errorName: string;
  readonly message: string;
}

function nameAndMessage(error: unknown): { name: string; message: string; inner?: unknown } {
  if (typeof error === 'object' && error !== null && 'name' in error) {
    const named = error as { name: unknown; message?: unknown; inner?: unknown };
    return { name: String(named.name), message: String(named.message ?? ''), inner: named.inner };
  }
  return { name: 'Error', message: String(error) };
}

/** Dexie wraps IndexedDB's DOMException (AbortError / a Dexie error) with the cause in `inner`. */
function rootCause(error: unknown): { name: string; message: string } {
  let current = nameAndMessage(error);
  for (let depth = 0; depth < 4 && current.inner !== undefined; depth++) current = nameAndMessage(current.inner);
  return current;
}

const UNCHANGED = 'The data already in the archive is unchanged.';

/**
 * Turns an error thrown by Dexie or IndexedDB during a write (import, restore, IERS tables) into a
 * sentence naming the cause and the fix. `action` is what was being done, e.g. "Importing stars.csv".
 * QuotaExceededError (the browser's storage quota is full) is the case users meet; the others are
 * rarer and get the browser's own words.
 */
export function describeStorageError(action: string, error: unknown): StorageErrorMessage {
  const cause = rootCause(error);
  const isQuota = cause.name === 'QuotaExceededError' || /quota/i.test(cause.message);
  if (isQuota) {
    return {
      errorName: 'QuotaExceededError',
      message:
        `${action} stopped: the browser has no storage space left for this archive (QuotaExceededError). ${UNCHANGED} ` +
        'Free disk space or allow this site more storage in the browser settings, export a bundle to keep a copy outside the browser, then try again.',
    };
  }
  if (cause.name === 'TaskCancelledError') {
    return { errorName: cause.name, message: `${action} was cancelled; nothing of it was kept. ${UNCHANGED}` };
  }
  return {
    errorName: cause.name,
    message: `${action} failed: ${cause.name}: ${cause.message}. ${UNCHANGED} Reload the app and try again; if it persists, export a bundle first.`,
  };
}
