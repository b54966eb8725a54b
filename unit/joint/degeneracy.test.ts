// Degeneracies the joint solve must report in words rather than hide (DESIGN §4), and archives it
// must refuse with a message rather than an exception from deep inside.
import { describe, expect, it } from 'vitest';
import { JointSolveRefused } from '../../core/joint/solve-archive.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';
import { modelFor, simulatedInputs, solve } from './joint-helpers.ts';

describe('joint solve: degeneracies and refusals', () => {
  it('names the season of a star seen in one short season each year, with its correlated parameters', async () => {
    const { archive, inputs } = await simulatedInputs({ seed: 12, years: 2, starCount: 8, blunderRate: 0 });
    // Keep one star only in February–April: its parallax and position then trade against each other.
    const inSeason = (mjd: number | null) => { const month = new Date((mjd! - 40587) * 86_400_000).getUTCMonth(); return month >= 1 && month <= 3; };
    const inSeasonCount = (id: string) => inputs.transits.filter((t) => t.starId === id && inSeason(t.nightDateMjd)).length;
    const starId = [...inputs.stars].sort((a, b) => inSeasonCount(b.id) - inSeasonCount(a.id))[0].id;
    expect(inSeasonCount(starId)).toBeGreaterThan(5);
    const cut: SolveInputs = { ...inputs, transits: inputs.transits.filter((t) => t.starId !== starId || inSeason(t.nightDateMjd)) };
    const result = await solve(cut, modelFor(archive, { robustIterations: 1, catalogueSigma: { default: null, stars: {} } }));
    const sentence = result.degeneracies.find((d) => d.includes(`star ${starId}: seen only in`));
    expect(sentence, result.degeneracies.join('\n')).toBeDefined();
    expect(sentence).toMatch(/condition index \d+/);
    expect(sentence).toMatch(/(January|February|March)[–a-z ]*(March|April|May| only)/);
    for (const s of result.stars) expect(Number.isFinite(s.parallaxMas!) && Number.isFinite(s.parallaxSigmaMas!)).toBe(true);
  }, 60_000);

  it('refuses a single-night archive and a single-star archive with a message saying why', async () => {
    const { archive, inputs } = await simulatedInputs({ seed: 13, years: 1, starCount: 6, blunderRate: 0, nightsPerYearTarget: 20 });
    const firstNight = inputs.transits[0].nightDateMjd;
    const oneNight: SolveInputs = { ...inputs, transits: inputs.transits.filter((t) => t.nightDateMjd === firstNight) };
    await expect(solve(oneNight, modelFor(archive))).rejects.toThrow(JointSolveRefused);
    await expect(solve(oneNight, modelFor(archive))).rejects.toThrow(/at least two nights/);
    const oneStar: SolveInputs = { ...inputs, transits: inputs.transits.filter((t) => t.starId === inputs.stars[1].id) };
    await expect(solve(oneStar, modelFor(archive))).rejects.toThrow(/(at least two stars|reducible night)/);
  }, 60_000);
});
