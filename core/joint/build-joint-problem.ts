import { ObservationRowsBuilder } from '../solver/index.ts';
import type { LinearConstraint, ParameterPrior, SolverProblem } from '../solver/index.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { JointModel } from './joint-model.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';

/** Rotation rate of the Earth in mas of hour angle per ms of UT1 (15″/s × 1.0027378, IERS Conventions 2010 eq. 5.15). */
const MAS_PER_MS = 15 * 1.002737811911354;
const YEAR_DAYS = 365.25;

/** Where each parameter sits: global indices (−1 when absent) and local indices within the night's two blocks. */
export interface JointLayout {
  readonly star: readonly { readonly ra: number; readonly dec: number; readonly pmRa: number; readonly pmDec: number; readonly parallax: number }[];
  readonly deltaKappa: number;
  readonly refractionScale: number;
  readonly flexure: number;
  readonly temperatureRa: number;
  readonly temperatureDec: number;
  readonly seasonal: readonly number[];
  /** Locals of block 2n (right ascension): clock offset (ms), rate (ms/day), a, b, c (mas); −1 when absent. Block 2n+1: zero point (mas). */
  readonly clockOffset: number;
  readonly clockRate: number;
  readonly azimuth: number;
  readonly level: number;
  readonly collimation: number;
  readonly raLocalCount: number;
  readonly zeroPoint: number;
  /** Row of each observation's right-ascension and zenith equation (−1: none). */
  readonly raRow: Int32Array;
  readonly zenithRow: Int32Array;
  /** Constraints applied because the data and priors leave a direction open, in words. */
  readonly appliedConstraints: readonly string[];
}

const free = (setting: string): boolean => setting === 'free';

function globalLayout(model: JointModel, stars: readonly StarListRow[], names: string[]) {
  const add = (on: boolean, name: string): number => (on ? names.push(name) - 1 : -1);
  const star = stars.map((s) => ({
    ra: add(free(model.starPosition), `${s.id} Δα*₀ (mas)`), dec: add(free(model.starPosition), `${s.id} Δδ₀ (mas)`),
    pmRa: add(free(model.properMotion), `${s.id} Δμα* (mas/yr)`), pmDec: add(free(model.properMotion), `${s.id} Δμδ (mas/yr)`),
    parallax: add(free(model.parallax), `${s.id} Δϖ (mas)`),
  }));
  return {
    star, deltaKappa: add(free(model.deltaKappa), 'Δκ (mas)'), refractionScale: add(free(model.refractionScale), 'refraction scale (fraction)'),
    flexure: add(free(model.flexure), 'flexure Δf (mas)'), temperatureRa: add(free(model.temperature), 'temperature α (mas/°C)'),
    temperatureDec: add(free(model.temperature), 'temperature δ (mas/°C)'),
    seasonal: free(model.seasonal) ? ['seasonal α cos', 'seasonal α sin', 'seasonal δ cos', 'seasonal δ sin'].map((n) => names.push(`${n} (mas)`) - 1) : [],
  };
}

function localLayout(model: JointModel) {
  let n = 0;
  const add = (on: boolean): number => (on ? n++ : -1);
  const clockOffset = add(free(model.clockOffset)), clockRate = add(free(model.clockRate)), azimuth = add(free(model.azimuth));
  const level = add(free(model.level)), collimation = add(free(model.collimation));
  return { clockOffset, clockRate, azimuth, level, collimation, raLocalCount: n, zeroPoint: free(model.zeroPoint) ? 0 : -1 };
}

/** Pseudo-observations: clock and level priors per night, catalogue priors per star. */
function priorsOf(model: JointModel, stars: readonly StarListRow[], nights: readonly JointNight[], g: ReturnType<typeof globalLayout>, l: ReturnType<typeof localLayout>): ParameterPrior[] {
  const priors: ParameterPrior[] = [];
  const global = (index: number, sigma: number): void => { if (index >= 0 && sigma > 0) priors.push({ parameter: { kind: 'global', index }, value: 0, sigma }); };
  nights.forEach((n, i) => {
    const local = (index: number, sigma: number | null): void => { if (index >= 0 && sigma !== null && sigma > 0) priors.push({ parameter: { kind: 'local', block: 2 * i, index }, value: 0, sigma }); };
    local(l.clockOffset, n.clockPrior ? n.clockPrior.offsetSigmaS * 1000 : null);
    local(l.clockRate, n.clockPrior?.rateSigmaSPerDay != null ? n.clockPrior.rateSigmaSPerDay * 1000 : null);
    local(l.level, n.levelPriorSigmaArcsec === null ? null : n.levelPriorSigmaArcsec * 1000);
  });
  stars.forEach((s, i) => {
    const sigma = model.catalogueSigma.stars[s.id] ?? model.catalogueSigma.default;
    if (sigma) {
      global(g.star[i].ra, sigma.positionMas); global(g.star[i].dec, sigma.positionMas);
      global(g.star[i].pmRa, sigma.pmMasYr); global(g.star[i].pmDec, sigma.pmMasYr);
    }
    if (model.parallaxPrior && s.parallaxSigmaMas !== null) global(g.star[i].parallax, s.parallaxSigmaMas);
  });
  return priors;
}

/** Sum-zero constraints for the system's zero point and rate when neither catalogue priors nor clock comparisons fix them (DESIGN §4). */
function constraintsOf(observations: readonly JointObservation[], stars: readonly StarListRow[], nights: readonly JointNight[], priors: readonly ParameterPrior[], g: ReturnType<typeof globalLayout>, l: ReturnType<typeof localLayout>): LinearConstraint[] {
  const hasStarPrior = priors.some((p) => p.parameter.kind === 'global' && g.star.some((s) => s.ra === p.parameter.index || s.pmRa === p.parameter.index));
  if (hasStarPrior) return [];
  const side = new Float64Array(stars.length);
  for (const o of observations) side[o.star] += Number.isNaN(o.ocZenithMas) ? 0 : o.zenithPerDec;
  const out: LinearConstraint[] = [];
  const sum = (label: string, pick: (s: (typeof g.star)[number]) => number, coefficient: (i: number) => number): void => {
    const terms = g.star.flatMap((s, i) => (pick(s) >= 0 && coefficient(i) !== 0 ? [{ parameter: { kind: 'global' as const, index: pick(s) }, coefficient: coefficient(i) }] : []));
    if (terms.length > 0) out.push({ label, terms, value: 0 });
  };
  if (l.zeroPoint >= 0) {
    sum('zero point of the declination system: Σ side·Δδ₀ = 0 over the stars (no catalogue σ given)', (s) => s.dec, (i) => Math.sign(side[i]));
    sum('rate of the declination system: Σ side·Δμδ = 0 over the stars (no catalogue σ given)', (s) => s.pmDec, (i) => Math.sign(side[i]));
  }
  if (l.clockOffset >= 0 && nights.some((n) => n.clockPrior === null)) {
    const cosDec = stars.map((s) => Math.cos((s.decDeg * Math.PI) / 180));
    sum('zero point of right ascension: Σ Δα*₀/cos δ = 0 (nights without clock comparisons)', (s) => s.ra, (i) => 1 / cosDec[i]);
    sum('rate of right ascension: Σ Δμα*/cos δ = 0 (nights without clock comparisons)', (s) => s.pmRa, (i) => 1 / cosDec[i]);
  }
  return out;
}

/**
 * The linearised joint problem (DESIGN §4) in mas: row residuals are the nightly O − C, partials
 * ∂C/∂parameter. Right ascension: Δα*₀ 1, Δμα* (t − T₀), Δϖ −cos δ ∂H/∂ϖ, Δκ −cos δ ∂H/∂κ,
 * clock −15.041 cos δ per ms, a, b, c −cos δ × Mayer's factor (they enter the observed side);
 * temperature (T − T_ref) as a shift eastward on the sky. Zenith distance: s = ∂z/∂δ on Δδ₀ and
 * Δμδ (t − T₀), ∂z/∂ϖ, ∂z/∂κ, zero point −1, flexure −sin z, refraction scale −R.
 */
export function buildJointProblem(model: JointModel, stars: readonly StarListRow[], nights: readonly JointNight[], observations: readonly JointObservation[]): { problem: SolverProblem; layout: JointLayout } {
  const names: string[] = [];
  const g = globalLayout(model, stars, names);
  const l = localLayout(model);
  const rows = new ObservationRowsBuilder(observations.length * 2, 6);
  const raRow = new Int32Array(observations.length).fill(-1), zenithRow = new Int32Array(observations.length).fill(-1);
  const put = (index: number, partial: number): void => { if (index >= 0) rows.addGlobal(index, partial); };
  const putLocal = (index: number, partial: number): void => { if (index >= 0) rows.addLocal(index, partial); };
  observations.forEach((o, k) => {
    const s = g.star[o.star];
    const dT = o.temperatureC - model.referenceTemperatureC;
    const phase = (2 * Math.PI * o.ttDaysSinceJ2000) / YEAR_DAYS;
    raRow[k] = rows.beginRow(l.raLocalCount > 0 ? 2 * o.night : -1, o.ocRaMas, o.nightlyOutlierRa ? 0 : o.logWeight / o.sigmaRaMas ** 2);
    put(s.ra, 1); put(s.pmRa, o.yearsFromEpoch); put(s.parallax, -o.cosDec * o.hourAnglePerParallax);
    put(g.deltaKappa, -o.cosDec * o.hourAnglePerAberration); put(g.temperatureRa, dT);
    if (g.seasonal.length > 0) { put(g.seasonal[0], Math.cos(phase)); put(g.seasonal[1], Math.sin(phase)); }
    putLocal(l.clockOffset, -MAS_PER_MS * o.cosDec); putLocal(l.clockRate, -MAS_PER_MS * o.cosDec * o.clockDtDays);
    putLocal(l.azimuth, -o.cosDec * o.mayerA); putLocal(l.level, -o.cosDec * o.mayerB); putLocal(l.collimation, -o.cosDec * o.mayerC);
    if (Number.isNaN(o.ocZenithMas)) return;
    const side = o.zenithPerDec;
    zenithRow[k] = rows.beginRow(l.zeroPoint >= 0 ? 2 * o.night + 1 : -1, o.ocZenithMas, o.nightlyOutlierZenith ? 0 : o.logWeight / o.sigmaZenithMas ** 2);
    put(s.dec, side); put(s.pmDec, side * o.yearsFromEpoch); put(s.parallax, o.zenithPerParallax); put(g.deltaKappa, o.zenithPerAberration);
    put(g.flexure, -Math.sin(o.zenithRad)); put(g.refractionScale, -o.refractionMas); put(g.temperatureDec, side * dT);
    if (g.seasonal.length > 0) { put(g.seasonal[2], side * Math.cos(phase)); put(g.seasonal[3], side * Math.sin(phase)); }
    putLocal(l.zeroPoint, -1);
  });
  const blockLocalCount = new Int32Array(2 * nights.length);
  for (let n = 0; n < nights.length; n++) { blockLocalCount[2 * n] = l.raLocalCount; blockLocalCount[2 * n + 1] = l.zeroPoint >= 0 ? 1 : 0; }
  const priors = priorsOf(model, stars, nights, g, l);
  const constraints = constraintsOf(observations, stars, nights, priors, g, l);
  const localNames = ['clock offset (ms)', 'clock rate (ms/day)', 'azimuth a (mas)', 'level b (mas)', 'collimation c (mas)'].filter((_, i) => [l.clockOffset, l.clockRate, l.azimuth, l.level, l.collimation][i] >= 0);
  const problem: SolverProblem = {
    globalNames: names, blockLocalCount, rows: rows.finish(), priors, constraints,
    localName: (block, index) => `${nights[block >> 1]?.id ?? `night ${block >> 1}`} ${block % 2 === 0 ? localNames[index] : 'zero point (mas)'}`,
  };
  return { problem, layout: { ...g, ...l, raRow, zenithRow, appliedConstraints: constraints.map((c) => c.label) } };
}
