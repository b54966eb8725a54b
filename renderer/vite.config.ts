import { defineConfig, type Plugin } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';

/**
 * The dev server injects component styles as <style> elements, which the page's policy refuses;
 * allow inline styles in `vite serve` only. Built files keep the strict policy of index.html.
 */
function relaxStylePolicyInDev(): Plugin {
  return {
    name: 'meridian-ledger:dev-style-policy',
    apply: 'serve',
    transformIndexHtml: (html) => html.replace("style-src 'self'", "style-src 'self' 'unsafe-inline'"),
  };
}

/**
 * The package version for the About line. npm and npx set npm_package_version from package.json
 * (this file may not import package.json: the layering rule keeps renderer/ to renderer/ and core/).
 * Only a build needs it; `vite preview` serves files already built.
 */
function appVersion(command: 'build' | 'serve', isPreview: boolean): string {
  const version = process.env.npm_package_version;
  if (version !== undefined) return version;
  if (command === 'serve' && isPreview) return 'preview';
  throw new Error(
    'renderer/vite.config.ts: npm_package_version is not set, so the app version is unknown. ' +
      'Build with `npm run build:renderer` (or `npx vite build --config renderer/vite.config.ts`).',
  );
}

/**
 * An identity of this build: results the app keeps between launches outside the archive (the
 * overview's nightly unit-weight errors) are reused only by the build that computed them, so a
 * new build never shows a result an older reduction made. The build's start time serves (no file
 * or Node module may be read here: the layering rule keeps renderer/ to renderer/ and core/).
 */
const BUILD_ID = new Date().toISOString();

// Paths are relative to the repository root, where every npm script and serve-web.mjs run.
export default defineConfig(({ command, isPreview }) => ({
  root: 'renderer',
  base: './',
  plugins: [svelte(), relaxStylePolicyInDev()],
  define: { __APP_VERSION__: JSON.stringify(appVersion(command, isPreview === true)), __BUILD_ID__: JSON.stringify(BUILD_ID) },
  worker: { format: 'es' },
  build: {
    // RENDERER_OUT_DIR (absolute) lets parallel e2e runs on one machine build and serve apart.
    outDir: process.env.RENDERER_OUT_DIR ?? '../dist/renderer',
    emptyOutDir: true,
    target: 'es2022',
    // No inline data: assets: every file comes from 'self'.
    assetsInlineLimit: 0,
  },
}));
