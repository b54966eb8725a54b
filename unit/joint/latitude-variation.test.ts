// Latitude variation (SOLVE.md "latitudeVariation"): the simulator plants a 433-day variation of the
// site's latitude, Δφ(t) = A cos(2π (t − t_start)/433 d) (core/simulate, truth.json), common to all
// stars; the joint solve's cos/sin pair at 433 d must recover it (each coefficient within 3σ of
// A cos(ω t_start), A sin(ω t_start), t in days from J2000.0) and find none where none was planted.
import { beforeAll, describe, expect, it } from 'vitest';
import { startDateMjd } from '../../core/simulate/simulation-options.ts';
import type { ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import { modelFor, simulatedInputs, solve } from './joint-helpers.ts';

const AMPLITUDE_ARCSEC = 0.3;
let planted: ArchiveSolveResult, leftOut: ArchiveSolveResult, none: ArchiveSolveResult, startMjd: number;

beforeAll(async () => {
  const request = { seed: 71, years: 2, starCount: 10, blunderRate: 0, startDate: '2021-01-01' };
  startMjd = startDateMjd(request.startDate);
  const hot = await simulatedInputs({ ...request, latitudeVariationArcsec: AMPLITUDE_ARCSEC });
  const cold = await simulatedInputs(request);
  planted = await solve(hot.inputs, modelFor(hot.archive, { robustIterations: 1, latitudeVariation: 'free' }));
  leftOut = await solve(hot.inputs, modelFor(hot.archive, { robustIterations: 1 }));
  none = await solve(cold.inputs, modelFor(cold.archive, { robustIterations: 1, latitudeVariation: 'free' }));
}, 200_000);

describe('latitude variation common to all stars (433-day cos/sin pair)', () => {
  it('recovers a planted 0.3″ variation within 3σ in both coefficients', () => {
    const [term] = planted.latitudeVariation;
    const omega = (2 * Math.PI) / 433, t0 = startMjd - 51544.5;
    const cosTrue = AMPLITUDE_ARCSEC * Math.cos(omega * t0), sinTrue = AMPLITUDE_ARCSEC * Math.sin(omega * t0);
    console.log(`latitude variation: cos ${term.cosArcsec.toFixed(3)} ± ${term.cosSigmaArcsec.toFixed(3)} (truth ${cosTrue.toFixed(3)}), sin ${term.sinArcsec.toFixed(3)} ± ${term.sinSigmaArcsec.toFixed(3)} (truth ${sinTrue.toFixed(3)}), amplitude ${term.amplitudeArcsec.toFixed(3)} ± ${term.amplitudeSigmaArcsec.toFixed(3)}`);
    expect(term.periodDays).toBe(433);
    expect(Math.abs(term.cosArcsec - cosTrue)).toBeLessThan(3 * term.cosSigmaArcsec);
    expect(Math.abs(term.sinArcsec - sinTrue)).toBeLessThan(3 * term.sinSigmaArcsec);
    expect(term.amplitudeSigmaArcsec, 'measurable: σ well under the amplitude').toBeLessThan(AMPLITUDE_ARCSEC / 5);
  });

  it('left out, the variation shows in the unit-weight error; not planted, the pair is consistent with zero', () => {
    console.log(`unit-weight error: with the term ${planted.unitWeightError.toFixed(3)}, left out ${leftOut.unitWeightError.toFixed(3)}`);
    expect(leftOut.latitudeVariation).toEqual([]);
    expect(leftOut.unitWeightError).toBeGreaterThan(planted.unitWeightError + 0.02);
    const [term] = none.latitudeVariation;
    expect(Math.abs(term.cosArcsec)).toBeLessThan(3 * term.cosSigmaArcsec);
    expect(Math.abs(term.sinArcsec)).toBeLessThan(3 * term.sinSigmaArcsec);
  });
});
