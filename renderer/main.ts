import './styles/themes.css';
import './styles/base.css';
import { mount } from 'svelte';
import App from './App.svelte';
import { ViewRouter } from './navigation/router.svelte.ts';
import { ThemeState } from './theme/themeState.svelte.ts';
import { ArchiveState } from './app/archiveState.svelte.ts';
import { fetchBundledDemo } from './demo/demoArchive.ts';
import { ComputeClient } from './worker/computeClient.ts';
import { selectBridge } from './bridge/selectBridge.ts';
import { backupBeforeUpgrade } from './exchange/preUpgradeBackup.ts';
import { runStartupBackups } from './exchange/startupBackups.svelte.ts';
import { ARCHIVE_DATABASE_NAME } from './store/database.ts';
import { startExchangeJob } from './exchange/exchangeJobs.ts';

function localStorageOrNull(): Storage | null {
  try {
    return window.localStorage;
  } catch {
    return null; // blocked by privacy settings: the theme then lasts for this session only
  }
}

const target = document.getElementById('app');
if (target === null) throw new Error('index.html lacks <div id="app">; the renderer cannot start.');

const themeState = new ThemeState({
  storage: localStorageOrNull(),
  apply: (theme) => document.documentElement.setAttribute('data-theme', theme),
});
const router = new ViewRouter(window);
const archive = new ArchiveState();
// `?no-demo` opens an empty archive without the demo (tests, and users who want to start blank).
const loadDemo = !new URLSearchParams(window.location.search).has('no-demo');
const bridge = selectBridge(window, __APP_VERSION__);
const worker = new Worker(new URL('./worker/compute.worker.ts', import.meta.url), { type: 'module' });
const compute = new ComputeClient(worker);
// A schema upgrade runs in the worker (it opens the archive there first), never on this thread.
const upgradeInWorker = async (databaseName: string): Promise<void> => {
  const outcome = await startExchangeJob(compute, { kind: 'archive-upgrade', databaseName }, (done, total) => (archive.upgradeProgress = { done, total })).outcome;
  if (outcome.kind !== 'finished') throw new Error(outcome.kind === 'failed' ? outcome.message : 'the upgrade was cancelled');
};
// So does the desktop app's backup of the old archive before it (a million transits read and bundled).
const exportOldInWorker = async (databaseName: string, fromSchemaVersion: number, createdUtc: string, producer: string): Promise<Uint8Array> => {
  const outcome = await startExchangeJob(compute, { kind: 'archive-export-old', databaseName, fromSchemaVersion, createdUtc, producer }, () => {}).outcome;
  if (outcome.kind !== 'finished') throw new Error(outcome.kind === 'failed' ? outcome.message : 'the backup was cancelled');
  return outcome.result.bytes;
};
const beforeUpgrade = backupBeforeUpgrade(ARCHIVE_DATABASE_NAME, bridge, exportOldInWorker);
void archive.start(navigator.storage, undefined, loadDemo ? fetchBundledDemo : undefined, beforeUpgrade, upgradeInWorker).then(async () => {
  // Daily backup, or the offer to restore the newest backup into an empty archive (Exchange view).
  if (archive.database !== null && (await runStartupBackups(archive.database, compute, bridge))) router.go('exchange');
});

mount(App, { target, props: { router, themeState, archive, compute, bridge } });
