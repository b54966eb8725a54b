// Checks the security settings of the Electron shell by running the real main-process code
// (main/electron/main.ts) against a recording stand-in for the electron module, so the settings
// checked are the ones the code that builds the window actually passes — not a copy of them.
// The required settings are Electron's own security checklist (electronjs.org "Security" tutorial).
import { beforeAll, describe, expect, it, vi } from 'vitest';

interface Recorded {
  windowOptions: Record<string, unknown>[];
  contentsHandlers: Map<string, (...args: unknown[]) => void>;
  windowOpenHandlers: ((details: unknown) => unknown)[];
  permissionRequest?: (contents: unknown, permission: string, callback: (granted: boolean) => void) => void;
  permissionCheck?: (contents: unknown, permission: string) => boolean;
  beforeRequest?: (details: { url: string }, callback: (response: { cancel: boolean }) => void) => void;
  privilegedSchemes: { scheme: string; privileges: Record<string, boolean> }[];
  loadedUrls: string[];
  singleInstanceRequested: boolean;
}

const recorded: Recorded = {
  windowOptions: [],
  contentsHandlers: new Map(),
  windowOpenHandlers: [],
  privilegedSchemes: [],
  loadedUrls: [],
  singleInstanceRequested: false,
};

vi.mock('electron', () => {
  let ready: () => void = () => undefined;
  const whenReady = new Promise<void>((resolve) => (ready = resolve));
  class FakeBrowserWindow {
    webContents = {
      id: 1,
      on: (name: string, handler: (...args: unknown[]) => void) => recorded.contentsHandlers.set(name, handler),
      setWindowOpenHandler: (handler: (details: unknown) => unknown) => recorded.windowOpenHandlers.push(handler),
    };
    constructor(options: Record<string, unknown>) {
      recorded.windowOptions.push(options);
    }
    once(): void {}
    on(): void {}
    loadURL(url: string): Promise<void> {
      recorded.loadedUrls.push(url);
      return Promise.resolve();
    }
  }
  const app = {
    requestSingleInstanceLock: () => ((recorded.singleInstanceRequested = true), true),
    on: () => undefined,
    quit: () => undefined,
    whenReady: () => whenReady,
    getVersion: () => '0.0.0-test',
    getPath: () => '/nonexistent',
  };
  setTimeout(() => ready(), 0);
  return {
    app,
    BrowserWindow: FakeBrowserWindow,
    protocol: { registerSchemesAsPrivileged: (list: Recorded['privilegedSchemes']) => recorded.privilegedSchemes.push(...list) },
    session: {
      defaultSession: {
        setPermissionRequestHandler: (h: Recorded['permissionRequest']) => (recorded.permissionRequest = h),
        setPermissionCheckHandler: (h: Recorded['permissionCheck']) => (recorded.permissionCheck = h),
        webRequest: { onBeforeRequest: (h: Recorded['beforeRequest']) => (recorded.beforeRequest = h) },
        protocol: { handle: () => undefined },
      },
    },
    ipcMain: { handle: () => undefined },
    dialog: {},
  };
});

beforeAll(async () => {
  await import('../../main/electron/main.ts');
  await vi.waitFor(() => expect(recorded.windowOptions.length).toBe(1));
});

describe('the main window built by main/electron/main.ts', () => {
  it('isolates the renderer: contextIsolation, sandbox, no Node, web security on', () => {
    const prefs = recorded.windowOptions[0].webPreferences as Record<string, unknown>;
    expect(prefs.contextIsolation).toBe(true);
    expect(prefs.sandbox).toBe(true);
    expect(prefs.nodeIntegration).toBe(false);
    expect(prefs.nodeIntegrationInWorker).toBe(false);
    expect(prefs.webSecurity).toBe(true);
    expect(prefs.allowRunningInsecureContent).toBe(false);
    expect(prefs.webviewTag).toBe(false);
    expect(String(prefs.preload)).toMatch(/preload\.cjs$/);
  });

  it('loads the renderer from the custom standard, secure scheme, not file://', () => {
    expect(recorded.loadedUrls).toEqual(['ledger://app/index.html']);
    const scheme = recorded.privilegedSchemes.find((s) => s.scheme === 'ledger');
    expect(scheme?.privileges.standard).toBe(true);
    expect(scheme?.privileges.secure).toBe(true);
    expect(scheme?.privileges.bypassCSP).toBe(false);
  });

  it('denies navigation away from the app and every new window', () => {
    const willNavigate = recorded.contentsHandlers.get('will-navigate');
    expect(willNavigate).toBeDefined();
    for (const [url, allowed] of [
      ['ledger://app/index.html#/archive', true],
      ['https://example.org/', false],
      ['file:///etc/passwd', false],
      ['ledger://app.evil/index.html', false],
    ] as const) {
      let prevented = false;
      willNavigate?.({ preventDefault: () => (prevented = true) }, url);
      expect(prevented, url).toBe(!allowed);
    }
    expect(recorded.windowOpenHandlers.length).toBeGreaterThan(0);
    for (const handler of recorded.windowOpenHandlers) expect(handler({ url: 'https://example.org' })).toEqual({ action: 'deny' });
  });

  it('refuses every permission request and every network request', () => {
    for (const permission of ['media', 'geolocation', 'notifications', 'clipboard-read', 'openExternal']) {
      let granted: boolean | undefined;
      recorded.permissionRequest?.({}, permission, (g) => (granted = g));
      expect(granted, permission).toBe(false);
      expect(recorded.permissionCheck?.({}, permission)).toBe(false);
    }
    const cancelled = (url: string) => {
      let cancel: boolean | undefined;
      recorded.beforeRequest?.({ url }, (r) => (cancel = r.cancel));
      return cancel;
    };
    expect(cancelled('https://example.org/x.js')).toBe(true);
    expect(cancelled('http://127.0.0.1:8080/')).toBe(true);
    expect(cancelled('wss://example.org/')).toBe(true);
    expect(cancelled('ledger://app/assets/index.js')).toBe(false);
  });

  it('asks for the single-instance lock', () => {
    expect(recorded.singleInstanceRequested).toBe(true);
  });
});
