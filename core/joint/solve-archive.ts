import type { Site } from '../astrometry/site.ts';
import { jointSolve, type JointSolution, type SolveProgress } from '../solver/index.ts';
import type { TaskControl } from '../task/task-control.ts';
import type { TimeScale } from '../time/timescale.ts';
import { DEG } from '../units.ts';
import { buildJointProblem, type JointLayout } from './build-joint-problem.ts';
import { describeDegeneracies } from './degeneracy-words.ts';
import type { JointModel } from './joint-model.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';
import { fillObservationFactors } from './observation-factors.ts';
import { reduceArchive } from './reduce-archive.ts';
import type { SolveInputs } from './solve-inputs.ts';

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
}

/** Refusal of an archive the joint solve cannot take, with the reason in words. */
export class JointSolveRefused extends Error {
  override readonly name = 'JointSolveRefused';
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
  const reduced = await reduceArchive(inputs, model, timeScale, control);
  const observed = new Set(reduced.observations.map((o) => o.star));
  if (reduced.nights.length < 2) throw new JointSolveRefused(`the archive has ${reduced.nights.length} reducible night(s); a joint solve needs at least two nights, as a single night cannot separate star positions from that night's instrument terms${reduced.skipped.length ? ` (refused nights: ${reduced.skipped.join('; ')})` : ''}`);
  if (observed.size < 2) throw new JointSolveRefused(`only ${observed.size} star is observed; a joint solve needs at least two stars, since with one star every night's clock and zero point absorb its position — solve it against the catalogue instead`);
  const s = inputs.site.site;
  const site: Site = { latitudeRad: s.latitudeDeg * DEG, longitudeRad: s.longitudeDeg * DEG, heightM: s.heightM };
  fillObservationFactors(reduced.observations, inputs.stars, site, timeScale);
  const { problem, layout } = buildJointProblem(model, inputs.stars, reduced.nights, reduced.observations);
  const solution = jointSolve(problem, {
    robust: model.robustIterations > 1 ? { maxIterations: model.robustIterations } : false,
    onProgress: onSolveProgress, cancel: { get cancelled() { return control.cancellation.isCancelled; } },
  });
  const counts = new Int32Array(inputs.stars.length);
  for (const o of reduced.observations) counts[o.star]++;
  const stars: StarResult[] = inputs.stars.map((star, i) => {
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
  const [dk, sk] = value(solution, layout.deltaKappa, 1e-3);
  const [f, sf] = value(solution, layout.flexure, 1e-3);
  const [tr, str] = value(solution, layout.temperatureRa, 1e-3), [td, std] = value(solution, layout.temperatureDec, 1e-3);
  const [rs, srs] = value(solution, layout.refractionScale);
  const global = {
    deltaKappaArcsec: dk, deltaKappaSigmaArcsec: sk, flexureArcsec: f === null ? null : model.flexureAprioriArcsec + f, flexureSigmaArcsec: sf,
    temperatureRaArcsecPerC: tr, temperatureRaSigmaArcsecPerC: str, temperatureDecArcsecPerC: td, temperatureDecSigmaArcsecPerC: std,
    refractionScale: rs, refractionScaleSigma: srs,
  };
  const notes = [...reduced.skipped.map((s) => `night not used: ${s}`), ...layout.appliedConstraints.map((c) => `constraint applied: ${c}`), ...solution.warnings];
  return {
    stars, global, unitWeightError: solution.unitWeightError, chiSquare: solution.chiSquare, degreesOfFreedom: solution.degreesOfFreedom,
    degeneracies: describeDegeneracies(solution, reduced.observations, inputs.stars, layout), notes,
    nights: reduced.nights, observations: reduced.observations, layout, solution,
  };
}
