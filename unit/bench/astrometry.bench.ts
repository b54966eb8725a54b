// Reduction of 1,000,000 transits (100 stars × 10,000 nights, each transit at its own instant near
// the meridian) to observed places with parallax and aberration factors, with the per-night
// context (the nights sharing one PlanetaryNutationGrid), and the same work per transit without it
// (on a sample, extrapolated). The transit instants are data, computed before the timed loop; the
// total is the contexts and reductions of all nights. Prints medians, the total's wall and CPU
// time, the machine load (the 2 cores are shared) and the largest differences from the
// per-transit reference on every 10th night; asserts nothing about time.
// Run: `npm run bench -- astrometry` or `npx tsx unit/bench/astrometry.bench.ts`.
// The observatory, stars and weather are invented.
import os from 'node:os';
import { earthState } from '../../core/astrometry/earth-state.ts';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { FRAME_LENGTH, frameFromContext } from '../../core/astrometry/instant-frame.ts';
import type { AstrometricInstant, TwoPartJulianDate } from '../../core/astrometry/instant.ts';
import { createNightContext, NC_ANGLE } from '../../core/astrometry/night-context.ts';
import { fillFrameFromNight } from '../../core/astrometry/night-frame.ts';
import { placeContext } from '../../core/astrometry/place-context.ts';
import { prepareStars } from '../../core/astrometry/prepared-stars.ts';
import { reduceNight } from '../../core/astrometry/reduce-night.ts';
import { reduceStar, RESULT_STRIDE } from '../../core/astrometry/reduction-kernel.ts';
import type { CatalogueStar } from '../../core/astrometry/star.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { PlanetaryNutationGrid } from '../../core/earth/planetary-nutation-grid.ts';
import { DEG } from '../../core/units.ts';

const STARS = 100;
const NIGHTS = 10_000;
const SITE = { latitudeRad: 46.2 * DEG, longitudeRad: 7.4 * DEG, heightM: 820 };
const WEATHER = { pressureHpa: 925, temperatureC: 8, relativeHumidity: 0.6, wavelengthUm: 0.6 };
const RATE = 2 * Math.PI * 1.00273781191135448;

/** A small deterministic generator (mulberry32) so every run reduces the same invented stars. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function inventedStars(): CatalogueStar[] {
  const next = random(7);
  return Array.from({ length: STARS }, () => ({
    raRad: next() * 2 * Math.PI, decRad: Math.asin(0.2 + 0.75 * next()),
    pmRaCosDecMasYr: (next() - 0.5) * 400, pmDecMasYr: (next() - 0.5) * 400,
    parallaxMas: next() * 150, radialVelocityKmS: (next() - 0.5) * 80, epochJulianYear: 2016,
  }));
}

/** TT days since J2000.0 of each star's upper transit on each night, night after night. */
function transitInstants(catalogue: readonly CatalogueStar[], instantFromTt: (tt: TwoPartJulianDate) => AstrometricInstant): Float64Array {
  const days = new Float64Array(NIGHTS * STARS);
  const planetaryNutation = new PlanetaryNutationGrid();
  for (let night = 0; night < NIGHTS; night++) {
    const centreTt = { jd1: 2_451_545 + 2000 + night, jd2: 0.5 };
    const context = createNightContext({ centreTt, site: SITE, weather: null, instantFromTt, planetaryNutation });
    const angle = context.coefficients[NC_ANGLE] + SITE.longitudeRad;
    for (let k = 0; k < STARS; k++) {
      const ahead = Math.atan2(Math.sin(catalogue[k].raRad - angle), Math.cos(catalogue[k].raRad - angle));
      days[night * STARS + k] = context.centreDaysSinceJ2000 + ahead / RATE;
    }
  }
  return days;
}

/**
 * The bench's own path (shared planetary nutation grid, batch kernel) against the per-transit
 * reference (context with the full planetary series, fillFrameFromNight + reduceStar) on every
 * 10th night: the largest differences in place (mas, hour angle × cos δ) and in the factors.
 */
function fastAgainstReference(
  stars: Float64Array, starIndex: Int32Array, instants: Float64Array,
  instantFromTt: (tt: TwoPartJulianDate) => AstrometricInstant,
): { placeMas: number; factor: number; transits: number } {
  const planetaryNutation = new PlanetaryNutationGrid();
  const out = new Float64Array(STARS * RESULT_STRIDE), single = new Float64Array(RESULT_STRIDE);
  const frame = new Float64Array(FRAME_LENGTH);
  let place = 0, factor = 0, transits = 0;
  for (let night = 0; night < NIGHTS; night += 10) {
    const centreTt = { jd1: 2_451_545 + 2000 + night, jd2: 0.5 };
    const days = instants.subarray(night * STARS, (night + 1) * STARS);
    reduceNight(createNightContext({ centreTt, site: SITE, weather: WEATHER, instantFromTt, planetaryNutation }), stars, starIndex, days, out);
    const reference = createNightContext({ centreTt, site: SITE, weather: WEATHER, instantFromTt });
    for (let k = 0; k < STARS; k++) {
      fillFrameFromNight(reference, days[k], frame);
      reduceStar(frame, stars, k, single, 0);
      const o = k * RESULT_STRIDE, cosDec = Math.cos(single[1]);
      const hourAngle = Math.abs(Math.atan2(Math.sin(out[o] - single[0]), Math.cos(out[o] - single[0]))) * cosDec;
      place = Math.max(place, hourAngle, Math.abs(out[o + 1] - single[1]), Math.abs(out[o + 2] - single[2]));
      for (let p = 3; p < RESULT_STRIDE; p++) factor = Math.max(factor, Math.abs(out[o + p] - single[p]));
      transits++;
    }
  }
  return { placeMas: place / (DEG / 3_600_000), factor, transits };
}

/**
 * The timed loop: each night's context, then its 100 transits; wall time per part (medians) and
 * of the whole, and the CPU time of the whole. (CPU time per part is not read: a reading is a
 * system call of several µs here, which would weigh on the part it falls in.)
 */
function timeNights(
  stars: Float64Array, starIndex: Int32Array, instants: Float64Array,
  instantFromTt: (tt: TwoPartJulianDate) => AstrometricInstant, out: Float64Array,
) {
  const setupUs: number[] = [], perTransitNs: number[] = [];
  let checksum = 0;
  // One grid of the slow planetary nutation terms shared by all nights (PlanetaryNutationGrid).
  const planetaryNutation = new PlanetaryNutationGrid();
  const wallStart = performance.now(), cpuStart = process.cpuUsage();
  for (let night = 0; night < NIGHTS; night++) {
    const centreTt = { jd1: 2_451_545 + 2000 + night, jd2: 0.5 };
    const days = instants.subarray(night * STARS, (night + 1) * STARS);
    const t0 = performance.now();
    const context = createNightContext({ centreTt, site: SITE, weather: WEATHER, instantFromTt, planetaryNutation });
    const t1 = performance.now();
    reduceNight(context, stars, starIndex, days, out);
    const t2 = performance.now();
    setupUs.push((t1 - t0) * 1000);
    perTransitNs.push(((t2 - t1) * 1e6) / STARS);
    checksum += out[0];
  }
  const totalWallS = (performance.now() - wallStart) / 1000;
  const cpu = process.cpuUsage(cpuStart);
  return { setupUs: median(setupUs), perTransitNs: median(perTransitNs), totalWallS, totalCpuS: (cpu.user + cpu.system) / 1e6, checksum };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1];
}

export async function run(): Promise<void> {
  const loadBefore = os.loadavg();
  const scale = new TimeScale(BUNDLED_LEAP_SECONDS);
  const instantFromTt = (tt: TwoPartJulianDate) => scale.fromTt(tt);
  const catalogue = inventedStars();
  const stars = prepareStars(catalogue);
  const starIndex = Int32Array.from({ length: STARS }, (_, k) => k);
  const out = new Float64Array(STARS * RESULT_STRIDE);
  // Each star's own instant: when it crosses the meridian that night (to ~1 s), which a real
  // archive holds as data; computed beforehand, outside every timed part.
  const instants = transitInstants(catalogue, instantFromTt);
  const timed = timeNights(stars, starIndex, instants, instantFromTt, out);
  let checksum = timed.checksum;
  // The same work without the context: full Earth state, orientation and place context per transit.
  const sample = 3000;
  const frame = new Float64Array(FRAME_LENGTH);
  const withoutStart = performance.now();
  for (let k = 0; k < sample; k++) {
    const tt = { jd1: 2_451_545 + 2000 + (k % 365), jd2: 0.3 + (k % 7) * 0.05 };
    const instant = instantFromTt(tt);
    const context = placeContext(tt.jd1 - 2_451_545 + tt.jd2, earthState(tt), iauEarthOrientation(instant), SITE, WEATHER);
    reduceStar(frameFromContext(context, frame), stars, k % STARS, out, 0);
    checksum += out[0];
  }
  const withoutUs = ((performance.now() - withoutStart) * 1000) / sample;
  const setup = timed.setupUs, perTransit = timed.perTransitNs;
  const withPerTransitUs = setup / STARS + perTransit / 1000;
  const load = (values: number[]) => values.map((v) => v.toFixed(2)).join(' ');
  console.log('astrometry: 1,000,000 transits (100 stars × 10,000 nights) to observed places with parallax and aberration factors');
  console.log(`  machine load (1/5/15 min)          before ${load(loadBefore)}, after ${load(os.loadavg())} on ${os.availableParallelism()} cores`);
  console.log(`  total                              ${timed.totalWallS.toFixed(3)} s wall, ${timed.totalCpuS.toFixed(3)} s CPU of all threads (target < 1 s)`);
  console.log(`  per-night context                  median ${setup.toFixed(1)} µs wall (target < 50 µs)`);
  console.log(`  per transit in reduceNight         median ${perTransit.toFixed(0)} ns wall (target < 200 ns)`);
  console.log(`  without the night context          ${withoutUs.toFixed(1)} µs per transit (mean of ${sample})`);
  console.log(`  ratio without / with context       ${(withoutUs / withPerTransitUs).toFixed(0)} ×`);
  const check = fastAgainstReference(stars, starIndex, instants, instantFromTt);
  console.log(`  fast path vs reference, every 10th night (${check.transits.toLocaleString('en')} transits, untimed):`);
  console.log(`    place ${check.placeMas.toExponential(2)} mas, factors ${check.factor.toExponential(2)} (reference: full-nutation context, fillFrameFromNight + reduceStar)`);
  if (!Number.isFinite(checksum)) throw new Error('astrometry bench produced a non-finite result');
}

if (process.argv[1]?.endsWith('astrometry.bench.ts')) await run();
