import type { InstrumentRecord, NightRecord, SiteRecord, StarRecord, TransitRecord } from '../../core/archive/records.ts';

/**
 * 64-bit FNV-1a of a string, as 16 hex digits (Fowler–Noll–Vo, offset basis and prime of the
 * 64-bit variant, computed in two 32-bit halves with BigInt-free arithmetic). Not cryptographic:
 * it only tells whether what a night's reduction read has changed.
 */
export function fnv1a64(text: string): string {
  // 64-bit FNV: offset basis 0xcbf29ce484222325, prime 0x100000001b3 = 2^40 + 0x1b3.
  let hi = 0xcbf29ce4;
  let lo = 0x84222325;
  for (let i = 0; i < text.length; i++) {
    lo ^= text.charCodeAt(i);
    // (hi·2^32 + lo) × (2^40 + 0x1b3) mod 2^64, split into 16-bit products to stay exact in doubles.
    const loLow = lo & 0xffff;
    const loHigh = lo >>> 16;
    const a = loLow * 0x1b3;
    const b = loHigh * 0x1b3 + (a >>> 16);
    const newLo = ((b & 0xffff) << 16) | (a & 0xffff);
    const carry = Math.floor(b / 0x10000);
    hi = (Math.imul(hi, 0x1b3) + carry + ((lo << 8) >>> 0)) >>> 0;
    lo = newLo >>> 0;
  }
  return hi.toString(16).padStart(8, '0') + lo.toString(16).padStart(8, '0');
}

/**
 * The key of what every night's reduction shares: the site, the instruments and the stars (their
 * ids and last change). Editing a star's place changes every night's key, as it should.
 */
export function archiveContextKey(site: SiteRecord, instruments: readonly InstrumentRecord[], stars: readonly StarRecord[]): string {
  const parts = [`${site.id}@${site.updatedUtc}`];
  for (const row of [...instruments, ...stars].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0))) parts.push(`${row.id}@${row.updatedUtc}`);
  return fnv1a64(parts.join('|'));
}

/**
 * The change key of one night: the shared context, the night record's last change, and every
 * visible transit's id, last change and rejection (sorted by id, so the read order does not
 * matter). An edit, reject, restore, added or removed transit gives a new key.
 */
export function nightQualityKey(contextKey: string, night: NightRecord, transits: readonly TransitRecord[]): string {
  const rows = transits.filter((t) => t.visibility === 'visible').map((t) => `${t.id}@${t.updatedUtc}${t.userRejected ? 'R' : ''}`).sort();
  return `${contextKey}:${fnv1a64(`${night.id}@${night.updatedUtc}|${rows.join('|')}`)}`;
}
