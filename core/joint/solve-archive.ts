import { jointSolve, type JointSolution, type SolveProgress } from '../solver/index.ts';
import type { TaskControl } from '../task/task-control.ts';
import type { TimeScale } from '../time/timescale.ts';
import { buildJointProblem, type JointLayout } from './build-joint-problem.ts';
import { commonModeSeries, type InstrumentCommonMode } from './common-mode.ts';
import { describeDegeneracies } from './degeneracy-words.ts';
import type { JointModel } from './joint-model.ts';
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
  /** Diagnostics: each star on the parallax/aberration dial with its parallax factors; each instrument's common-mode series. */
  readonly signatures: { readonly stars: readonly StarSignature[]; readonly instruments: readonly InstrumentCommonMode[] };
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
export function solveProblem(prepared: PreparedArchive, model: JointModel, control: TaskControl, onSolveProgress?: (p: SolveProgress) => void): { layout: JointLayout; solution: JointSolution } {
  const { problem, layout } = buildJointProblem(model, prepared.stars, prepared.nights, prepared.observations);
  const solution = jointSolve(problem, {
    robust: model.robustIterations > 1 ? { maxIterations: model.robustIterations } : false,
    onProgress: onSolveProgress, cancel: { get cancelled() { return control.cancellation.isCancelled; } },
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
  const { layout, solution } = solveProblem(prepared, model, control, onSolveProgress);
  const stars = starResults(solution, layout, catalogue, observations);
  const [dk, sk] = value(solution, layout.deltaKappa, 1e-3);
  const [f, sf] = value(solution, layout.flexure, 1e-3);
  const [tr, str] = value(solution, layout.temperatureRa, 1e-3), [td, std] = value(solution, layout.temperatureDec, 1e-3);
  const [rs, srs] = value(solution, layout.refractionScale);
  const global = {
    deltaKappaArcsec: dk, deltaKappaSigmaArcsec: sk, flexureArcsec: f === null ? null : model.flexureAprioriArcsec + f, flexureSigmaArcsec: sf,
    temperatureRaArcsecPerC: tr, temperatureRaSigmaArcsecPerC: str, temperatureDecArcsecPerC: td, temperatureDecSigmaArcsecPerC: std,
    refractionScale: rs, refractionScaleSigma: srs,
  };
  const series = instrumentSeries(solution, layout, nights, observations);
  const notes = [...prepared.skipped.map((s) => `night not used: ${s}`), ...layout.appliedConstraints.map((c) => `constraint applied: ${c}`), ...solution.warnings];
  return {
    stars, global, unitWeightError: solution.unitWeightError, chiSquare: solution.chiSquare, degreesOfFreedom: solution.degreesOfFreedom,
    degeneracies: describeDegeneracies(solution, observations, catalogue, layout), notes,
    nights, observations, layout, solution, correlation: correlationOf(solution), instrumentSeries: series,
    signatures: { stars: starSignatures(solution, layout, catalogue, observations), instruments: commonModeSeries(solution, layout, series, observations) },
  };
}
