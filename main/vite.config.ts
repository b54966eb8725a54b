import { builtinModules } from 'node:module';
import { defineConfig } from 'vite';

// Builds the Electron main process as one ES module in dist/main; Electron and Node built-ins stay external.
const external = ['electron', ...builtinModules, ...builtinModules.map((name) => `node:${name}`)];

export default defineConfig({
  build: {
    ssr: true,
    outDir: 'dist/main',
    emptyOutDir: false,
    target: 'node20',
    minify: false,
    sourcemap: true,
    rolldownOptions: {
      input: { main: 'main/electron/main.ts' },
      external,
      output: { format: 'es', entryFileNames: '[name].js' },
    },
  },
});
