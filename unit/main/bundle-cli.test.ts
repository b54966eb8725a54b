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

function cli(args: string[]) {
  const result = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

async function filesUnder(dir: string): Promise<Map<string, string>> {
  const { readArchiveFolderFiles } = await import('../../main/archive/archive-folder-files.ts');
  const files = await readArchiveFolderFiles(dir);
  return new Map([...files].map(([name, bytes]) => [name, Buffer.from(bytes).toString('base64')]));
}

describe('meridian-ledger bundle pack / unpack', () => {
  it('simulate → pack → check → unpack reproduces every file byte for byte', async () => {
    const archive = path.join(folder, 'sim');
    expect(cli(['simulate', '--seed', '3', '--years', '1', '--stars', '6', '--out', archive]).code).toBe(0);
    const bundle = path.join(folder, 'sim.mlbundle');
    const packed = cli(['bundle', 'pack', archive, '--out', bundle]);
    expect(packed.code, packed.stderr).toBe(0);
    const checked = JSON.parse(cli(['bundle', 'check', bundle, '--json']).stdout) as { tables: Record<string, number> };
    expect(checked.tables.stars).toBe(6);
    expect(checked.tables.transits).toBeGreaterThan(50);
    const back = path.join(folder, 'sim-back');
    expect(cli(['bundle', 'unpack', bundle, '--out', back]).code).toBe(0);
    const [original, restored] = [await filesUnder(archive), await filesUnder(back)];
    expect([...restored.keys()].sort()).toEqual([...original.keys()].sort());
    for (const [name, content] of original) expect(restored.get(name), name).toBe(content);
    // A second unpack into the now non-empty folder is refused without --force.
    const again = cli(['bundle', 'unpack', bundle, '--out', back]);
    expect(again.code).toBe(1);
    expect(again.stderr).toMatch(/not empty/);
  });
  it('a folder with a bad row is not packed, and the row is named', async () => {
    const archive = path.join(folder, 'sim-bad');
    expect(cli(['simulate', '--seed', '4', '--years', '1', '--stars', '4', '--out', archive]).code).toBe(0);
    const starsFile = path.join(archive, 'stars.csv');
    const lines = (await readFile(starsFile, 'utf8')).split('\n');
    const header = lines[0].split(',');
    const decColumn = header.indexOf('decDeg');
    const cells = lines[2].split(',');
    cells[decColumn] = '95.5';
    lines[2] = cells.join(',');
    await writeFile(starsFile, lines.join('\n'));
    const bundle = path.join(folder, 'bad.mlbundle');
    const result = cli(['bundle', 'pack', archive, '--out', bundle]);
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/stars\.csv: row 2 \(line 3\), column decDeg/);
    await expect(readFile(bundle)).rejects.toThrow();
  });
});
