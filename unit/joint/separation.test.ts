// Instrument versus sky (DESIGN §4): a common-mode thermal drift injected by the simulator
// (thermal option, the same coefficient in both coordinates) must not move any star's parallax by
// more than 0.3σ when the temperature term is in the model; left out, the fit must show it.
// Same seed with and without the drift: the noise is the same, so the difference is the leak.
import { describe, expect, it } from 'vitest';
import { modelFor, simulatedInputs, solve } from './joint-helpers.ts';

describe('joint solve separates a common-mode thermal drift from parallax', () => {
  it('shifts no parallax by more than 0.3σ with the temperature term; without it the unit-weight error flags the signal', async () => {
    const request = { seed: 21, years: 2, starCount: 8, blunderRate: 0 };
    const base = await simulatedInputs(request);
    const hot = await simulatedInputs({ ...request, thermal: { raArcsecPerC: 0.05, decArcsecPerC: 0.05 } });
    // The drift's annual size: 0.05″/°C times the spread of the nights' temperatures.
    const temperatures = hot.archive.nights.map((n) => n.weather!.temperatureC).sort((a, b) => a - b);
    const spreadArcsec = 0.05 * (temperatures[Math.floor(0.95 * temperatures.length)] - temperatures[Math.floor(0.05 * temperatures.length)]);
    expect(spreadArcsec, 'drift of about 0.5″ peak to peak between cold and warm nights').toBeGreaterThan(0.5);
    const withTerm = [await solve(base.inputs, modelFor(base.archive, { robustIterations: 1, temperature: 'free' })), await solve(hot.inputs, modelFor(hot.archive, { robustIterations: 1, temperature: 'free' }))];
    withTerm[1].stars.forEach((s, i) => {
      const shift = (s.parallaxMas! - withTerm[0].stars[i].parallaxMas!) / withTerm[0].stars[i].parallaxSigmaMas!;
      expect(Math.abs(shift), `${s.id} parallax shift in σ`).toBeLessThan(0.3);
    });
    expect(Math.abs(withTerm[1].global.temperatureRaArcsecPerC! - 0.05)).toBeLessThan(4 * withTerm[1].global.temperatureRaSigmaArcsecPerC!);
    const without = await solve(hot.inputs, modelFor(hot.archive, { robustIterations: 1 }));
    const clean = await solve(base.inputs, modelFor(base.archive, { robustIterations: 1 }));
    console.log(`thermal drift ${spreadArcsec.toFixed(2)}″ (5–95 %): unit-weight error ${without.unitWeightError.toFixed(2)} without the term, ${clean.unitWeightError.toFixed(2)} without the drift`);
    expect(clean.unitWeightError).toBeLessThan(1.2);
    expect(without.unitWeightError).toBeGreaterThan(1.5);
  }, 120_000);
});
