// Whole joint-solve pipeline benchmark (core/joint, SOLVE.md "Benchmark") on invented simulated
// archives (core/simulate) of about 10k and 100k transits: folder parsing, nightly reductions,
// parallax/aberration factors, problem building, solver passes and the outputs, each timed on its
// own; the simulation itself is excluded. Peak RSS is the process's (monotone, so the 100k figure
// is the peak of the whole run). Run alone: `npx tsx unit/bench/joint.bench.ts [10k|100k]`.
import { encodeFolderFiles, writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import type { Site } from '../../core/astrometry/site.ts';
import { buildJointProblem } from '../../core/joint/build-joint-problem.ts';
import { DEFAULT_JOINT_MODEL, type JointModel } from '../../core/joint/joint-model.ts';
import { fillObservationFactors } from '../../core/joint/observation-factors.ts';
import { reduceArchive } from '../../core/joint/reduce-archive.ts';
import { solvePrepared } from '../../core/joint/solve-archive.ts';
import { readSolveInputs } from '../../core/joint/solve-inputs.ts';
import { simulateArchive } from '../../core/simulate/simulate-archive.ts';
import type { SimulationRequest } from '../../core/simulate/simulation-options.ts';
import { jointSolve } from '../../core/solver/index.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { DEG } from '../../core/units.ts';

interface Size { readonly label: string; readonly request: SimulationRequest }

const SIZES: readonly Size[] = [
  { label: '10k', request: { seed: 7, years: 1, starCount: 120, nightsPerYearTarget: 250, blunderRate: 0.002 } },
  { label: '100k', request: { seed: 7, years: 10, starCount: 120, nightsPerYearTarget: 250, blunderRate: 0.002 } },
];

interface Timing { transits: number; nights: number; parseS: number; nightlyS: number; factorsS: number; buildS: number; solveS: number; passes: number; outputsS: number; totalS: number; peakRssMb: number }

async function timed<T>(work: () => T | Promise<T>): Promise<[T, number]> {
  const start = performance.now();
  const value = await work();
  return [value, (performance.now() - start) / 1000];
}

async function measure(size: Size): Promise<Timing> {
  const archive = await simulateArchive(size.request);
  const files = encodeFolderFiles(writeArchiveFolder(archive, archive.truth));
  const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS);
  const [{ inputs }, parseS] = await timed(() => readSolveInputs(files));
  if (inputs === null) throw new Error(`${size.label}: the simulated folder is not readable`);
  const model: JointModel = { ...DEFAULT_JOINT_MODEL, flexureAprioriArcsec: 0 };
  const [reduced, nightlyS] = await timed(() => reduceArchive(inputs, model, timeScale, UNCONTROLLED));
  const s = inputs.site.site;
  const site: Site = { latitudeRad: s.latitudeDeg * DEG, longitudeRad: s.longitudeDeg * DEG, heightM: s.heightM };
  const [, factorsS] = await timed(() => fillObservationFactors(reduced.observations, inputs.stars, site, timeScale));
  const prepared = { stars: inputs.stars, nights: reduced.nights, observations: reduced.observations, skipped: reduced.skipped };
  const [{ problem }, buildS] = await timed(() => buildJointProblem(model, prepared.stars, prepared.nights, prepared.observations));
  const [solution, solveS] = await timed(() => jointSolve(problem, { robust: { maxIterations: model.robustIterations } }));
  // solvePrepared = build + solve + outputs (correlation, instrument series, signatures).
  const [, wholeS] = await timed(() => solvePrepared(prepared, model, UNCONTROLLED));
  const outputsS = Math.max(0, wholeS - buildS - solveS);
  return {
    transits: reduced.observations.length, nights: reduced.nights.length, parseS, nightlyS, factorsS, buildS, solveS, passes: solution.iterations,
    outputsS, totalS: parseS + nightlyS + factorsS + wholeS, peakRssMb: process.resourceUsage().maxRSS / 1024,
  };
}

export async function run(): Promise<void> {
  const only = process.argv.slice(2).filter((a) => SIZES.some((s) => s.label === a));
  const results = new Map<string, Timing>();
  for (const size of SIZES.filter((s) => only.length === 0 || only.includes(s.label))) {
    const t = await measure(size);
    results.set(size.label, t);
    console.log(`   ${size.label.padEnd(5)} ${t.transits} transits, ${t.nights} nights: parse ${t.parseS.toFixed(2)} s, nightly reductions ${t.nightlyS.toFixed(2)} s, factors ${t.factorsS.toFixed(2)} s, `
      + `problem ${t.buildS.toFixed(2)} s, solver ${t.solveS.toFixed(2)} s (${t.passes} passes), outputs ${t.outputsS.toFixed(2)} s; total ${t.totalS.toFixed(2)} s; peak RSS ${t.peakRssMb.toFixed(0)} MB`);
  }
  const small = results.get('10k'), large = results.get('100k');
  if (small && large) {
    const ratio = (a: number, b: number) => (b > 0 ? (a / b).toFixed(1) : '—');
    console.log(`   100k/10k: transits ×${ratio(large.transits, small.transits)}, total ×${ratio(large.totalS, small.totalS)}, nightly ×${ratio(large.nightlyS, small.nightlyS)}, solver ×${ratio(large.solveS, small.solveS)}`);
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await run();
