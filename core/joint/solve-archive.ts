import { jointSolve, type JointSolution, type SolveProgress } from '../solver/index.ts';
import type { TaskControl } from '../task/task-control.ts';
import type { TimeScale } from '../time/timescale.ts';
import { buildJointProblem, type JointLayout, type JointProblemContext } from './build-joint-problem.ts';
import { latitudeVariationResults, segmentResults } from './term-results.ts';
import { commonModeSeries, type InstrumentCommonMode } from './common-mode.ts';
import { describeDegeneracies } from './degeneracy-words.ts';
import type { JointModel, SegmentableTerm } from './joint-model.ts';
import { estimateVarianceComponents, type VarianceFactors } from './variance-components.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';
import { prepareArchive, type PreparedArchive } from './prepare-archive.ts';
import { correlationOf, instrumentSeries, type CorrelationMatrix, type NightInstrumentTerms } from './solve-outputs.ts';
import type { SolveInputs } from './solve-inputs.ts';
import { starSignatures, type StarSignature } from './star-signatures.ts';

export { JointSolveRefused } from './prepare-archive.ts';

/** One star's result: absolute values (catalogue + correction) with 1σ formal errors; null for a term not estimated. */
export interface StarResult {
  readonly id: string;
  readonly observations: number;
  readonly parallaxMas: number | null; readonly parallaxSigmaMas: number | null;
  readonly pmRaMasYr: number | null; readonly pmRaSigmaMasYr: number | null;
  readonly pmDecMasYr: number | null; readonly pmDecSigmaMasYr: number | null;
  /** Corrections to the catalogue position at its epoch, Δα·cos δ and Δδ (mas). */
  readonly deltaRaMas: number | null; readonly deltaRaSigmaMas: number | null;
  readonly deltaDecMas: number | null; readonly deltaDecSigmaMas: number | null;
}

export interface ArchiveSolveResult {
  readonly stars: readonly StarResult[];
  readonly global: Readonly<Record<string, number | null>>;
  readonly unitWeightError: number;
  readonly chiSquare: number;
  readonly degreesOfFreedom: number;
  readonly degeneracies: readonly string[];
  readonly notes: readonly string[];
  readonly nights: readonly JointNight[];
  readonly observations: readonly JointObservation[];
  readonly layout: JointLayout;
  readonly solution: JointSolution;
  /** Correlations of the star and global parameters. */
  readonly correlation: CorrelationMatrix;
  /** Per night the instrument terms as solved, with errors. */
  readonly instrumentSeries: readonly NightInstrumentTerms[];
  /** Instrument terms held per segment between events: value (and drift) of each segment with σ (segment-terms.ts). */
  readonly segments: readonly SegmentResult[];
  /** Latitude variation Δφ(t) = Σ cos·cos(2πt/P) + sin·sin(2πt/P) per period (t: TT days since J2000.0), arcsec; empty when not estimated. */
  readonly latitudeVariation: readonly LatitudeVariationResult[];
  /** Variance components (model.varianceComponents): factors on the stated σ per star and per night; null when not asked. */
  readonly varianceComponents: VarianceComponentsResult | null;
  /** Diagnostics: each star on the parallax/aberration dial with its parallax factors; each instrument's common-mode series. */
  readonly signatures: { readonly stars: readonly StarSignature[]; readonly instruments: readonly InstrumentCommonMode[] };
}

/** One segment of one instrument term: value at its reference epoch (s/day for the clock rate, arcsec otherwise) and drift per Julian year, with 1σ. */
export interface SegmentResult {
  readonly term: SegmentableTerm;
  readonly instrumentId: string;
  readonly number: number;
  /** The opening and closing events (UTC MJD; null: start or end of the archive). */
  readonly fromUtcMjd: number | null;
  readonly toUtcMjd: number | null;
  readonly nights: number;
  readonly referenceTtDaysSinceJ2000: number;
  readonly value: number; readonly valueSigma: number;
  readonly driftPerYear: number | null; readonly driftSigmaPerYear: number | null;
}

export interface LatitudeVariationResult {
  readonly periodDays: number;
  readonly cosArcsec: number; readonly cosSigmaArcsec: number;
  readonly sinArcsec: number; readonly sinSigmaArcsec: number;
  /** √(cos² + sin²) and its σ from the covariance (first order; biased upward by ~σ²/2A when A is a few σ). */
  readonly amplitudeArcsec: number; readonly amplitudeSigmaArcsec: number;
}

/** A group's factor named by its star or night id instead of its index. */
type NamedGroup<T> = Omit<T, 'index'> & { readonly id: string };

/** The estimated variance factors (variance-components.ts) with stars and nights named. */
export interface VarianceComponentsResult extends Omit<VarianceFactors, 'stars' | 'nights'> {
  readonly stars: readonly NamedGroup<VarianceFactors['stars'][number]>[];
  readonly nights: readonly NamedGroup<VarianceFactors['nights'][number]>[];
}

function value(solution: JointSolution, index: number, scale = 1): [number | null, number | null] {
  return index < 0 ? [null, null] : [solution.globalEstimate[index] * scale, solution.globalError[index] * scale];
}

/**
 * The joint solve of an archive (DESIGN §4): nightly reductions, the model's partials at every
 * observed instant, one solve of every star, global and per-night parameter (core/solver), and
 * the results as absolute values. Throws JointSolveRefused for an archive with fewer than two
 * nights or two stars (nothing separates stars from the instrument), TaskCancelledError on cancel.
 */
export async function solveArchive(inputs: SolveInputs, model: JointModel, timeScale: TimeScale, control: TaskControl,
  onSolveProgress?: (p: SolveProgress) => void): Promise<ArchiveSolveResult> {
  return solvePrepared(await prepareArchive(inputs, model, timeScale, control), model, control, onSolveProgress);
}

/** The solver run of one model on a prepared archive: the problem, its layout and the solution (no outputs). */
export function solveProblem(prepared: PreparedArchive, model: JointModel, control: TaskControl, onSolveProgress?: (p: SolveProgress) => void,
  weights: Pick<JointProblemContext, 'raWeightFactor' | 'zenithWeightFactor'> = {}): { layout: JointLayout; solution: JointSolution } {
  const { problem, layout } = buildJointProblem(model, prepared.stars, prepared.nights, prepared.observations, {
    events: prepared.events, latitudeRad: prepared.site?.latitudeRad, heightM: prepared.site?.heightM, ...weights,
  });
  const solution = jointSolve(problem, {
    robust: model.robustIterations > 1 ? { maxIterations: model.robustIterations } : false,
    onProgress: onSolveProgress, cancellation: control.cancellation,
  });
  return { layout, solution };
}

/** Each observed star's absolute parallax, proper motion and position corrections with σ (catalogue + correction). */
export function starResults(solution: JointSolution, layout: JointLayout, catalogue: PreparedArchive['stars'], observations: readonly JointObservation[]): StarResult[] {
  const counts = new Int32Array(catalogue.length);
  for (const o of observations) counts[o.star]++;
  return catalogue.map((star, i) => {
    const l = layout.star[i];
    const [dp, sp] = value(solution, l.parallax), [da, sa] = value(solution, l.pmRa), [dd, sd] = value(solution, l.pmDec);
    const [ra, sra] = value(solution, l.ra), [de, sde] = value(solution, l.dec);
    return {
      id: star.id, observations: counts[i],
      parallaxMas: dp === null ? star.parallaxMas : (star.parallaxMas ?? 0) + dp, parallaxSigmaMas: sp,
      pmRaMasYr: da === null ? star.pmRaCosDecMasYr : (star.pmRaCosDecMasYr ?? 0) + da, pmRaSigmaMasYr: sa,
      pmDecMasYr: dd === null ? star.pmDecMasYr : (star.pmDecMasYr ?? 0) + dd, pmDecSigmaMasYr: sd,
      deltaRaMas: ra, deltaRaSigmaMas: sra, deltaDecMas: de, deltaDecSigmaMas: sde,
    };
  }).filter((r) => r.observations > 0);
}

/** The joint solve of an already prepared archive (prepare-archive.ts) under `model`; see solveArchive. */
export function solvePrepared(prepared: PreparedArchive, model: JointModel, control: TaskControl, onSolveProgress?: (p: SolveProgress) => void): ArchiveSolveResult {
  const { stars: catalogue, nights, observations } = prepared;
  let weights: Pick<JointProblemContext, 'raWeightFactor' | 'zenithWeightFactor'> = {};
  let varianceComponents: VarianceComponentsResult | null = null;
  if (model.varianceComponents) {
    const vc = estimateVarianceComponents(observations, catalogue.length, nights.length, (ra, z) => solveProblem(prepared, model, control, undefined, { raWeightFactor: ra, zenithWeightFactor: z }));
    weights = { raWeightFactor: vc.raWeight, zenithWeightFactor: vc.zenithWeight };
    const observed = new Set(observations.map((o) => o.star));
    varianceComponents = {
      stars: vc.factors.stars.filter((f) => observed.has(f.index)).map((f) => ({ id: catalogue[f.index].id, raFactor: f.raFactor, zenithFactor: f.zenithFactor, raRedundancy: f.raRedundancy, zenithRedundancy: f.zenithRedundancy })),
      nights: vc.factors.nights.map((f) => ({ id: nights[f.index].id, factor: f.factor, redundancy: f.redundancy })),
      iterations: vc.factors.iterations, converged: vc.factors.converged, keptAtOne: vc.factors.keptAtOne,
    };
  }
  const { layout, solution } = solveProblem(prepared, model, control, onSolveProgress, weights);
  const stars = starResults(solution, layout, catalogue, observations);
  const [dk, sk] = value(solution, layout.deltaKappa, 1e-3);
  const [f, sf] = value(solution, layout.flexure, 1e-3);
  const [tr, str] = value(solution, layout.temperatureHeld ? -1 : layout.temperatureRa, 1e-3), [td, std] = value(solution, layout.temperatureHeld ? -1 : layout.temperatureDec, 1e-3);
  const [rs, srs] = value(solution, layout.refractionScale);
  const [ds, sds] = layout.diurnalHeld ? [null, null] : value(solution, layout.diurnalAberrationScale);
  const global = {
    deltaKappaArcsec: dk, deltaKappaSigmaArcsec: sk, flexureArcsec: f === null ? null : model.flexureAprioriArcsec + f, flexureSigmaArcsec: sf,
    temperatureRaArcsecPerC: tr, temperatureRaSigmaArcsecPerC: str, temperatureDecArcsecPerC: td, temperatureDecSigmaArcsecPerC: std,
    refractionScale: rs, refractionScaleSigma: srs,
    diurnalAberrationScale: ds, diurnalAberrationScaleSigma: sds,
  };
  const series = instrumentSeries(solution, layout, nights, observations);
  const notes = [...prepared.skipped.map((s) => `night not used: ${s}`), ...layout.appliedConstraints.map((c) => `constraint applied: ${c}`), ...solution.warnings];
  notes.push(...layout.notEstimated.map((n) => `held at its adopted value (0): ${n}`));
  if (varianceComponents && varianceComponents.keptAtOne > 0) notes.push(`variance components: ${varianceComponents.keptAtOne} star or night group(s) with redundancy under 5 kept at factor 1`);
  if (varianceComponents && !varianceComponents.converged) notes.push(`variance components: not converged in ${varianceComponents.iterations} passes (a factor still moved by more than 1 %)`);
  return {
    stars, global, unitWeightError: solution.unitWeightError, chiSquare: solution.chiSquare, degreesOfFreedom: solution.degreesOfFreedom,
    degeneracies: [...layout.notEstimated, ...describeDegeneracies(solution, observations, catalogue, layout)], notes,
    segments: segmentResults(solution, layout), latitudeVariation: latitudeVariationResults(solution, layout, model), varianceComponents,
    nights, observations, layout, solution, correlation: correlationOf(solution), instrumentSeries: series,
    signatures: { stars: starSignatures(solution, layout, catalogue, observations), instruments: commonModeSeries(solution, layout, series, observations) },
  };
}
