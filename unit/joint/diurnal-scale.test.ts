// Diurnal-aberration scale (SOLVE.md "diurnalAberrationScale"). In right ascension the diurnal
// aberration is a constant 0.32″ cos φ toward the east point on the meridian (Explanatory Supplement
// to the Astronomical Almanac, 1992, §3.26, from memory) and collimation a constant shift of the line
// of sight: at lower culmination both change sign (Mayer's C = sec(180° − δ) = −sec δ; Chauvenet,
// vol. II), so only a clamp reversal, which turns c and not the aberration, separates them. Synthetic
// O − C on a simulated archive's geometry (synthetic-observations.ts): (a) one clamp position with
// upper and lower culminations: the degeneracy is reported in words, the scale held (not NaN);
// (b) half of each night's transits with the clamp east: a planted scale correction of +0.5 is
// recovered within 3σ.
import { beforeAll, describe, expect, it } from 'vitest';
import { diurnalAberrationMas } from '../../core/joint/common-terms.ts';
import { solvePrepared, type ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { SeededRandom } from '../../core/simulate/seeded-random.ts';
import { DEG } from '../../core/units.ts';
import { preparedGeometry, withSyntheticOc } from './synthetic-observations.ts';

const SCALE = 0.5;
let oneClamp: ArchiveSolveResult, reversed: ArchiveSolveResult, lowerCount = 0, diurnalMas = 0;

beforeAll(async () => {
  const { prepared, model } = await preparedGeometry({ seed: 81, years: 2, starCount: 10, blunderRate: 0 });
  diurnalMas = diurnalAberrationMas(prepared.site!.latitudeRad, prepared.site!.heightM);
  lowerCount = prepared.observations.filter((o) => o.culmination === 'lower').length;
  const nightC = new SeededRandom(5).fork('c');
  const cMas = prepared.nights.map(() => nightC.normal(0, 500));
  // The planted signal, from the geometry stated in the header: collimation −cos δ·C·c, aberration ±d·scale.
  const signal = (o: (typeof prepared.observations)[number]) => -o.cosDec * o.mayerC * cMas[o.night] + SCALE * (o.culmination === 'upper' ? diurnalMas : -diurnalMas);
  const m = { ...model, diurnalAberrationScale: 'free' as const };
  oneClamp = solvePrepared(withSyntheticOc(prepared, 11, { raMas: signal }), m, UNCONTROLLED);
  const east = (_: unknown, k: number) => k % 2 === 1;
  reversed = solvePrepared(withSyntheticOc(prepared, 12, { raMas: signal, geometry: (o, k) => (east(o, k) ? { ...o, mayerC: -o.mayerC } : o) }), m, UNCONTROLLED);
}, 200_000);

describe('diurnal-aberration scale', () => {
  it('is 0.32″ cos φ in size (ωR⊕/c, WGS84)', () => {
    // 0.3200″ at the equator (Explanatory Supplement 1992, §3.26, from memory); ρ cos φ′ ≈ cos φ within 0.3 %.
    expect(diurnalAberrationMas(0, 0)).toBeCloseTo(320.0, 0);
    expect(diurnalAberrationMas(50 * DEG, 0) / (320.0 * Math.cos(50 * DEG))).toBeCloseTo(1, 2);
  });

  it('one clamp position, with lower culminations: reported as not separable from collimation, held, finite', () => {
    expect(lowerCount, 'the archive has lower culminations').toBeGreaterThan(20);
    const words = oneClamp.degeneracies.find((d) => d.startsWith('diurnal-aberration scale'));
    console.log(words);
    expect(words).toMatch(/cannot be told from collimation/);
    expect(words).toMatch(/both terms change sign there/);
    expect(oneClamp.global.diurnalAberrationScale).toBeNull();
    expect(oneClamp.notes.some((n) => n.includes('diurnal-aberration scale') && n.includes('held at its adopted value'))).toBe(true);
    expect(oneClamp.stars.every((s) => Number.isFinite(s.parallaxMas!) && Number.isFinite(s.parallaxSigmaMas!))).toBe(true);
  });

  it('with clamp reversals: the planted +0.5 is recovered within 3σ', () => {
    const value = reversed.global.diurnalAberrationScale!, sigma = reversed.global.diurnalAberrationScaleSigma!;
    console.log(`diurnal-aberration scale ${value.toFixed(3)} ± ${sigma.toFixed(3)} (planted ${SCALE}; d = ${diurnalMas.toFixed(1)} mas)`);
    expect(reversed.degeneracies.some((d) => d.startsWith('diurnal-aberration scale'))).toBe(false);
    expect(Math.abs(value - SCALE)).toBeLessThan(3 * sigma);
    expect(sigma).toBeLessThan(SCALE / 3);
  });
});
