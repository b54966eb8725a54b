/**
 * Security settings of the Electron shell, in one place so that the code that builds the window
 * and the test that checks it read the same values. Nothing here imports Electron at run time,
 * so it loads in plain Node for the unit tests.
 */
import type { BrowserWindowConstructorOptions } from 'electron';

/** The custom scheme the renderer is served from: standard (real origins) and secure (IndexedDB works). */
export const APP_SCHEME = 'ledger';
export const APP_HOST = 'app';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_ENTRY_URL = `${APP_ORIGIN}/index.html`;

/** Privileges for `protocol.registerSchemesAsPrivileged`; no CSP bypass, no fetch from elsewhere. */
export const APP_SCHEME_PRIVILEGES = {
  standard: true,
  secure: true,
  supportFetchAPI: true,
  allowServiceWorkers: false,
  bypassCSP: false,
  corsEnabled: false,
  stream: true,
} as const;

/**
 * The Content-Security-Policy sent with every response of the app scheme: scripts only from the
 * app itself, no remote origins of any kind, no plugins, no framing.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "worker-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
  "frame-src 'self' blob:",
].join('; ');

/** Options of the main window. `preloadPath` is the absolute path of the built preload (.cjs). */
export function mainWindowOptions(preloadPath: string): BrowserWindowConstructorOptions {
  return {
    width: 1280,
    height: 860,
    minWidth: 800,
    minHeight: 560,
    show: false,
    backgroundColor: '#101010',
    title: 'Meridian Ledger',
    webPreferences: {
      preload: preloadPath,
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      nodeIntegrationInSubFrames: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      experimentalFeatures: false,
      webviewTag: false,
      navigateOnDragDrop: false,
      spellcheck: false,
      safeDialogs: true,
    },
  };
}

/** Options of the hidden window that renders a report to PDF: no preload, no scripts at all. */
export function reportWindowOptions(): BrowserWindowConstructorOptions {
  return {
    show: false,
    webPreferences: {
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      webSecurity: true,
      javascript: false,
      webviewTag: false,
    },
  };
}

/** In-page navigation is allowed only within the app origin (hash changes, reloads). */
export function isAllowedNavigation(url: string): boolean {
  // Not `new URL(url).origin`: for a custom scheme that is the string "null" in Node and Chromium.
  return url === APP_ORIGIN || url.startsWith(`${APP_ORIGIN}/`);
}

/** Every permission request (camera, geolocation, notifications, …) is refused. */
export function permissionDecision(_permission: string): false {
  return false;
}

/** URL schemes the shell lets a request reach; everything else (http, https, ws, ftp…) is cancelled. */
export function isAllowedRequest(url: string): boolean {
  return url.startsWith(`${APP_ORIGIN}/`) || url.startsWith('devtools://') || url.startsWith('data:') || url.startsWith('blob:');
}
