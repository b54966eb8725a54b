// Instrument versus sky (DESIGN §4): a common-mode thermal drift injected by the simulator
// (thermal option, the same coefficient in both coordinates) must not move any star's parallax by
// more than 0.3σ when the temperature term is in the model; left out, the fit must show it: in the
// unit-weight error, in the common-mode periodogram's annual flag and on the stars' dial.
// Same seed with and without the drift: the noise is the same, so the difference is the leak.
import { beforeAll, describe, expect, it } from 'vitest';
import type { ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import { modelFor, simulatedInputs, solve } from './joint-helpers.ts';

let spreadArcsec = 0;
let withTerm: ArchiveSolveResult[] = [];
let without: ArchiveSolveResult, clean: ArchiveSolveResult;
beforeAll(async () => {
  const request = { seed: 21, years: 2, starCount: 8, blunderRate: 0 };
  const base = await simulatedInputs(request);
  const hot = await simulatedInputs({ ...request, thermal: { raArcsecPerC: 0.05, decArcsecPerC: 0.05 } });
  // The drift's annual size: 0.05″/°C times the spread of the nights' temperatures.
  const temperatures = hot.archive.nights.map((n) => n.weather!.temperatureC).sort((a, b) => a - b);
  spreadArcsec = 0.05 * (temperatures[Math.floor(0.95 * temperatures.length)] - temperatures[Math.floor(0.05 * temperatures.length)]);
  withTerm = [await solve(base.inputs, modelFor(base.archive, { robustIterations: 1, temperature: 'free' })), await solve(hot.inputs, modelFor(hot.archive, { robustIterations: 1, temperature: 'free' }))];
  // Left out explicitly: temperature is free by default when the archive records temperatures.
  without = await solve(hot.inputs, modelFor(hot.archive, { robustIterations: 1, temperature: 'absent' }));
  clean = await solve(base.inputs, modelFor(base.archive, { robustIterations: 1, temperature: 'absent' }));
}, 120_000);

describe('joint solve separates a common-mode thermal drift from parallax', () => {
  it('shifts no parallax by more than 0.3σ with the temperature term; without it the unit-weight error shows the signal', () => {
    expect(spreadArcsec, 'drift of about 0.5″ peak to peak between cold and warm nights').toBeGreaterThan(0.5);
    withTerm[1].stars.forEach((s, i) => {
      const shift = (s.parallaxMas! - withTerm[0].stars[i].parallaxMas!) / withTerm[0].stars[i].parallaxSigmaMas!;
      expect(Math.abs(shift), `${s.id} parallax shift in σ`).toBeLessThan(0.3);
    });
    expect(Math.abs(withTerm[1].global.temperatureRaArcsecPerC! - 0.05)).toBeLessThan(4 * withTerm[1].global.temperatureRaSigmaArcsecPerC!);
    console.log(`thermal drift ${spreadArcsec.toFixed(2)}″ (5–95 %): unit-weight error ${without.unitWeightError.toFixed(2)} without the term, ${clean.unitWeightError.toFixed(2)} without the drift`);
    expect(clean.unitWeightError).toBeLessThan(1.2);
    expect(without.unitWeightError).toBeGreaterThan(1.5);
  });

  it('signatures: the annual flag is raised only when the term is left out, and the stars then leave the aberration axis of the dial', () => {
    const flagged = (r: ArchiveSolveResult) => r.signatures.instruments.map((i) => i.annualSignalFlagged);
    expect(flagged(without), 'left out: annual peak flagged').toEqual([true]);
    expect(flagged(withTerm[1]), 'in model: no annual peak').toEqual([false]);
    expect(flagged(clean), 'no drift: no annual peak').toEqual([false]);
    const offAxis = (r: ArchiveSolveResult) => Math.max(...r.signatures.stars.map((s) => Math.abs(s.aberrationPhaseMas) / s.aberrationPhaseConditionalSigmaMas));
    console.log(`largest aberration-phase amplitude in conditional σ: ${offAxis(without).toFixed(1)} left out, ${offAxis(withTerm[1]).toFixed(1)} in model`);
    // Truth: Δκ = 0 in this archive, so the aberration amplitude should sit at 0.
    expect(offAxis(without)).toBeGreaterThan(5);
    expect(offAxis(withTerm[1])).toBeLessThan(4);
    // The dial's parallax amplitude is the star's solved parallax (its residuals are orthogonal to its own parallax column), within 0.3 of its σ.
    withTerm[1].signatures.stars.forEach((s, i) => expect(Math.abs(s.parallaxPhaseMas - withTerm[1].stars[i].parallaxMas!) / withTerm[1].stars[i].parallaxSigmaMas!, s.id).toBeLessThan(0.3));
    // Parallax-ellipse data: one factor pair per observation of the star.
    withTerm[1].signatures.stars.forEach((s, i) => expect(s.parallaxFactors.raFactor).toHaveLength(withTerm[1].stars[i].observations));
  });
});
