import { defineConfig } from '@playwright/test';

// Debian's Chromium; Playwright never downloads a browser when executablePath is set.
export const CHROMIUM_EXECUTABLE = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
// E2E_PORT lets two runs on one machine use different ports.
export const WEB_PORT = Number(process.env.E2E_PORT ?? 4317);

export default defineConfig({
  testDir: 'e2e',
  outputDir: 'e2e-output/results',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  reporter: [['list']],
  use: {
    baseURL: `http://127.0.0.1:${WEB_PORT}/`,
    screenshot: 'only-on-failure',
    trace: 'off',
    timezoneId: 'UTC',
    launchOptions: { executablePath: CHROMIUM_EXECUTABLE, args: CHROMIUM_ARGS },
  },
  projects: [
    { name: 'chromium', testMatch: 'chromium/**/*.spec.ts' },
    // The lead's Electron specs launch Electron themselves (and skip when its binary is absent).
    { name: 'electron', testMatch: 'electron/**/*.spec.ts' },
  ],
  webServer: {
    // Serves the BUILT renderer (npm run test:e2e builds first) with vite's preview() API.
    command: `node main/scripts/serve-web.mjs --no-build --port ${WEB_PORT}`,
    url: `http://127.0.0.1:${WEB_PORT}/`,
    reuseExistingServer: false,
    timeout: 30_000,
    stdout: 'pipe',
  },
});
