// `meridian-ledger simulate` through the real bin: the command-line contract other tools rely on.
import { spawnSync } from 'node:child_process';
import { mkdtemp, readdir, readFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

let root = '';
function simulate(...args: string[]) {
  const result = spawnSync(process.execPath, ['main/cli/bin.mjs', 'simulate', ...args], { encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}
async function folderText(dir: string): Promise<Map<string, string>> {
  const out = new Map<string, string>();
  for (const name of (await readdir(dir, { recursive: true })).sort()) {
    const file = path.join(dir, name);
    if (name.endsWith('.csv') || name.endsWith('.json')) out.set(name, await readFile(file, 'utf8'));
  }
  return out;
}

beforeAll(async () => {
  root = await mkdtemp(path.join(os.tmpdir(), 'ml-simulate-cli-'));
});

describe('meridian-ledger simulate', () => {
  it('writes the archive and truth.json with the promised keys; the same seed gives the same files', async () => {
    const a = path.join(root, 'a'), b = path.join(root, 'b'), c = path.join(root, 'c');
    for (const [dir, seed] of [[a, '8'], [b, '8'], [c, '9']]) {
      const result = simulate('--seed', seed, '--years', '1', '--stars', '10', '--out', dir);
      expect(result.code, result.stderr).toBe(0);
      expect(result.stderr).toMatch(/night \d+ of \d+/);
      expect(result.stdout).toBe('');
    }
    const first = await folderText(a), second = await folderText(b), other = await folderText(c);
    expect([...first.keys()]).toContain('transits/2021.csv');
    expect(second).toEqual(first);
    expect(other.get('transits/2021.csv')).not.toBe(first.get('transits/2021.csv'));
    const truth = JSON.parse(first.get('truth.json')!);
    expect(truth.global.deltaKappaArcsec).toBe(0);
    expect(truth.stars).toHaveLength(10);
    for (const star of truth.stars) {
      expect(typeof star.id).toBe('string');
      for (const key of ['parallaxMas', 'pmRaMasYr', 'pmDecMasYr']) expect(Number.isFinite(star[key])).toBe(true);
    }
    // The star list carries catalogue values, not the truth.
    const starList = first.get('stars.csv')!.split('\n')[1].split(',');
    expect(Number(starList[7])).not.toBe(truth.stars[0].parallaxMas);
  });

  it('refuses a non-empty folder unless --force, and exits 2 on bad arguments with the reason', async () => {
    const dir = path.join(root, 'busy');
    expect(simulate('--years', '1', '--stars', '6', '--out', dir).code).toBe(0);
    const again = simulate('--years', '1', '--stars', '6', '--out', dir);
    expect(again.code).toBe(2);
    expect(again.stderr).toMatch(/not empty.*--force/);
    expect(simulate('--years', '1', '--stars', '6', '--seed', '2', '--out', dir, '--force').code).toBe(0);
    const cases: [string[], RegExp][] = [
      [['--years', '1'], /--out DIR is required/],
      [['--years', '0', '--out', path.join(root, 'x')], /years must be an integer in 1…50/],
      [['--stars', 'many', '--out', path.join(root, 'x')], /--stars takes a number/],
      [['--colour', 'red', '--out', path.join(root, 'x')], /unknown argument "--colour"/],
      [['--out'], /--out needs a value/],
    ];
    for (const [args, reason] of cases) {
      const result = simulate(...args);
      expect(result.code, args.join(' ')).toBe(2);
      expect(result.stderr).toMatch(reason);
    }
  });
});
