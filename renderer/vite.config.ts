import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { defineConfig, type Plugin } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';

const rendererRoot = fileURLToPath(new URL('.', import.meta.url));
const packageJson = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string };

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

export default defineConfig({
  root: rendererRoot,
  base: './',
  plugins: [svelte(), relaxStylePolicyInDev()],
  define: { __APP_VERSION__: JSON.stringify(packageJson.version) },
  worker: { format: 'es' },
  build: {
    outDir: '../dist/renderer',
    emptyOutDir: true,
    target: 'es2022',
    // No inline data: assets: every file comes from 'self'.
    assetsInlineLimit: 0,
  },
});
