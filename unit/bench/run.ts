// `npm run bench`: runs every unit/bench/*.bench.ts in name order. Each file exports
// `run(): Promise<void>` that prints its own figures (medians); no file asserts timings.
import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { join } from 'node:path';

const folder = fileURLToPath(new URL('.', import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(folder)
  .filter((name) => name.endsWith('.bench.ts'))
  .filter((name) => only.length === 0 || only.some((part) => name.includes(part)))
  .sort();
let failures = 0;
for (const name of files) {
  const module: unknown = await import(pathToFileURL(join(folder, name)).href);
  const run = typeof module === 'object' && module !== null && 'run' in module ? module.run : undefined;
  console.log(`\n== ${name}`);
  if (typeof run !== 'function') {
    console.log(`   skipped: ${name} exports no run(); export \`async function run(): Promise<void>\` to be listed here`);
    continue;
  }
  try {
    await (run as () => Promise<void>)();
  } catch (error) {
    failures++;
    console.log(`   failed: ${error instanceof Error ? error.message : String(error)}`);
  }
}
if (files.length === 0) console.log('no unit/bench/*.bench.ts files found');
process.exitCode = failures > 0 ? 1 : 0;
