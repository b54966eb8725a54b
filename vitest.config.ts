import { defineConfig } from 'vitest/config';
import { svelte } from '@sveltejs/vite-plugin-svelte';

// The svelte() plugin stays here so runes in .svelte.ts files compile under test.
export default defineConfig({
  plugins: [svelte()],
  // The renderer's build identity (renderer/vite.config.ts); tests keep no results between runs.
  define: { __BUILD_ID__: JSON.stringify('unit-tests') },
  test: {
    include: ['unit/**/*.test.ts'],
    setupFiles: ['unit/setup.ts'],
    environment: 'node',
    testTimeout: 60_000,
    env: { TZ: 'UTC' },
  },
});
