// Synthetic O − C on the geometry of a simulated archive (its nights, stars, times and factors as the
// nightly reduction and the kernel give them), for tests whose truth the simulator cannot plant:
// every O − C is replaced by a known signal plus Gaussian noise of the stated σ (times a factor).
import type { JointObservation } from '../../core/joint/joint-observations.ts';
import { prepareArchive, type PreparedArchive } from '../../core/joint/prepare-archive.ts';
import type { SimulationRequest } from '../../core/simulate/simulation-options.ts';
import { SeededRandom } from '../../core/simulate/seeded-random.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { modelFor, simulatedInputs, TIME_SCALE } from './joint-helpers.ts';

export async function preparedGeometry(request: SimulationRequest): Promise<{ prepared: PreparedArchive; model: ReturnType<typeof modelFor> }> {
  const { archive, inputs } = await simulatedInputs(request);
  const model = modelFor(archive, { robustIterations: 1 });
  return { prepared: await prepareArchive(inputs, model, TIME_SCALE, UNCONTROLLED), model };
}

export interface SyntheticSignal {
  /** Signal in right ascension (Δα cos δ) and zenith distance, mas; 0 when absent. */
  readonly raMas?: (o: JointObservation) => number;
  readonly zenithMas?: (o: JointObservation) => number;
  /** Noise factor on the stated σ per observation (default 1). */
  readonly noiseFactor?: (o: JointObservation) => number;
  /** Rewrites the observation's geometry before the signal is computed (e.g. a clamp reversal). */
  readonly geometry?: (o: JointObservation, index: number) => JointObservation;
}

/** The prepared archive with every O − C replaced by signal + N(0, (factor·σ)²), from a seeded stream; nightly blunder flags cleared. */
export function withSyntheticOc(prepared: PreparedArchive, seed: number, signal: SyntheticSignal): PreparedArchive {
  const random = new SeededRandom(seed);
  const observations = prepared.observations.map((source, k) => {
    const o = signal.geometry ? signal.geometry(source, k) : source;
    const factor = signal.noiseFactor?.(o) ?? 1;
    return {
      ...o, nightlyOutlierRa: false, nightlyOutlierZenith: false, logWeight: 1,
      ocRaMas: (signal.raMas?.(o) ?? 0) + random.normal(0, factor * o.sigmaRaMas),
      ocZenithMas: Number.isNaN(o.ocZenithMas) ? Number.NaN : (signal.zenithMas?.(o) ?? 0) + random.normal(0, factor * o.sigmaZenithMas),
    };
  });
  return { ...prepared, observations };
}
