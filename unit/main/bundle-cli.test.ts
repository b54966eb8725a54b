// `meridian-ledger bundle check` on good, damaged, truncated and foreign files, through the real bin.
import { spawnSync } from 'node:child_process';
import { mkdtemp, readFile, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { gunzipSync, gzipSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { writeBundleFile } from '../../main/archive/bundle-file.ts';

let folder = '';
let good = '';

function check(file: string, json = false) {
  const result = spawnSync(process.execPath, ['main/cli/bin.mjs', 'bundle', 'check', file, ...(json ? ['--json'] : [])], { encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

beforeAll(async () => {
  folder = await mkdtemp(path.join(os.tmpdir(), 'ml-bundle-cli-'));
  good = path.join(folder, 'good.mlbundle');
  const writer = new BundleWriter({ schemaVersion: 1, createdUtc: '2026-12-01T00:00:00.000Z', producer: 'unit test' });
  const lines = [writer.start(), writer.beginTable('stars')];
  for (let i = 0; i < 50; i++) lines.push(writer.row({ id: `star-${i}`, raDeg: i * 7.2, decDeg: 10 + i / 3 }));
  lines.push(writer.beginTable('transits'));
  for (let i = 0; i < 500; i++) lines.push(writer.row({ id: `t-${i}`, starId: `star-${i % 50}`, clockMjd: 60000 + i / 97 }));
  lines.push(writer.finish());
  await writeBundleFile(good, lines);
});

describe('meridian-ledger bundle check', () => {
  it('prints the counts per table for a good bundle', () => {
    const result = check(good, true);
    expect(result.code).toBe(0);
    const report = JSON.parse(result.stdout) as { ok: boolean; tables: Record<string, number> };
    expect(report).toMatchObject({ ok: true, tables: { stars: 50, transits: 500 } });
  });
  it('names the damaged table', async () => {
    const text = gunzipSync(await readFile(good)).toString('utf8').replace('"raDeg":36', '"raDeg":37');
    const damaged = path.join(folder, 'damaged.mlbundle');
    await writeFile(damaged, gzipSync(text));
    const result = check(damaged);
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/table "stars" is damaged/);
  });
  it('refuses a truncated file', async () => {
    const bytes = await readFile(good);
    const truncated = path.join(folder, 'truncated.mlbundle');
    await writeFile(truncated, bytes.subarray(0, Math.floor(bytes.length / 2)));
    const result = check(truncated);
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/truncated|damaged/);
  });
  it('refuses a foreign file', async () => {
    const foreign = path.join(folder, 'foreign.csv');
    await writeFile(foreign, 'id,raDeg\n');
    const result = check(foreign);
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/not a Meridian Ledger bundle \(not gzip-compressed\)/);
  });
  it('a missing file and a missing argument are reported', () => {
    expect(check(path.join(folder, 'nope.mlbundle')).stderr).toMatch(/no such file/);
    const usage = spawnSync(process.execPath, ['main/cli/bin.mjs', 'bundle', 'check'], { encoding: 'utf8' });
    expect(usage.status).toBe(2);
  });
});
