// Set-up for e2e/bench/interface.bench.ts: a large archive written straight into the app's
// IndexedDB, outside the timed parts. The site, instrument and stars go through the app's own
// import (Exchange view); one imported night and transit are then the templates every written
// record is cloned from, so the rows have exactly the shape the app's Dexie schema stores. Transits
// are written as the app stores them since schema v4: groups of up to 64 transits of one star
// (renderer/store/transitGroups.ts, whose records this file builds again: no renderer code runs here).
// Invented scenario: no real site, instrument or star.
import type { Page } from '@playwright/test';

const STARS = 100;

const SITE = JSON.stringify({
  formatVersion: 1,
  site: { id: 'larch-knoll', label: 'Larch Knoll pier (invented)', latitudeDeg: 48.25, longitudeDeg: 13.5, heightM: 455 },
  instruments: [{ id: 'lk-1', label: 'Larch Knoll transit (invented)', kind: 'transit', zenithScale: { unit: 'turn', arcsecPerUnit: 48.77, sense: -1 },
    wireIntervalsS: [15.2, 0, -15.1], effectiveWavelengthUm: 0.6, clockId: 'clock-lk', clockTimeScale: 'sidereal', events: [] }],
});

function starList(): string {
  const lines = ['id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas'];
  for (let s = 0; s < STARS; s++) lines.push(`LK${String(s).padStart(3, '0')},Larch star ${s} (invented),${(s * 3.6).toFixed(1)},${(25 + (s % 40)).toFixed(1)},2016.0,1.5,-2.5,3.25`);
  return `${lines.join('\n')}\n`;
}

// The template transit: star LK000 on the night before the cloned ones start.
const TEMPLATE_LOG = 'starId,culmination,nightDate,instrumentId,wire1Utc,wire2Utc,wire3Utc,micrometerTurns\n'
  + 'LK000,upper,1998-12-31,lk-1,1998-12-31T18:00:10.10Z,1998-12-31T18:00:25.30Z,1998-12-31T18:00:40.40Z,12.500\n';

async function importText(page: Page, name: string, text: string): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: 'Choose a file to import…' }).click();
  await (await chooser).setFiles({ name, mimeType: 'text/plain', buffer: Buffer.from(text) });
  const importButton = page.getByRole('button', { name: /^Import (all|only the)/ });
  await importButton.waitFor();
  const rejected = await page.getByTestId('rejected-count').innerText();
  if (rejected !== '0') throw new Error(`bench set-up: ${name} had ${rejected} rejected rows; fix the generator in e2e/bench/interfaceArchive.ts`);
  await importButton.click();
  await page.getByTestId('import-message').filter({ hasText: `Imported ${name}` }).waitFor();
}

/** Imports the site and stars, then writes `transits` transits (STARS a night, one night a day from 1999-01-01) into IndexedDB. */
export async function fillArchive(page: Page, base: string, transits: number): Promise<{ nights: number; transits: number; stars: number }> {
  await page.goto(`${base}?no-demo#/exchange`);
  await importText(page, 'site.json', SITE);
  await importText(page, 'stars.csv', starList());
  await importText(page, 'template.csv', TEMPLATE_LOG);
  return page.evaluate(async ({ total, starCount }) => {
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const open = indexedDB.open('meridian-ledger-archive');
      open.onsuccess = () => resolve(open.result);
      open.onerror = () => reject(open.error);
    });
    const all = <T>(store: string) => new Promise<T[]>((resolve, reject) => {
      const r = db.transaction(store).objectStore(store).getAll();
      r.onsuccess = () => resolve(r.result as T[]);
      r.onerror = () => reject(r.error);
    });
    type Row = Record<string, unknown> & { id: string };
    const [night] = await all<Row>('nights');
    type Transit = Row & { nightId: string; starId: string; clockMjd: number; utcMjd: number; wireClockMjd: number[]; importId?: string };
    // The one transit the template import stored, alone in its group.
    const [templateGroup] = await all<{ transits: Transit[] }>('transitGroups');
    const transit = templateGroup?.transits[0];
    const stars = (await all<Row & { catalogueId: string }>('stars')).sort((a, b) => a.catalogueId.localeCompare(b.catalogueId));
    if (night === undefined || transit === undefined || stars.length !== starCount) throw new Error('bench set-up: the template night, transit or stars were not imported');
    const wireOffsets = transit.wireClockMjd.map((w) => w - transit.clockMjd);
    const utcOffset = transit.utcMjd - transit.clockMjd;
    const firstMjd = 51179; // 1999-01-01
    const nights = Math.ceil(total / starCount);
    const write = (store: string, rows: readonly Record<string, unknown>[]) => new Promise<void>((resolve, reject) => {
      const tx = db.transaction(store, 'readwrite');
      const os = tx.objectStore(store);
      for (const row of rows) os.put(row);
      tx.oncomplete = () => resolve();
      tx.onerror = () => reject(tx.error);
    });
    let written = 0;
    // A star has one transit a night, so its consecutive nights' transits are already in time order:
    // groups of GROUP_MAX_TRANSITS nights (63 days, inside the 400-day span), the cut groupTransits
    // makes. A chunk is a whole number of groups, so no group is cut at a chunk's edge.
    const GROUP_MAX_TRANSITS = 64;
    const NIGHTS_PER_CHUNK = 4 * GROUP_MAX_TRANSITS;
    // The derived per-night tallies (schema v3, renderer/store/nightTallies.ts) as the app's own writers keep them.
    const keepsTallies = db.objectStoreNames.contains('nightTallies');
    for (let first = 0; first < nights; first += NIGHTS_PER_CHUNK) {
      const nightRows: Row[] = [];
      const transitRows: Transit[] = [];
      const tallyRows: Record<string, unknown>[] = [];
      for (let k = first; k < Math.min(nights, first + NIGHTS_PER_CHUNK); k++) {
        const localDate = new Date(Date.UTC(1999, 0, 1 + k)).toISOString().slice(0, 10);
        const nightId = `bench-night-${localDate}`;
        nightRows.push({ ...night, id: nightId, localDate });
        const firstOfNight = transitRows.length;
        for (let s = 0; s < starCount && written < total; s++, written++) {
          // Star s crosses at 18 h + s·3 min of the clock (sidereal drift ignored: these rows are for the interface, not for reduction).
          const clockMjd = firstMjd + k + (18 * 60 + s * 3) / 1440;
          transitRows.push({ ...transit, id: `bench-transit-${localDate}-${s}`, nightId, starId: stars[s].id, clockMjd, utcMjd: clockMjd + utcOffset,
            wireClockMjd: wireOffsets.map((o) => clockMjd + o), zenithReadings: [12 + (s % 7) * 0.1] });
        }
        const ofNight = transitRows.slice(firstOfNight);
        if (ofNight.length > 0) {
          tallyRows.push({ nightId, instrumentId: night.instrumentId, localDate, transitCount: ofNight.length, rejectedCount: 0,
            firstUtcMjd: Math.min(...ofNight.map((t) => t.utcMjd)), lastUtcMjd: Math.max(...ofNight.map((t) => t.utcMjd)) });
        }
      }
      const byStar = new Map<string, Transit[]>();
      for (const t of transitRows) {
        const list = byStar.get(t.starId);
        if (list === undefined) byStar.set(t.starId, [t]);
        else list.push(t);
      }
      const groupRows: Row[] = [];
      for (const [s, star] of stars.entries()) {
        const list = byStar.get(star.id) ?? [];
        for (let start = 0; start < list.length; start += GROUP_MAX_TRANSITS) {
          const members = list.slice(start, start + GROUP_MAX_TRANSITS);
          groupRows.push({ id: `bench-group-${s}-${(first + start) / GROUP_MAX_TRANSITS}`, starId: star.id, firstUtcMjd: members[0].utcMjd,
            lastUtcMjd: members[members.length - 1].utcMjd, nightIds: [...new Set(members.map((t) => t.nightId))],
            importIds: [...new Set(members.flatMap((t) => (typeof t.importId === 'string' ? [t.importId] : [])))], transitCount: members.length, transits: members });
        }
      }
      await write('nights', nightRows);
      await write('transitGroups', groupRows);
      if (keepsTallies) await write('nightTallies', tallyRows);
    }
    db.close();
    return { nights: nights + 1, transits: written + 1, stars: stars.length };
  }, { total: transits - 1, starCount: STARS });
}

/**
 * Saves a reduction whose residuals are `count` observations grown from a real solve's (each
 * copy shifted a little in time and value so that no two marks coincide), newest of the list.
 */
export async function seedReduction(page: Page, results: Record<string, unknown>, count: number): Promise<number> {
  const { residuals, ...rest } = results as { residuals: unknown[] };
  return page.evaluate(async ({ saved, base, wanted }) => {
    type Residual = { utcMjd: number; ra: { residualMas: number }; zenith: { residualMas: number } | null };
    const grown: Residual[] = [];
    for (let i = 0; i < wanted; i++) {
      const r = base[i % base.length] as Residual;
      const copy = Math.floor(i / base.length);
      const wiggle = Math.sin(i * 12.9898) * 0.5;
      grown.push({ ...r, utcMjd: r.utcMjd + (copy % 9) * 0.11 - 0.44, ra: { ...r.ra, residualMas: r.ra.residualMas * (1 + 0.2 * wiggle) },
        zenith: r.zenith === null ? null : { ...r.zenith, residualMas: r.zenith.residualMas * (1 - 0.2 * wiggle) } });
    }
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const open = indexedDB.open('meridian-ledger-archive');
      open.onsuccess = () => resolve(open.result);
      open.onerror = () => reject(open.error);
    });
    await new Promise<void>((resolve, reject) => {
      const tx = db.transaction('reductions', 'readwrite');
      const now = '2099-01-01T00:00:00.000Z'; // newest of any list
      tx.objectStore('reductions').put({ id: 'reduction-bench-residuals', label: `Bench: ${wanted} residuals`, createdUtc: now, updatedUtc: now,
        modelConfiguration: {}, inputFingerprint: 'bench', codeVersion: 'bench', results: saved, residuals: grown });
      tx.oncomplete = () => resolve();
      tx.onerror = () => reject(tx.error);
    });
    db.close();
    return grown.length;
  }, { saved: rest, base: residuals, wanted: count });
}
