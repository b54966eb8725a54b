import { ObservationRowsBuilder } from '../solver/index.ts';
import type { FixedParameter, LinearConstraint, ParameterPrior, SolverProblem } from '../solver/index.ts';
import type { StarListRow } from '../formats/star-list.ts';
import { diurnalAberrationMas, diurnalPartialMas, diurnalSeparability, latitudePhases, zenithPerLatitude } from './common-terms.ts';
import type { JointModel, SegmentableTerm } from './joint-model.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';
import { nightlyValue, segmentTerms, type SegmentEvent, type TermSegment } from './segment-terms.ts';

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
  /** Latitude variation: cos, sin global index per period of model.latitudeVariationPeriodsDays (empty when not estimated). */
  readonly latitudeVariation: readonly (readonly [number, number])[];
  /** Diurnal-aberration scale (global index, −1 absent) and the aberration it scales (mas on the sky at the meridian). */
  readonly diurnalAberrationScale: number;
  readonly diurnalAberrationMas: number;
  /** Instrument terms held per segment between events, and per term the segment of each night (−1: per night). */
  readonly segments: readonly TermSegment[];
  readonly nightSegment: Readonly<Record<SegmentableTerm, Int32Array>>;
  /** Terms the data cannot carry and that were therefore held at their adopted value (fixed at 0), in words. */
  readonly notEstimated: readonly string[];
  /** The diurnal-aberration scale was held because the data cannot tell it from collimation; the temperature coefficients, because no temperatures were recorded. */
  readonly diurnalHeld: boolean;
  readonly temperatureHeld: boolean;
}

/** What buildJointProblem needs beyond the model and the reduced archive: all optional. */
export interface JointProblemContext {
  /** The instruments' events (segments, termSpan). */
  readonly events?: readonly SegmentEvent[];
  /** Site's geodetic latitude (rad) and height (m), for the diurnal aberration's size. */
  readonly latitudeRad?: number;
  readonly heightM?: number;
  /** Weight factors per observation (variance components): right ascension and zenith rows' weights are multiplied by them. */
  readonly raWeightFactor?: Float64Array;
  readonly zenithWeightFactor?: Float64Array;
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
    latitudeVariation: free(model.latitudeVariation) ? model.latitudeVariationPeriodsDays.map((p) => [names.push(`latitude variation ${p} d cos (mas)`) - 1, names.push(`latitude variation ${p} d sin (mas)`) - 1] as const) : [],
    diurnalAberrationScale: add(free(model.diurnalAberrationScale), 'diurnal-aberration scale (fraction)'),
  };
}

function localLayout(model: JointModel) {
  let n = 0;
  const nightly = (term: SegmentableTerm): boolean => free(model[term]) && model.termSpan[term] === 'per-night';
  const add = (on: boolean): number => (on ? n++ : -1);
  const clockOffset = add(free(model.clockOffset)), clockRate = add(nightly('clockRate')), azimuth = add(nightly('azimuth'));
  const level = add(nightly('level')), collimation = add(nightly('collimation'));
  return { clockOffset, clockRate, azimuth, level, collimation, raLocalCount: n, zeroPoint: nightly('zeroPoint') ? 0 : -1 };
}

/**
 * A star's catalogue σ, each component on its own: the model's entry for the star, else the star
 * list's stated σ (when `starListSigma`), else the model's default; null for no prior.
 */
export function catalogueSigmaOf(model: JointModel, star: StarListRow): { positionMas: number | null; pmMasYr: number | null } {
  const own = model.catalogueSigma.stars[star.id], fallback = model.catalogueSigma.default;
  // `!== false`: a model saved before the key existed reads the list, which then had no such columns.
  const list = model.starListSigma !== false;
  const listPosition = list ? star.positionSigmaMas : undefined, listPm = list ? star.pmSigmaMasYr : undefined;
  return {
    positionMas: own?.positionMas ?? listPosition ?? fallback?.positionMas ?? null,
    pmMasYr: own?.pmMasYr ?? listPm ?? fallback?.pmMasYr ?? null,
  };
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
    const { positionMas, pmMasYr } = catalogueSigmaOf(model, s);
    if (positionMas !== null) { global(g.star[i].ra, positionMas); global(g.star[i].dec, positionMas); }
    if (pmMasYr !== null) { global(g.star[i].pmRa, pmMasYr); global(g.star[i].pmDec, pmMasYr); }
    if (model.parallaxPrior && s.parallaxSigmaMas !== null) global(g.star[i].parallax, s.parallaxSigmaMas);
  });
  return priors;
}

/** Sum-zero constraints for the system's zero point and rate when neither catalogue priors nor clock comparisons fix them (DESIGN §4). */
function constraintsOf(model: JointModel, observations: readonly JointObservation[], stars: readonly StarListRow[], nights: readonly JointNight[], priors: readonly ParameterPrior[], g: ReturnType<typeof globalLayout>, l: ReturnType<typeof localLayout>): LinearConstraint[] {
  const hasStarPrior = priors.some((p) => p.parameter.kind === 'global' && g.star.some((s) => s.ra === p.parameter.index || s.pmRa === p.parameter.index));
  if (hasStarPrior) return [];
  const side = new Float64Array(stars.length);
  for (const o of observations) side[o.star] += Number.isNaN(o.ocZenithMas) ? 0 : o.zenithPerDec;
  const out: LinearConstraint[] = [];
  const sum = (label: string, pick: (s: (typeof g.star)[number]) => number, coefficient: (i: number) => number): void => {
    const terms = g.star.flatMap((s, i) => (pick(s) >= 0 && coefficient(i) !== 0 ? [{ parameter: { kind: 'global' as const, index: pick(s) }, coefficient: coefficient(i) }] : []));
    if (terms.length > 0) out.push({ label, terms, value: 0 });
  };
  if (free(model.zeroPoint)) {
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

interface RowContext {
  readonly model: JointModel; readonly nights: readonly JointNight[]; readonly observations: readonly JointObservation[]; readonly context: JointProblemContext;
  readonly g: ReturnType<typeof globalLayout>; readonly l: ReturnType<typeof localLayout>;
  readonly segments: readonly TermSegment[]; readonly nightSegment: Readonly<Record<SegmentableTerm, Int32Array>>;
  readonly noTemperature: boolean; readonly diurnalMas: number; readonly raRow: Int32Array; readonly zenithRow: Int32Array;
}

/** One right-ascension row and (with a reading) one zenith-distance row per observation, with the partials buildJointProblem documents. */
function writeObservationRows(rows: ObservationRowsBuilder, c: RowContext): void {
  const { model, nights, observations, context, g, l, segments, nightSegment, noTemperature, diurnalMas, raRow, zenithRow } = c;
  const put = (index: number, partial: number): void => { if (index >= 0) rows.addGlobal(index, partial); };
  const putLocal = (index: number, partial: number): void => { if (index >= 0) rows.addLocal(index, partial); };
  const segmentOf = (term: SegmentableTerm, o: JointObservation): TermSegment | null => { const k = nightSegment[term][o.night]; return k >= 0 ? segments[k] : null; };
  const putSegment = (segment: TermSegment, o: JointObservation, partial: number): void => {
    put(segment.value, partial); put(segment.drift, (partial * (o.ttDaysSinceJ2000 - segment.referenceTtDays)) / YEAR_DAYS);
  };
  observations.forEach((o, k) => {
    const s = g.star[o.star];
    const dT = noTemperature ? 0 : o.temperatureC - model.referenceTemperatureC;
    const phase = (2 * Math.PI * o.ttDaysSinceJ2000) / YEAR_DAYS;
    const p = raInstrumentPartials(o);
    let raAddBack = 0;
    for (const term of RA_SEGMENT_TERMS) { if (segmentOf(term, o)) raAddBack += p[term] * nightlyValue(nights[o.night], term); }
    const raWeight = o.nightlyOutlierRa ? 0 : (o.logWeight / o.sigmaRaMas ** 2) * (context.raWeightFactor?.[k] ?? 1);
    raRow[k] = rows.beginRow(l.raLocalCount > 0 ? 2 * o.night : -1, o.ocRaMas + raAddBack, raWeight);
    put(s.ra, 1); put(s.pmRa, o.yearsFromEpoch); put(s.parallax, -o.cosDec * o.hourAnglePerParallax);
    put(g.deltaKappa, -o.cosDec * o.hourAnglePerAberration); if (!noTemperature) put(g.temperatureRa, dT);
    if (g.seasonal.length > 0) { put(g.seasonal[0], Math.cos(phase)); put(g.seasonal[1], Math.sin(phase)); }
    put(g.diurnalAberrationScale, diurnalPartialMas(o, diurnalMas));
    for (const term of RA_SEGMENT_TERMS) { const segment = segmentOf(term, o); if (segment) putSegment(segment, o, p[term]); }
    putLocal(l.clockOffset, p.clockOffset); putLocal(l.clockRate, p.clockRate);
    putLocal(l.azimuth, p.azimuth); putLocal(l.level, p.level); putLocal(l.collimation, p.collimation);
    if (Number.isNaN(o.ocZenithMas)) return;
    const side = o.zenithPerDec;
    const zeroSegment = segmentOf('zeroPoint', o);
    const zenithWeight = o.nightlyOutlierZenith ? 0 : (o.logWeight / o.sigmaZenithMas ** 2) * (context.zenithWeightFactor?.[k] ?? 1);
    zenithRow[k] = rows.beginRow(l.zeroPoint >= 0 ? 2 * o.night + 1 : -1, o.ocZenithMas - (zeroSegment ? nightlyValue(nights[o.night], 'zeroPoint') : 0), zenithWeight);
    put(s.dec, side); put(s.pmDec, side * o.yearsFromEpoch); put(s.parallax, o.zenithPerParallax); put(g.deltaKappa, o.zenithPerAberration);
    put(g.flexure, -Math.sin(o.zenithRad)); put(g.refractionScale, -o.refractionMas); if (!noTemperature) put(g.temperatureDec, side * dT);
    if (g.seasonal.length > 0) { put(g.seasonal[2], side * Math.cos(phase)); put(g.seasonal[3], side * Math.sin(phase)); }
    if (g.latitudeVariation.length > 0) {
      const dz = zenithPerLatitude(o);
      latitudePhases(o.ttDaysSinceJ2000, model.latitudeVariationPeriodsDays).forEach((ph, i) => { put(g.latitudeVariation[i][0], dz * Math.cos(ph)); put(g.latitudeVariation[i][1], dz * Math.sin(ph)); });
    }
    if (zeroSegment) putSegment(zeroSegment, o, -1);
    putLocal(l.zeroPoint, -1);
  });
}

/** Partials of one right-ascension row on the per-night instrument terms (joint units: ms, ms/day, mas). */
function raInstrumentPartials(o: JointObservation): Record<'clockOffset' | SegmentableTerm, number> {
  return {
    clockOffset: -MAS_PER_MS * o.cosDec, clockRate: -MAS_PER_MS * o.cosDec * o.clockDtDays,
    azimuth: -o.cosDec * o.mayerA, level: -o.cosDec * o.mayerB, collimation: -o.cosDec * o.mayerC, zeroPoint: 0,
  };
}

const RA_SEGMENT_TERMS = ['clockRate', 'azimuth', 'level', 'collimation'] as const;

/**
 * The linearised joint problem (DESIGN §4) in mas: row residuals are the nightly O − C, partials
 * ∂C/∂parameter. Right ascension: Δα*₀ 1, Δμα* (t − T₀), Δϖ −cos δ ∂H/∂ϖ, Δκ −cos δ ∂H/∂κ,
 * clock −15.041 cos δ per ms, a, b, c −cos δ × Mayer's factor (they enter the observed side);
 * temperature (T − T_ref) as a shift eastward on the sky; diurnal-aberration scale ±0.32″ cos φ
 * (common-terms.ts). Zenith distance: s = ∂z/∂δ on Δδ₀ and Δμδ (t − T₀), ∂z/∂ϖ, ∂z/∂κ, zero
 * point −1, flexure −sin z, refraction scale −R, latitude variation ∂z/∂φ × (cos, sin)(2πt/P).
 * A term held per segment (segment-terms.ts) is a global whose value is the term's whole value,
 * not a correction: the night's own value (partial × nightly) is added back to the row's O − C.
 */
export function buildJointProblem(model: JointModel, stars: readonly StarListRow[], nights: readonly JointNight[], observations: readonly JointObservation[], context: JointProblemContext = {}): { problem: SolverProblem; layout: JointLayout } {
  const names: string[] = [];
  const notEstimated: string[] = [];
  const g = globalLayout(model, stars, names);
  const l = localLayout(model);
  const { segments, nightSegment } = segmentTerms(model, nights, observations, context.events ?? [], names);
  const diurnalMas = diurnalAberrationMas(context.latitudeRad ?? 0, context.heightM ?? 0);
  if (g.temperatureRa >= 0 && observations.every((o) => Math.abs(o.temperatureC - model.referenceTemperatureC) < 1e-9)) {
    notEstimated.push('temperature coefficients: the archive records no temperatures (every transit at the reference temperature), so they were not estimated');
  }
  const rows = new ObservationRowsBuilder(observations.length * 2, 8);
  const raRow = new Int32Array(observations.length).fill(-1), zenithRow = new Int32Array(observations.length).fill(-1);
  const noTemperature = notEstimated.length > 0;
  writeObservationRows(rows, { model, nights, observations, context, g, l, segments, nightSegment, noTemperature, diurnalMas, raRow, zenithRow });
  addSegmentPriorRows(rows, nights, observations, segments);
  const blockLocalCount = new Int32Array(2 * nights.length);
  for (let n = 0; n < nights.length; n++) { blockLocalCount[2 * n] = l.raLocalCount; blockLocalCount[2 * n + 1] = l.zeroPoint >= 0 ? 1 : 0; }
  const priors = priorsOf(model, stars, nights, g, l);
  const constraints = constraintsOf(model, observations, stars, nights, priors, g, l);
  // Terms the data cannot carry are held (fixed) rather than constrained: a constraint on a direction the normal matrix lacks altogether is refused by the solver.
  const fixed: FixedParameter[] = noTemperature ? [g.temperatureRa, g.temperatureDec].map((index) => ({ parameter: { kind: 'global' as const, index }, value: 0 })) : [];
  let diurnalHeld = false;
  if (g.diurnalAberrationScale >= 0) {
    const separable = diurnalSeparability(observations, free(model.collimation), (o) => (nightSegment.collimation[o.night] >= 0 ? -1 - nightSegment.collimation[o.night] : o.night));
    if (!separable.separable) {
      fixed.push({ parameter: { kind: 'global', index: g.diurnalAberrationScale }, value: 0 });
      notEstimated.push(separable.reason);
      diurnalHeld = true;
    }
  }
  const localNames = ['clock offset (ms)', 'clock rate (ms/day)', 'azimuth a (mas)', 'level b (mas)', 'collimation c (mas)'].filter((_, i) => [l.clockOffset, l.clockRate, l.azimuth, l.level, l.collimation][i] >= 0);
  const problem: SolverProblem = {
    globalNames: names, blockLocalCount, rows: rows.finish(), priors, constraints, fixed,
    localName: (block, index) => `${nights[block >> 1]?.id ?? `night ${block >> 1}`} ${block % 2 === 0 ? localNames[index] : 'zero point (mas)'}`,
  };
  return { problem, layout: { ...g, ...l, raRow, zenithRow, appliedConstraints: constraints.map((c) => c.label), diurnalAberrationMas: diurnalMas, diurnalHeld, temperatureHeld: noTemperature, segments, nightSegment, notEstimated } };
}

/**
 * A night's level readings and clock comparisons are a prior on that night's b and clock rate;
 * when the term spans a segment the prior is on value + drift·(t − t_ref) of the segment, which
 * the solver's single-parameter priors cannot hold, so it enters as a pseudo-observation row
 * (block −1, residual = the night's measured value, weight 1/σ²), counted like a prior.
 */
function addSegmentPriorRows(rows: ObservationRowsBuilder, nights: readonly JointNight[], observations: readonly JointObservation[], segments: readonly TermSegment[]): void {
  const ttSum = new Float64Array(nights.length), count = new Int32Array(nights.length);
  for (const o of observations) { ttSum[o.night] += o.ttDaysSinceJ2000; count[o.night]++; }
  for (const segment of segments) {
    if (segment.term !== 'level' && segment.term !== 'clockRate') continue;
    for (const n of segment.nights) {
      const night = nights[n];
      const sigma = segment.term === 'level' ? (night.levelPriorSigmaArcsec === null ? null : night.levelPriorSigmaArcsec * 1000)
        : night.clockPrior?.rateSigmaSPerDay != null ? night.clockPrior.rateSigmaSPerDay * 1000 : null;
      if (sigma === null || !(sigma > 0)) continue;
      rows.beginRow(-1, nightlyValue(night, segment.term), 1 / sigma ** 2);
      rows.addGlobal(segment.value, 1);
      if (segment.drift >= 0) rows.addGlobal(segment.drift, (ttSum[n] / count[n] - segment.referenceTtDays) / YEAR_DAYS);
    }
  }
}
