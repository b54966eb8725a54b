/**
 * What a copy kept in localStorage between launches needs (Tonight's programme inputs, the Archive
 * overview): the storage itself, read and written as JSON text under one key. A copy only ever
 * stands in while the archive opens; losing one costs a slower first view, never data.
 */
export type CopyStore = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

/**
 * Writes `value` as JSON under `key`, or removes the key when the text would exceed
 * `maxCharacters` (localStorage holds ~5 MB per origin) or storage refuses it (quota, privacy
 * settings); returns whether a copy is kept.
 */
export function keepLaunchCopy(storage: CopyStore | null, key: string, value: unknown, maxCharacters: number): boolean {
  if (storage === null) return false;
  try {
    const text = JSON.stringify(value);
    if (text.length > maxCharacters) {
      storage.removeItem(key);
      return false;
    }
    storage.setItem(key, text);
    return true;
  } catch {
    return false;
  }
}

/** The JSON value kept under `key`, or null when there is none or it cannot be read. */
export function readLaunchCopy(storage: CopyStore | null, key: string): unknown {
  try {
    const text = storage?.getItem(key) ?? null;
    return text === null ? null : (JSON.parse(text) as unknown);
  } catch {
    return null;
  }
}
