// `meridian-ledger solve` through the real bin (node main/cli/bin.mjs) on a folder the real
// `meridian-ledger simulate` wrote: the JSON contract, the text report and the exit statuses.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const run = (args: string[]) => spawnSync(process.execPath, ['main/cli/bin.mjs', ...args], { encoding: 'utf8', env: { ...process.env, TZ: 'UTC' } });
let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'ml-solve-'));
  const made = run(['simulate', '--out', join(dir, 'archive'), '--seed', '5', '--years', '2', '--stars', '8', '--blunder-rate', '0']);
  expect(made.status, made.stderr).toBe(0);
}, 60_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('meridian-ledger solve', () => {
  it('--json prints absolute parallax and proper motion per star, Δκ, the unit-weight error and the degeneracies', () => {
    const result = run(['solve', join(dir, 'archive'), '--json']);
    expect(result.status, result.stderr).toBe(0);
    expect(result.stderr).toMatch(/nightly reduction/);
    const out = JSON.parse(result.stdout);
    expect(out.stars).toHaveLength(8);
    for (const s of out.stars) {
      for (const key of ['parallaxMas', 'parallaxSigmaMas', 'pmRaMasYr', 'pmRaSigmaMasYr', 'pmDecMasYr', 'pmDecSigmaMasYr']) expect(Number.isFinite(s[key]), `${s.id} ${key}`).toBe(true);
      expect(s.parallaxSigmaMas).toBeGreaterThan(0);
    }
    expect(Number.isFinite(out.global.deltaKappaArcsec) && out.global.deltaKappaSigmaArcsec > 0).toBe(true);
    expect(out.unitWeightError).toBeGreaterThan(0.5);
    expect(Array.isArray(out.degeneracies)).toBe(true);
    expect(out.chiSquare / out.degreesOfFreedom).toBeCloseTo(out.unitWeightError ** 2, 6);
    expect(out.correlation.matrix).toHaveLength(out.correlation.names.length);
    expect(out.instrumentSeries).toHaveLength(out.nights.length);
    expect(out.signatures.stars).toHaveLength(8);
    expect(typeof out.signatures.instruments[0].annualSignalFlagged).toBe('boolean');
    expect(out.residuals, 'residuals only with --residuals').toBeUndefined();
  }, 60_000);

  it('--model with the new terms: segments, latitude variation, variance components and a held diurnal scale in the JSON and the text report', () => {
    const model = join(dir, 'terms.json');
    writeFileSync(model, JSON.stringify({ termSpan: { zeroPoint: 'per-segment-drift' }, latitudeVariation: 'free', diurnalAberrationScale: 'free', varianceComponents: true }));
    const result = run(['solve', join(dir, 'archive'), '--json', '--model', model]);
    expect(result.status, result.stderr).toBe(0);
    const out = JSON.parse(result.stdout);
    const zero = out.segments.filter((s: { term: string }) => s.term === 'zeroPoint');
    expect(zero.length, 'one zero-point segment per stretch between the simulated events').toBeGreaterThan(0);
    expect(zero.every((s: { valueSigma: number; driftSigmaPerYear: number }) => s.valueSigma > 0 && s.driftSigmaPerYear > 0)).toBe(true);
    expect(out.latitudeVariation).toHaveLength(1);
    expect(out.latitudeVariation[0].periodDays).toBe(433);
    expect(out.global.diurnalAberrationScale, 'held: the folder has one clamp').toBeNull();
    expect(out.degeneracies.join(' ')).toMatch(/diurnal-aberration scale: .*cannot be told from collimation/);
    expect(out.varianceComponents.stars).toHaveLength(8);
    expect(out.global.temperatureRaArcsecPerC, 'temperature free by default').not.toBeNull();
    const text = run(['solve', join(dir, 'archive'), '--model', model]);
    expect(text.status, text.stderr).toBe(0);
    expect(text.stdout).toMatch(/latitude variation 433 d: cos/);
    expect(text.stdout).toMatch(/instrument-\S+ zeroPoint 1 \(start – MJD/);
    expect(text.stdout).toMatch(/Variance components \(\d+ passes/);
    writeFileSync(model, JSON.stringify({ termSpan: { clockOffset: 'per-segment', collimation: 'weekly' } }));
    const refused = run(['solve', join(dir, 'archive'), '--model', model]);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/termSpan.clockOffset: not an instrument term that can span segments/);
    expect(refused.stderr).toMatch(/termSpan.collimation must be "per-night", "per-segment", "per-segment-drift"/);
  }, 120_000);

  it('--json --residuals adds one row per transit with residual, weight and flag; --residuals alone is a usage error', () => {
    const result = run(['solve', join(dir, 'archive'), '--json', '--residuals']);
    expect(result.status, result.stderr).toBe(0);
    const out = JSON.parse(result.stdout);
    const transits = out.stars.reduce((s: number, star: { observations: number }) => s + star.observations, 0);
    expect(out.residuals).toHaveLength(transits);
    expect(Number.isFinite(out.residuals[0].ra.residualMas) && out.residuals[0].ra.weight >= 0).toBe(true);
    expect(run(['solve', join(dir, 'archive'), '--residuals']).status).toBe(2);
  }, 60_000);

  it('--compare temperature prints the F-test and BIC; an unknown term is a usage error', () => {
    const result = run(['solve', join(dir, 'archive'), '--compare', 'temperature', '--json']);
    expect(result.status, result.stderr).toBe(0);
    const out = JSON.parse(result.stdout);
    expect(out.term).toBe('temperature');
    expect(out.fTest.numeratorDegrees).toBe(2);
    // No thermal drift in this simulated archive: the term should not be significant (common practice: p ≥ 0.01).
    expect(out.fTest.pValue).toBeGreaterThan(0.01);
    expect(run(['solve', join(dir, 'archive'), '--compare']).status).toBe(2);
    expect(run(['solve', join(dir, 'archive'), '--compare', 'weather']).stderr).toMatch(/--compare needs one of/);
  }, 60_000);

  it('--cross-validate --json gives per star the parallax of each left-out year, the spread, the largest shift and the flag', () => {
    const result = run(['solve', join(dir, 'archive'), '--cross-validate', '--json']);
    expect(result.status, result.stderr).toBe(0);
    expect(result.stderr).toMatch(/fold 2 of 2 \(without 2022\) solved/);
    const out = JSON.parse(result.stdout);
    // The simulator starts on 2021-01-01 and this archive spans two years (simulation-options.ts).
    expect(out.years).toEqual([2021, 2022]);
    expect(out.flagSigma).toBe(3);
    expect(out.stars).toHaveLength(8);
    for (const s of out.stars) {
      expect(s.folds.map((f: { year: number }) => f.year)).toEqual([2021, 2022]);
      for (const f of s.folds) expect(f.parallaxSigmaMas, `${s.id} ${f.year}`).toBeGreaterThan(s.fullParallaxSigmaMas);
      expect(s.spreadMas).toBeGreaterThanOrEqual(0);
      // A clean simulated archive: no year pulls a parallax (common practice: 3σ).
      expect(s.flagged, `${s.id} at ${s.maxShiftDifferenceSigma}σ`).toBe(false);
    }
    const text = run(['solve', join(dir, 'archive'), '--cross-validate']);
    expect(text.status, text.stderr).toBe(0);
    expect(text.stdout).toMatch(/^ML-001 /m);
    expect(text.stdout).toMatch(/No star flagged/);
    expect(run(['solve', join(dir, 'archive'), '--cross-validate', '--compare', 'flexure']).status).toBe(2);
  }, 120_000);

  it('without --json prints a readable report with a line per star', () => {
    const result = run(['solve', join(dir, 'archive')]);
    expect(result.status, result.stderr).toBe(0);
    expect(result.stdout).toMatch(/unit-weight error/);
    expect(result.stdout).toMatch(/^ML-001 /m);
  }, 60_000);

  it('exits 2 on a usage error and 1 on a bad folder or model file, naming the problem', () => {
    const usage = run(['solve']);
    expect(usage.status).toBe(2);
    expect(run(['solve', join(dir, 'archive'), '--bogus']).status).toBe(2);
    const missing = run(['solve', join(dir, 'nowhere'), '--json']);
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/is not a folder/);
    writeFileSync(join(dir, 'model.json'), '{"parallax": "sometimes", "colour": 3}');
    const badModel = run(['solve', join(dir, 'archive'), '--model', join(dir, 'model.json')]);
    expect(badModel.status).toBe(1);
    expect(badModel.stderr).toMatch(/"parallax" must be "free", "fixed" or "absent"/);
    expect(badModel.stderr).toMatch(/unknown model key "colour"/);
  }, 60_000);
});
