// `meridian-ledger night --archive DIR` on a folder written by `meridian-ledger simulate`: the
// folder's own night weather and level readings enter the reduction (without them the zenith
// distances of transits that lack their own weather would carry no refraction).
import { spawnSync } from 'node:child_process';
import { mkdtemp, readFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';

let archive = '';
let night = '';

function cli(args: string[]) {
  const result = spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8' });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

beforeAll(async () => {
  archive = path.join(await mkdtemp(path.join(os.tmpdir(), 'ml-night-archive-')), 'archive');
  expect(cli(['simulate', '--seed', '11', '--years', '1', '--stars', '10', '--blunder-rate', '0', '--out', archive]).code).toBe(0);
  // The busiest night of the first year's log.
  const log = (await readFile(path.join(archive, 'transits', (await import('node:fs')).readdirSync(path.join(archive, 'transits'))[0]), 'utf8')).split('\n').slice(1);
  const counts = new Map<string, number>();
  for (const line of log) if (line) counts.set(line.split(',')[3], (counts.get(line.split(',')[3]) ?? 0) + 1);
  night = [...counts].sort((a, b) => b[1] - a[1])[0][0];
});

describe('meridian-ledger night --archive', () => {
  it('reduces a simulated night to residuals at the simulated noise level', () => {
    const result = cli(['night', '--archive', archive, '--night', night, '--json']);
    expect(result.code, result.stderr).toBe(0);
    const [report] = JSON.parse(result.stdout) as { unitWeightErrorZenithArcsec: number; unitWeightErrorTimeS: number; constants: { levelArcsec: { source: string } } }[];
    // The simulator's zenith-distance noise is 0.3″ per reading (core/simulate defaults); a missing
    // refraction would leave tens of arcseconds.
    expect(report.unitWeightErrorZenithArcsec).toBeLessThan(0.8);
    // Wire noise 0.03 s over ~6 wires: ~0.012 s per transit. Reducing with another UT1 − UTC than
    // the simulator observed with (0.1–0.2 s in 2021, IERS C04) left 0.035–0.045 s here.
    expect(report.unitWeightErrorTimeS).toBeLessThan(0.025);
    expect(report.constants.levelArcsec.source).toBe('fixed');
    expect(result.stderr).not.toMatch(/unknown key/);
  });
  it('refuses --site together with --archive', () => {
    const result = cli(['night', '--archive', archive, '--site', 'x.json']);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/--site goes with a transit log, not with --archive/);
  });
  it('recovers the simulated azimuth and collimation (truth.json) within 4 formal errors + 0.15″', async () => {
    const result = cli(['night', '--archive', archive, '--night', night, '--json']);
    type Fitted = { value: number; sigma: number | null };
    const [report] = JSON.parse(result.stdout) as { nightId?: string; constants: { azimuthArcsec: Fitted; collimationArcsec: Fitted } }[];
    const truth = JSON.parse(await readFile(path.join(archive, 'truth.json'), 'utf8')) as { nights: { nightId: string; azimuthArcsec: number; collimationArcsec: number }[] };
    const trueNight = truth.nights.find((n) => n.nightId === `night-${night}`)!;
    // 0.15″: the level b is fixed from noisy level readings (0.4″ each) and the catalogue carries errors.
    for (const [name, fitted, trueValue] of [['azimuth', report.constants.azimuthArcsec, trueNight.azimuthArcsec], ['collimation', report.constants.collimationArcsec, trueNight.collimationArcsec]] as const) {
      expect(fitted.sigma, name).not.toBeNull();
      expect(Math.abs(fitted.value - trueValue), `${name}: fitted ${fitted.value} ± ${fitted.sigma}, true ${trueValue}`).toBeLessThan(4 * fitted.sigma! + 0.15);
    }
  });
});
