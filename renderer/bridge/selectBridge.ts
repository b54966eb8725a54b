import { BRIDGE_GLOBAL_NAME, type ShellBridge } from '../../core/bridge.ts';
import { createBrowserBridge } from './browserBridge.ts';

const BRIDGE_METHODS = ['info', 'openFiles', 'saveFile', 'writeBackup', 'listBackups', 'readBackup', 'printReport'] as const;

function isShellBridge(value: unknown): value is ShellBridge {
  if (typeof value !== 'object' || value === null) return false;
  const candidate = value as Record<string, unknown>;
  return BRIDGE_METHODS.every((method) => typeof candidate[method] === 'function');
}

/**
 * The Electron preload's bridge (`window.meridianLedgerShell`) when it is there and complete,
 * otherwise the browser's. A partial object is refused loudly: it means preload and renderer
 * are from different builds.
 */
export function selectBridge(host: object, appVersion: string): ShellBridge {
  const exposed: unknown = (host as Record<string, unknown>)[BRIDGE_GLOBAL_NAME];
  if (exposed === undefined) return createBrowserBridge(appVersion);
  if (!isShellBridge(exposed)) {
    const missing = BRIDGE_METHODS.filter((method) => typeof (exposed as Record<string, unknown>)?.[method] !== 'function');
    throw new Error(
      `window.${BRIDGE_GLOBAL_NAME} lacks ${missing.join(', ')}: the preload and the renderer come from ` +
        'different builds. Rebuild with `npm run build` and restart the app.',
    );
  }
  return exposed;
}
