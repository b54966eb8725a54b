import { defineConfig } from 'vite';

// Builds the preload as CommonJS (.cjs): sandboxed preloads cannot be ES modules.
export default defineConfig({
  build: {
    ssr: true,
    outDir: 'dist/main',
    emptyOutDir: false,
    target: 'node20',
    minify: false,
    rolldownOptions: {
      input: { preload: 'main/preload.ts' },
      external: ['electron'],
      output: { format: 'cjs', entryFileNames: '[name].cjs' },
    },
  },
});
