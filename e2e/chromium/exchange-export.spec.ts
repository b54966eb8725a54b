import { readFile } from 'node:fs/promises';
import type { Page } from '@playwright/test';
import { expect, openApp, test } from './fixtures.ts';

// Invented stars: no real catalogue values.
const STARS = 'id,label,raDeg,decDeg,epochJyear,parallaxMas\nQX-1,"Invented, one",84.1234567890123,22.44,2016.0,4.1\nQX-2,Invented two,130.5,61.25,2016.0,\n';

async function importStars(page: Page, throughBrowserPicker = true): Promise<void> {
  const chooser = throughBrowserPicker ? page.waitForEvent('filechooser') : null;
  await page.getByRole('button', { name: 'Choose a file to import…' }).click();
  if (chooser !== null) await (await chooser).setFiles({ name: 'stars.csv', mimeType: 'text/plain', buffer: Buffer.from(STARS) });
  await expect(page.getByTestId('valid-count')).toHaveText('2');
  await page.getByRole('button', { name: /^Import (all|only the)/ }).click();
  await expect(page.getByTestId('import-message')).toContainText('2 stars');
}

test('the stars table downloads as an RFC 4180 CSV in the star-list layout', async ({ page }) => {
  await openApp(page, './#/exchange');
  await importStars(page);
  // Browser mode writes no automatic backups: no empty "Automatic backup" section is shown.
  await expect(page.getByTestId('startup-backup')).toHaveCount(0);
  const download = page.waitForEvent('download');
  await page.getByTestId('export-csv-stars').click();
  const file = await download;
  expect(file.suggestedFilename()).toMatch(/^meridian-ledger-stars-\d{4}-\d\d-\d\d\.csv$/);
  const text = await readFile(await file.path(), 'utf8');
  const lines = text.split('\r\n');
  expect(lines[0]).toBe('id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas,parallaxSigmaMas,positionSigmaMas,pmSigmaMasYr,radialVelocityKmS,magnitude,source,programme,archiveId');
  // Rows come in the archive's key order (random ids), so find each star by its id.
  expect(lines.find((l) => l.startsWith('QX-1,'))).toMatch(/^QX-1,"Invented, one",84\.1234567890123,22\.44,2016,,,4\.1,/);
  expect(lines.find((l) => l.startsWith('QX-2,'))).toMatch(/^QX-2,Invented two,130\.5,61\.25,2016,,,,/);
  expect(lines).toHaveLength(4); // header, 2 stars, the empty rest after the final CRLF
  await expect(page.getByTestId('no-saved-solve')).toBeVisible();
});

/**
 * A stand-in for the desktop shell (window.meridianLedgerShell, as the preload exposes it) that
 * keeps backups in memory; `seed` preloads backups as byte arrays, `openable` is the file every open dialog returns.
 */
function fakeDesktopShell({ seed, openable }: { seed: { fileName: string; bytes: number[]; writtenUtc: string }[]; openable: { name: string; text: string } | null }): void {
  const backups = seed.map((b) => ({ ...b, bytes: new Uint8Array(b.bytes) }));
  const writes: { fileName: string; keepNewest: number; bytes: number[] }[] = [];
  (window as unknown as Record<string, unknown>).__backupWrites = writes;
  const info = (b: { fileName: string; bytes: Uint8Array; writtenUtc: string }) => ({ fileName: b.fileName, sizeBytes: b.bytes.length, writtenUtc: b.writtenUtc });
  (window as unknown as Record<string, unknown>).meridianLedgerShell = {
    info: async () => ({ shell: 'electron', appVersion: 'e2e', automaticBackups: true }),
    openFiles: async () => (openable === null ? { kind: 'cancelled' } : { kind: 'ok', value: [{ name: openable.name, bytes: new TextEncoder().encode(openable.text) }] }),
    saveFile: async () => ({ kind: 'cancelled' }),
    printReport: async () => ({ kind: 'cancelled' }),
    listBackups: async () => ({ kind: 'ok', value: backups.map(info) }),
    readBackup: async (name: string) => {
      const found = backups.find((b) => b.fileName === name);
      return found === undefined ? { kind: 'failed', message: `no backup ${name}` } : { kind: 'ok', value: found.bytes };
    },
    writeBackup: async (request: { fileName: string; bytes: Uint8Array; keepNewest: number }) => {
      writes.push({ fileName: request.fileName, keepNewest: request.keepNewest, bytes: [...request.bytes] });
      const written = { fileName: request.fileName, bytes: request.bytes, writtenUtc: new Date().toISOString() };
      backups.push(written);
      return { kind: 'ok', value: info(written) };
    },
  };
}

test('desktop shell: a daily backup is written at start, and an empty archive is offered it back', async ({ page, browser }) => {
  await page.addInitScript(fakeDesktopShell, { seed: [], openable: { name: 'stars.csv', text: STARS } });
  await openApp(page, './#/exchange');
  await importStars(page, false);
  await page.reload();
  await expect(page.getByTestId('startup-backup')).toContainText("Today's backup was written");
  const writes = (await page.evaluate(() => (window as unknown as Record<string, unknown>).__backupWrites)) as { fileName: string; keepNewest: number; bytes: number[] }[];
  expect(writes).toHaveLength(1);
  expect(writes[0].keepNewest).toBe(7);
  expect(writes[0].fileName).toMatch(/^archive-\d{4}-\d\d-\d\dT\d{6}Z\.mlbundle$/);

  // A new profile: empty archive, the shell's folder holds that backup.
  const context = await browser.newContext();
  const fresh = await context.newPage();
  await fresh.addInitScript(fakeDesktopShell, { seed: [{ fileName: writes[0].fileName, bytes: writes[0].bytes, writtenUtc: new Date().toISOString() }], openable: null });
  await openApp(fresh, './#/tonight');
  await expect(fresh).toHaveURL(/#\/exchange/);
  await fresh.getByRole('button', { name: 'Check the newest backup…' }).click();
  await expect(fresh.getByTestId('startup-backup-preview')).toContainText('stars: 2');
  await fresh.getByRole('button', { name: 'Restore this backup' }).click();
  await expect(fresh.getByTestId('startup-backup')).toContainText('Restored');
  await expect(fresh.getByTestId('archive-counts')).toContainText('2 stars');
  const afterRestore = (await fresh.evaluate(() => (window as unknown as Record<string, unknown>).__backupWrites)) as unknown[];
  expect(afterRestore).toHaveLength(0); // the empty archive was never backed up over the real backups
  await context.close();
});
