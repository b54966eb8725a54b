// `npm run start:web`: serves the built renderer (dist/renderer) on 127.0.0.1 and prints the URL.
// Options: --port N (default 4317), --no-build (accepted for symmetry; npm script builds first).
import { preview } from 'vite';

const args = process.argv.slice(2);
let port = 4317;
for (let i = 0; i < args.length; i++) {
  const arg = args[i];
  if (arg === '--port') {
    port = Number(args[++i]);
    if (!Number.isInteger(port) || port < 1 || port > 65535) {
      console.error(`serve-web: --port needs a whole number from 1 to 65535, got "${args[i]}"`);
      process.exit(2);
    }
  } else if (arg !== '--no-build') {
    console.error(`serve-web: unknown option "${arg}" (options: --port N, --no-build)`);
    process.exit(2);
  }
}

const server = await preview({
  configFile: 'renderer/vite.config.ts',
  preview: { host: '127.0.0.1', port, strictPort: true, open: false },
});
const url = `http://127.0.0.1:${port}/`;
console.log(`Meridian Ledger (browser mode) is being served at ${url}`);
console.log('Press Ctrl+C to stop.');
const stop = () => server.httpServer.close(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
