/** Why the archive could not be opened, in words for the user. */
export interface ArchiveOpenFailure {
  /** The IndexedDB or Dexie error name, e.g. "VersionError"; "Error" when unknown. */
  readonly errorName: string;
  readonly title: string;
  /** What happened, including the browser's own message. */
  readonly message: string;
  /** What the user can do; always says that nothing was deleted. */
  readonly advice: string;
}

const NOTHING_DELETED = 'Nothing in the archive was changed or deleted.';

interface NamedError {
  readonly name: string;
  readonly message: string;
  readonly inner?: unknown;
}

function asNamedError(error: unknown): NamedError {
  if (typeof error === 'object' && error !== null && 'name' in error && 'message' in error) {
    return error as NamedError;
  }
  return { name: 'Error', message: String(error) };
}

/**
 * Dexie wraps what IndexedDB reports in an `OpenFailedError` whose `inner` holds the cause;
 * look through the wrapper so the advice fits the cause.
 */
function rootCause(error: NamedError): NamedError {
  if (error.name === 'OpenFailedError' && error.inner !== undefined) {
    return asNamedError(error.inner);
  }
  return error;
}

const ADVICE: Readonly<Record<string, { readonly title: string; readonly advice: string }>> = {
  VersionError: {
    title: 'This archive was written by a newer version of Meridian Ledger',
    advice: 'Install that version of Meridian Ledger (or a later one) and open the archive with it.',
  },
  QuotaExceededError: {
    title: 'The browser has no storage space left for the archive',
    advice:
      'Free disk space, or allow this site more storage in the browser settings, then reload. ' +
      'A backup from Exchange keeps a copy outside the browser.',
  },
  MissingAPIError: {
    title: 'This browser offers no IndexedDB storage here',
    advice:
      'Private or guest windows and some privacy settings switch it off. Open the app in a normal ' +
      'window of Chromium or in the desktop app.',
  },
  InvalidStateError: {
    title: 'The browser refused to open its storage',
    advice:
      'Private or guest windows often do this. Open a normal window; if it persists, restart the browser.',
  },
  UnknownError: {
    title: 'The browser could not read its storage',
    advice:
      'This is usually a full disk or a damaged browser profile. Free space and restart the browser; ' +
      'do not clear site data before you have a backup.',
  },
  DatabaseClosedError: {
    title: 'The archive was closed while opening',
    advice: 'Another window may be upgrading it. Close other windows of the app and reload.',
  },
};

/** Turns an error thrown by `ArchiveDatabase.open()` into words for the user. */
export function describeOpenFailure(error: unknown): ArchiveOpenFailure {
  const cause = rootCause(asNamedError(error));
  const known = ADVICE[cause.name];
  const title = known?.title ?? 'The archive could not be opened';
  const advice = known?.advice ?? 'Reload the app; if it happens again, restart the browser.';
  return {
    errorName: cause.name,
    title,
    message: `${cause.name}: ${cause.message}`,
    advice: `${advice} ${NOTHING_DELETED}`,
  };
}

/** The archive's schema is newer than this build reads (found by openArchive before opening). */
export function describeNewerArchive(foundSchemaVersion: number, knownSchemaVersion: number): ArchiveOpenFailure {
  const known = ADVICE['VersionError'];
  return {
    errorName: 'VersionError',
    title: known.title,
    message:
      `The archive in this browser has schema version ${foundSchemaVersion}; ` +
      `this build reads versions up to ${knownSchemaVersion}.`,
    advice: `${known.advice} ${NOTHING_DELETED}`,
  };
}
