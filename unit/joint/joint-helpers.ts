// Shared by the joint-solve tests: a simulated archive → folder files → SolveInputs, solved with a model.
import { encodeFolderFiles, writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { DEFAULT_JOINT_MODEL, type JointModel } from '../../core/joint/joint-model.ts';
import { solveArchive, type ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import { readSolveInputs, type SolveInputs } from '../../core/joint/solve-inputs.ts';
import { simulateArchive, type SimulatedArchive } from '../../core/simulate/simulate-archive.ts';
import type { SimulationRequest } from '../../core/simulate/simulation-options.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';

/** The bundled leap seconds and IERS C04 Earth orientation: the simulator's and the CLI's tables. */
export const TIME_SCALE = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());

export async function simulatedInputs(request: SimulationRequest): Promise<{ archive: SimulatedArchive; inputs: SolveInputs; files: Map<string, Uint8Array> }> {
  const archive = await simulateArchive(request);
  const files = encodeFolderFiles(writeArchiveFolder(archive, archive.truth));
  const { inputs, problems } = readSolveInputs(files);
  if (inputs === null) throw new Error(`simulated folder not readable: ${problems.join('; ')}`);
  return { archive, inputs, files };
}

/** The model a practitioner would set for a simulated archive: the catalogue's stated σ as priors (from truth.json's stated σ, not its errors). */
export function modelFor(archive: SimulatedArchive, overrides: Partial<JointModel> = {}): JointModel {
  const stars = Object.fromEntries(archive.truth.stars.map((s) => [s.id, { positionMas: s.catalogueSigmaPositionMas, pmMasYr: s.catalogueSigmaPmMasYr }]));
  return {
    ...DEFAULT_JOINT_MODEL, catalogueSigma: { default: null, stars }, wireSigmaS: archive.truth.options.wireNoiseS,
    readingSigmaArcsec: archive.truth.options.zenithNoiseArcsec, clockComparisonSigmaS: archive.truth.options.clockComparisonNoiseS,
    levelSigmaArcsec: archive.truth.options.levelNoiseArcsec, flexureAprioriArcsec: 0, ...overrides,
  };
}

export function solve(inputs: SolveInputs, model: JointModel): Promise<ArchiveSolveResult> {
  return solveArchive(inputs, model, TIME_SCALE, UNCONTROLLED);
}

/** (estimate − truth)/σ of parallax, both proper motions and Δκ for one solved archive. */
export function pulls(archive: SimulatedArchive, result: ArchiveSolveResult): { parallax: number[]; pmRa: number[]; pmDec: number[]; deltaKappa: number } {
  const out = { parallax: [] as number[], pmRa: [] as number[], pmDec: [] as number[], deltaKappa: 0 };
  for (const s of result.stars) {
    const t = archive.truth.stars.find((x) => x.id === s.id)!;
    out.parallax.push((s.parallaxMas! - t.parallaxMas) / s.parallaxSigmaMas!);
    out.pmRa.push((s.pmRaMasYr! - t.pmRaMasYr) / s.pmRaSigmaMasYr!);
    out.pmDec.push((s.pmDecMasYr! - t.pmDecMasYr) / s.pmDecSigmaMasYr!);
  }
  out.deltaKappa = (result.global.deltaKappaArcsec! - archive.truth.global.deltaKappaArcsec) / result.global.deltaKappaSigmaArcsec!;
  return out;
}
