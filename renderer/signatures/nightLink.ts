/**
 * The address of one night in the Archive view: `#/archive?night=<id>` (the view router reads only
 * the part before `?`, so the Archive opens and the night id travels in the query).
 */
export function hashForNight(nightId: string): string {
  if (nightId === '') throw new Error('hashForNight: the night id is empty; pass the id of the night to open.');
  return `#/archive?night=${encodeURIComponent(nightId)}`;
}

/** The night id a location hash carries (`#/archive?night=…`), or null when it names none. */
export function nightIdFromHash(hash: string): string | null {
  const query = /^#\/?archive\?(.*)$/i.exec(hash)?.[1];
  if (query === undefined) return null;
  const id = new URLSearchParams(query).get('night');
  return id === null || id === '' ? null : id;
}
