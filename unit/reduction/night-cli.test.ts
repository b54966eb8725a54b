// `meridian-ledger night` through the real bin (node main/cli/bin.mjs) on files written to a temp folder.
import { spawnSync } from 'node:child_process';
import { mkdtemp, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { clockCsv, simulateNight, SITE_JSON, STAR_CSV, transitLogCsv, TRUTH } from './forward-night.ts';

let folder = '';
const file = (name: string): string => path.join(folder, name);

function night(...args: string[]) {
  const result = spawnSync(process.execPath, ['main/cli/bin.mjs', 'night', ...args], { encoding: 'utf8', env: { ...process.env, TZ: 'UTC' } });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

beforeAll(async () => {
  folder = await mkdtemp(path.join(os.tmpdir(), 'ml-night-cli-'));
  await writeFile(file('site.json'), SITE_JSON);
  await writeFile(file('stars.csv'), STAR_CSV);
  await writeFile(file('log.csv'), transitLogCsv(simulateNight(4, TRUTH, 0.01, 0.1)));
  await writeFile(file('clock.csv'), clockCsv([64_800, 75_600, 90_000, 100_800], TRUTH, 0.001, 4));
  const lines = transitLogCsv(simulateNight(5, TRUTH, 0.01, 0.1)).trimEnd().split('\n');
  const bad = [...lines];
  bad[2] = bad[2].replace(/^LK-02,/, 'LK-99,'); // unknown star (row 2, starId)
  bad[3] = bad[3].replace(/,(\d+\.\d+),/, ',7.5x,'); // bad number in the first wire column (row 3)
  bad.push(lines[1]); // duplicate of row 1 (row 15)
  await writeFile(file('bad.csv'), `${bad.join('\n')}\n`);
});

describe('meridian-ledger night', () => {
  it('prints the report: clock terms, constants with errors, the O−C table (text)', () => {
    const r = night('--site', file('site.json'), '--stars', file('stars.csv'), '--clock', file('clock.csv'), '--fix', `levelArcsec=${TRUTH.levelArcsec}`, file('log.csv'));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Night 2021-11-20 — instrument tr-2 — 14 transits/);
    expect(r.stdout).toMatch(/Clock comparisons: 4/);
    expect(r.stdout).toMatch(/azimuth a\s+11\.\d{3} ″\s+±/);
    expect(r.stdout).toMatch(/LK-13\s+lower/);
  });

  it('--json carries every intermediate value and recovers the clock rate from the comparisons', () => {
    const r = night('--site', file('site.json'), '--stars', file('stars.csv'), '--clock', file('clock.csv'), '--night', '2021-11-20', '--fix', `levelArcsec=${TRUTH.levelArcsec}`, '--json', file('log.csv'));
    expect(r.code).toBe(0);
    const [result] = JSON.parse(r.stdout) as { nightDate: string; constants: Record<string, { value: number; sigma: number | null; source: string }>; transits: Record<string, unknown>[] }[];
    expect(result.nightDate).toBe('2021-11-20');
    expect(result.constants.clockRateSPerDay.source).toBe('readings');
    // Comparisons with 1 ms noise over 10 h: the rate to ~0.005 s/day.
    expect(Math.abs(result.constants.clockRateSPerDay.value - TRUTH.clockRateSPerDay)).toBeLessThan(0.02);
    expect(Object.keys(result.transits[0])).toEqual(expect.arrayContaining(['meanWireReadingS', 'clockCorrectionS', 'mayer', 'predictedUtcS', 'zenith', 'ocTimeS', 'hints']));
  });

  it('--csv prints one line per transit', () => {
    const r = night('--site', file('site.json'), '--stars', file('stars.csv'), '--csv', file('log.csv'));
    expect(r.code).toBe(0);
    expect(r.stdout.trimEnd().split('\n')).toHaveLength(15);
  });

  it('lists bad numbers, an unknown star and a duplicate with row and column, and exits 1 without a report', () => {
    const r = night('--site', file('site.json'), '--stars', file('stars.csv'), file('bad.csv'));
    expect(r.code).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/bad\.csv: row 2 \(line 3\), column starId: unknown star id 'LK-99'/);
    expect(r.stderr).toMatch(/bad\.csv: row 3 \(line 4\), column wire1ClockS: '7\.5x' is not a number/);
    expect(r.stderr).toMatch(/bad\.csv: row 15 \(line 16\), column starId: duplicate of row 1/);
    expect(r.stderr).toMatch(/nothing was reduced/);
  });

  it('rejects a clock time outside its night (row 4 written a day early) and exits 1', async () => {
    const lines = transitLogCsv(simulateNight(6, TRUTH, 0.01, 0.1)).trimEnd().split('\n');
    const cells = lines[4].split(',');
    for (let k = 6; k < 11; k++) cells[k] = (Number(cells[k]) - 86_400).toFixed(4);
    lines[4] = cells.join(',');
    await writeFile(file('late.csv'), `${lines.join('\n')}\n`);
    const r = night('--site', file('site.json'), '--stars', file('stars.csv'), file('late.csv'));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/late\.csv: row 4 \(line 5\), column wire1ClockS: time is outside the night/);
  });

  it('exits 2 on usage errors', () => {
    expect(night('--stars', file('stars.csv'), file('log.csv')).code).toBe(2);
    expect(night('--site', file('site.json'), '--stars', file('stars.csv'), '--fix', 'tilt=3', file('log.csv')).code).toBe(2);
    expect(night('--site', file('site.json'), '--stars', file('stars.csv'), '--json', '--csv', file('log.csv')).code).toBe(2);
  });
});
