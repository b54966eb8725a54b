import { describe, expect, it } from 'vitest';
import type { ArchiveContent } from '../../core/archive-folder/archive-folder.ts';
import { writeStarFile } from '../../core/archive-folder/star-file.ts';
import { keyedByCatalogueId } from '../../renderer/store/keyedByCatalogueId.ts';
import { nightRow, siteRow, starRow, transitRow } from './rowFactories.ts';

// Invented rows; the outside check is core's star-list writer, which refuses a star whose record
// id and catalogue id differ (as every star imported through Exchange has).
function content(stars = [starRow('0b1c-random', { catalogueId: 'ZX-1' }), starRow('9f2e-random', { catalogueId: 'ZX-2' })]): ArchiveContent {
  return {
    site: siteRow('site-1'), instruments: [], events: [], stars, nights: [nightRow('night-1')],
    transits: [transitRow('t-1', { starId: '9f2e-random' }), transitRow('t-2', { starId: '0b1c-random' })],
  };
}

describe('keyedByCatalogueId(content)', () => {
  it('re-keys stars and their transits so the folder star list can be written', () => {
    expect(() => writeStarFile(content().stars)).toThrow(/catalogue id ZX-1/);
    const keyed = keyedByCatalogueId(content());
    expect(keyed.stars.map((s) => s.id)).toEqual(['ZX-1', 'ZX-2']);
    expect(keyed.transits.map((t) => [t.id, t.starId])).toEqual([['t-1', 'ZX-2'], ['t-2', 'ZX-1']]);
    const lines = writeStarFile(keyed.stars).split('\n');
    expect(lines[1].startsWith('ZX-1,')).toBe(true);
    expect(lines[2].startsWith('ZX-2,')).toBe(true);
  });

  it('returns content whose ids already agree unchanged', () => {
    const same = content([starRow('ZX-1', { catalogueId: 'ZX-1' })]);
    expect(keyedByCatalogueId(same)).toBe(same);
  });

  it('refuses two stars with one catalogue id, naming both record ids', () => {
    const twins = content([starRow('0b1c-random', { catalogueId: 'ZX-1' }), starRow('77aa-random', { catalogueId: 'ZX-1' })]);
    expect(() => keyedByCatalogueId(twins)).toThrow(/0b1c-random and 77aa-random both have the catalogue id ZX-1/);
  });
});
