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
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import { catalogueStarOf, NightPredictions } from '../../core/reduction/star-predictions.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';
import { utcCountS } from '../../core/formats/utc-instant.ts';
import { loadavg } from 'node:os';

interface Size { readonly label: string; readonly request: SimulationRequest }

const SIZES: readonly Size[] = [
  { label: '10k', request: { seed: 7, years: 1, starCount: 120, nightsPerYearTarget: 250, blunderRate: 0.002 } },
  { label: '100k', request: { seed: 7, years: 10, starCount: 120, nightsPerYearTarget: 250, blunderRate: 0.002 } },
];

interface Timing {
  transits: number; nights: number; parseS: number; nightlyS: number; factorsS: number; buildS: number; solveS: number; passes: number; outputsS: number; totalS: number; peakRssMb: number;
  /** CPU seconds (process.cpuUsage, GC threads included) of the same stages: on a loaded machine the wall time is the scheduler's. */
  cpu: { parse: number; nightly: number; factors: number; build: number; solve: number; solverPhases: string };
}

function cpuSeconds(): number {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1e6;
}

let lastCpuS = 0;

/** Runs `work`; returns its value and wall seconds, and leaves its CPU seconds in lastCpuS. */
async function timed<T>(work: () => T | Promise<T>): Promise<[T, number]> {
  const start = performance.now();
  const cpuStart = cpuSeconds();
  const value = await work();
  lastCpuS = cpuSeconds() - cpuStart;
  return [value, (performance.now() - start) / 1000];
}

async function measure(size: Size): Promise<Timing> {
  const archive = await simulateArchive(size.request);
  const files = encodeFolderFiles(writeArchiveFolder(archive, archive.truth));
  const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS);
  const [{ inputs }, parseS] = await timed(() => readSolveInputs(files));
  const parseCpu = lastCpuS;
  if (inputs === null) throw new Error(`${size.label}: the simulated folder is not readable`);
  if (size.label === '10k') console.log(`   ${comparePredictions(inputs, timeScale, 60)}`);
  const model: JointModel = { ...DEFAULT_JOINT_MODEL, flexureAprioriArcsec: 0 };
  const [reduced, nightlyS] = await timed(() => reduceArchive(inputs, model, timeScale, UNCONTROLLED));
  const nightlyCpu = lastCpuS;
  const s = inputs.site.site;
  const site: Site = { latitudeRad: s.latitudeDeg * DEG, longitudeRad: s.longitudeDeg * DEG, heightM: s.heightM };
  const [, factorsS] = await timed(() => fillObservationFactors(reduced.observations, inputs.stars, site, timeScale));
  const factorsCpu = lastCpuS;
  const prepared = { stars: inputs.stars, nights: reduced.nights, observations: reduced.observations, skipped: reduced.skipped };
  const [{ problem }, buildS] = await timed(() => buildJointProblem(model, prepared.stars, prepared.nights, prepared.observations));
  const buildCpu = lastCpuS;
  const phaseCpu = new Map<string, number>();
  let phase = '';
  let phaseStart = cpuSeconds();
  const onProgress = ({ phase: next }: { phase: string }): void => {
    const now = cpuSeconds();
    phaseCpu.set(phase, (phaseCpu.get(phase) ?? 0) + now - phaseStart);
    phase = next;
    phaseStart = now;
  };
  const [solution, solveS] = await timed(() => jointSolve(problem, { robust: { maxIterations: model.robustIterations }, onProgress }));
  const solveCpu = lastCpuS;
  onProgress({ phase: '' });
  const solverPhases = [...phaseCpu].filter(([name]) => name !== '').map(([name, t]) => `${name} ${t.toFixed(2)}`).join(', ');
  // solvePrepared = build + solve + outputs (correlation, instrument series, signatures).
  const [, wholeS] = await timed(() => solvePrepared(prepared, model, UNCONTROLLED));
  const outputsS = Math.max(0, wholeS - buildS - solveS);
  return {
    transits: reduced.observations.length, nights: reduced.nights.length, parseS, nightlyS, factorsS, buildS, solveS, passes: solution.iterations,
    outputsS, totalS: parseS + nightlyS + factorsS + wholeS, peakRssMb: process.resourceUsage().maxRSS / 1024,
    cpu: { parse: parseCpu, nightly: nightlyCpu, factors: factorsCpu, build: buildCpu, solve: solveCpu, solverPhases },
  };
}

/**
 * The nightly step's predictions before and after the batch-context change, interleaved night by
 * night so that machine load hits both alike: predictTransit per star (the former NightPredictions)
 * against NightPredictions.nearest, for every transit of the first `nightCount` nights.
 */
function comparePredictions(inputs: SolveInputs, timeScale: TimeScale, nightCount: number): string {
  const s = inputs.site.site;
  const site: Site = { latitudeRad: s.latitudeDeg * DEG, longitudeRad: s.longitudeDeg * DEG, heightM: s.heightM };
  const instantFromUtc = (utc: { jd1: number; jd2: number }) => timeScale.fromUtc(utc);
  const starById = new Map(inputs.stars.map((x) => [x.id, x]));
  const nights = [...new Set(inputs.transits.map((t) => t.nightDateMjd))].slice(0, nightCount);
  let before = 0, after = 0, count = 0, fallbacks = 0;
  for (const mjd of nights) {
    const rows = inputs.transits.filter((t) => t.nightDateMjd === mjd && starById.has(t.starId) && t.times.wires.length > 0);
    // The first wire's time as the rough time (within the clock error of the transit, as the reduction's).
    const rough = rows.map((t) => (t.times.kind === 'clock' ? t.times.wires[0].clockS : utcCountS(t.times.wires[0].utc) - mjd! * 86_400));
    let start = performance.now();
    rows.forEach((t, i) => {
      const motion = starMotion(catalogueStarOf(starById.get(t.starId)!));
      predictTransit(motion, site, null, { jd1: 2_400_000.5 + mjd!, jd2: (rough[i] - 43_082.045) / 86_400 }, t.culmination, instantFromUtc, iauEarthOrientation);
    });
    before += performance.now() - start;
    start = performance.now();
    const predictions = new NightPredictions(site, mjd!, instantFromUtc);
    rows.forEach((t, i) => predictions.nearest(starById.get(t.starId)!, t.culmination, rough[i]));
    after += performance.now() - start;
    fallbacks += predictions.fullSearchCount;
    count += rows.length;
  }
  return `predictions on ${nights.length} nights (${count}): predictTransit per star ${(before / count).toFixed(3)} ms, night context ${(after / count).toFixed(3)} ms each, ×${(before / after).toFixed(1)} faster, ${fallbacks} full-search fallbacks`;
}

export async function run(): Promise<void> {
  const only = process.argv.slice(2).filter((a) => SIZES.some((s) => s.label === a));
  const results = new Map<string, Timing>();
  for (const size of SIZES.filter((s) => only.length === 0 || only.includes(s.label))) {
    const t = await measure(size);
    results.set(size.label, t);
    console.log(`   ${size.label.padEnd(5)} ${t.transits} transits, ${t.nights} nights: parse ${t.parseS.toFixed(2)} s, nightly reductions ${t.nightlyS.toFixed(2)} s, factors ${t.factorsS.toFixed(2)} s, `
      + `problem ${t.buildS.toFixed(2)} s, solver ${t.solveS.toFixed(2)} s (${t.passes} passes), outputs ${t.outputsS.toFixed(2)} s; total ${t.totalS.toFixed(2)} s; peak RSS ${t.peakRssMb.toFixed(0)} MB`
      + `\n         CPU s: parse ${t.cpu.parse.toFixed(2)}, nightly ${t.cpu.nightly.toFixed(2)}, factors ${t.cpu.factors.toFixed(2)}, problem ${t.cpu.build.toFixed(2)}, solver ${t.cpu.solve.toFixed(2)}`
      + ` (${t.cpu.solverPhases}); load ${loadavg().map((x) => x.toFixed(1)).join('/')}`);
  }
  const small = results.get('10k'), large = results.get('100k');
  if (small && large) {
    const ratio = (a: number, b: number) => (b > 0 ? (a / b).toFixed(1) : '—');
    console.log(`   100k/10k: transits ×${ratio(large.transits, small.transits)}, total ×${ratio(large.totalS, small.totalS)}, nightly ×${ratio(large.nightlyS, small.nightlyS)}, solver ×${ratio(large.solveS, small.solveS)}`);
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await run();
