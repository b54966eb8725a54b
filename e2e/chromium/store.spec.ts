import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Page } from '@playwright/test';
import { expect, openApp, test, withoutDemo } from './fixtures.ts';
import { CHROMIUM_ARGS, CHROMIUM_EXECUTABLE, WEB_PORT } from '../../playwright.config.ts';

// An invented site for the demo scenario.
const SITE = { label: 'Ridge pier (test)', latitude: '47.123456', longitude: '−8.5', height: '612.3' };

async function addSite(page: Page): Promise<void> {
  await page.getByLabel('Name').fill(SITE.label);
  await page.getByLabel('Latitude (°, north +)').fill(SITE.latitude);
  await page.getByLabel('Longitude (°, east +)').fill(SITE.longitude);
  await page.getByLabel('Height (m)').fill(SITE.height);
  await page.getByRole('button', { name: 'Save site' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toHaveText(`Saved "${SITE.label}".`);
}

const siteRow = (page: Page) => page.getByRole('row', { name: new RegExp(SITE.label.replace(/[()]/g, '\\$&')) });

test('a site written to the store is still there after a reload', async ({ page }) => {
  await openApp(page, './#/archive');
  await addSite(page);
  await expect(siteRow(page)).toContainText('47.123456');
  await expect(siteRow(page)).toContainText('−8.500000');
  await page.reload();
  await expect(siteRow(page)).toContainText('612.3');
});

test('a latitude out of range is refused with a message and nothing is saved', async ({ page }) => {
  await openApp(page, './#/archive');
  await page.getByLabel('Name').fill('Bad site');
  await page.getByLabel('Latitude (°, north +)').fill('91');
  await page.getByLabel('Longitude (°, east +)').fill('10');
  await page.getByLabel('Height (m)').fill('100');
  await page.getByRole('button', { name: 'Save site' }).click();
  await expect(page.getByText('Latitude must be between -90 and 90 degrees (north positive), got 91')).toBeVisible();
  await expect(page.getByLabel('Latitude (°, north +)')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByRole('heading', { name: 'Sites (0)' })).toBeVisible();
});

test('the footer reports the persistent-storage answer and the storage estimate', async ({ page }) => {
  await openApp(page);
  const status = page.getByTestId('storage-status');
  await expect(status).not.toHaveAttribute('data-persistence', 'checking');
  await expect(status).toContainText(/persistent|best effort|cannot promise|request failed/);
  await expect(status).toContainText(/used of .* allowed/);
});

test('a site survives closing and relaunching Chromium on the same profile', async () => {
  const profile = await mkdtemp(join(tmpdir(), 'meridian-profile-'));
  const launch = () => chromium.launchPersistentContext(profile, { executablePath: CHROMIUM_EXECUTABLE, args: CHROMIUM_ARGS });
  const url = `http://127.0.0.1:${WEB_PORT}/#/archive`;
  try {
    const first = await launch();
    const page = first.pages()[0] ?? (await first.newPage());
    await page.goto(withoutDemo(url));
    await addSite(page);
    await first.close();

    const second = await launch();
    const again = second.pages()[0] ?? (await second.newPage());
    await again.goto(withoutDemo(url));
    await expect(siteRow(again)).toContainText('47.123456');
    await second.close();
  } finally {
    await rm(profile, { recursive: true, force: true });
  }
});

test('an archive written by a newer version is refused with advice, and its data is left alone', async ({ page }) => {
  await openApp(page);
  // Close the app's connection first by leaving for a plain file of the same origin (whose
  // automatic /favicon.ico request is answered here, since the app itself uses favicon.svg).
  await page.route('**/favicon.ico', (route) => route.fulfill({ status: 204 }));
  await page.goto('./favicon.svg');
  await page.evaluate(async () => {
    await new Promise<void>((resolve, reject) => {
      const deletion = indexedDB.deleteDatabase('meridian-ledger-archive');
      deletion.onsuccess = () => resolve();
      deletion.onerror = () => reject(deletion.error);
    });
    await new Promise<void>((resolve, reject) => {
      // Schema version 5 in Dexie's numbering (IndexedDB version 50), with one row in it.
      const request = indexedDB.open('meridian-ledger-archive', 50);
      request.onupgradeneeded = () => request.result.createObjectStore('sites', { keyPath: 'id' }).put({ id: 'future-row' });
      request.onsuccess = () => { request.result.close(); resolve(); };
      request.onerror = () => reject(request.error);
    });
  });
  await page.goto(withoutDemo('./#/archive'));
  const banner = page.getByTestId('archive-failure');
  await expect(banner).toContainText('This archive was written by a newer version of Meridian Ledger');
  await expect(banner).toContainText('schema version 5');
  await expect(banner).toContainText('Nothing in the archive was changed or deleted.');
  await expect(page.getByText('The archive is not open; see the message above.')).toBeVisible();
  await page.screenshot({ path: 'e2e-output/screenshots/day-archive-refused.png' });
  const kept = await page.evaluate(() => new Promise<number>((resolve, reject) => {
    const request = indexedDB.open('meridian-ledger-archive');
    request.onsuccess = () => {
      const count = request.result.transaction('sites').objectStore('sites').count();
      count.onsuccess = () => { const version = request.result.version; request.result.close(); resolve(count.result * 1000 + version); };
    };
    request.onerror = () => reject(request.error);
  }));
  expect(kept).toBe(1 * 1000 + 50); // one row, still at version 50
});
