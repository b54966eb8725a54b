/**
 * Electron main process: one hardened window serving the renderer from the app scheme, the shell
 * bridge, and nothing else. No network requests leave the app; every permission is refused.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { BrowserWindow, app, protocol, session } from 'electron';
import { serveAppRequest } from './app-protocol.ts';
import { registerBridgeHandlers } from './ipc.ts';
import {
  APP_ENTRY_URL,
  APP_SCHEME,
  APP_SCHEME_PRIVILEGES,
  isAllowedNavigation,
  isAllowedRequest,
  mainWindowOptions,
  permissionDecision,
} from './security-policy.ts';

const here = path.dirname(fileURLToPath(import.meta.url));
const rendererRoot = path.resolve(here, '../renderer');
const preloadPath = path.join(here, 'preload.cjs');

protocol.registerSchemesAsPrivileged([{ scheme: APP_SCHEME, privileges: { ...APP_SCHEME_PRIVILEGES } }]);

let mainWindow: BrowserWindow | null = null;

function hardenSession(): void {
  const appSession = session.defaultSession;
  appSession.setPermissionRequestHandler((_contents, permission, callback) => callback(permissionDecision(permission)));
  appSession.setPermissionCheckHandler((_contents, permission) => permissionDecision(permission));
  appSession.webRequest.onBeforeRequest((details, callback) => callback({ cancel: !isAllowedRequest(details.url) }));
  appSession.protocol.handle(APP_SCHEME, (request) => serveAppRequest(request, rendererRoot));
}

function createMainWindow(): BrowserWindow {
  const window = new BrowserWindow(mainWindowOptions(preloadPath));
  const contents = window.webContents;
  contents.on('will-navigate', (event, url) => {
    if (!isAllowedNavigation(url)) event.preventDefault();
  });
  contents.on('will-redirect', (event, url) => {
    if (!isAllowedNavigation(url)) event.preventDefault();
  });
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
  window.once('ready-to-show', () => window.show());
  window.on('closed', () => {
    mainWindow = null;
  });
  void window.loadURL(APP_ENTRY_URL);
  return window;
}

if (!app.requestSingleInstanceLock()) {
  app.quit();
} else {
  app.on('second-instance', () => {
    if (mainWindow) {
      if (mainWindow.isMinimized()) mainWindow.restore();
      mainWindow.focus();
    }
  });
  app.on('web-contents-created', (_event, contents) => {
    contents.setWindowOpenHandler(() => ({ action: 'deny' }));
  });
  void app.whenReady().then(() => {
    hardenSession();
    registerBridgeHandlers(() => mainWindow);
    mainWindow = createMainWindow();
  });
  app.on('window-all-closed', () => app.quit());
}
