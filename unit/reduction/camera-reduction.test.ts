// The nightly reduction of a fixed camera through its geometry (core/reduction/camera-crossing.ts)
// against the forward model of camera-night.ts: exact sphere, gnomonic projection, exact
// line-of-sight correction — independent of the reduction's first-order tangent-plane mapping.
import { describe, expect, it } from 'vitest';
import { parseSiteDescription } from '../../core/formats/site-description.ts';
import { parseStarList } from '../../core/formats/star-list.ts';
import { parseTransitLog } from '../../core/formats/transit-log.ts';
import { defaultNightConfiguration } from '../../core/reduction/night-inputs.ts';
import type { NightConfiguration } from '../../core/reduction/night-inputs.ts';
import { reduceObservingNight } from '../../core/reduction/reduce-observing-night.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { cameraNightCsv, cameraSiteJson, CAMERA_STAR_CSV } from './camera-night.ts';
import type { CameraSetup, CameraTruth } from './camera-night.ts';
import { instantFromUtc, NIGHT_MJD } from './forward-night.ts';
import { expectReduced } from './reduce-helpers.ts';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);
const TRUTH: CameraTruth = { azimuthArcsec: 6.2, levelArcsec: 1.7, collimationArcsec: -3.4, clockOffsetS: 0.318, zenithZeroArcsec: 612.5 };
/** Turned by 25° and mirrored, reference column 120 px off the optical centre (invented). */
const TURNED: CameraSetup = { orientationDeg: 25, parity: -1, opticalCentrePx: [1030, 990], referenceColumnPx: 1150, arcsecPerPx: 1.5 };

/** A camera near the zenith cannot separate a, b, c from the clock (A ≈ 0, B ≈ C ≈ sec φ): they are held at the truth. */
function heldAtTruth(c: NightConfiguration): NightConfiguration {
  return {
    ...c, azimuthArcsec: { mode: 'fixed', value: TRUTH.azimuthArcsec }, levelArcsec: { mode: 'fixed', value: TRUTH.levelArcsec },
    collimationArcsec: { mode: 'fixed', value: TRUTH.collimationArcsec }, clockRateSPerDay: { mode: 'fixed', value: 0 },
  };
}

async function reduceCamera(geometry: CameraSetup, logCsv: string) {
  const site = parseSiteDescription(bytes(cameraSiteJson(geometry)), 'site.json');
  if (site.rejected.length > 0) throw new Error(`site rejected: ${JSON.stringify(site.rejected)}`);
  const stars = parseStarList(bytes(CAMERA_STAR_CSV), 'stars.csv');
  const log = parseTransitLog(bytes(logCsv), { fileName: 'log.csv', knownStarIds: new Set(stars.rows.map((s) => s.id)) });
  if (log.rejected.length > 0 || stars.rejected.length > 0) throw new Error(`test files rejected: ${JSON.stringify([...log.rejected, ...stars.rejected])}`);
  const { site: siteRecord, instruments } = site.rows[0];
  return reduceObservingNight({
    site: siteRecord, instrument: instruments[0], nightDateMjd: NIGHT_MJD, stars: stars.rows, transits: log.rows, clockComparisons: [],
    levelReadings: null, collimatorReadings: null, weather: null, configuration: heldAtTruth(defaultNightConfiguration(false, false)),
    previous: null, flexureArcsec: 0, instantFromUtc,
  }, UNCONTROLLED);
}

describe('nightly reduction of a fixed camera turned by 25° and mirrored', () => {
  // The reduction's tangent-plane mapping is first order (camera-crossing.ts: ≤ 0.02″ for offsets
  // ≤ 0.5°); 0.5 ms of time is 5 mas on the sky here, far below a camera's 10 ms timing noise.
  it('recovers the clock offset to 0.1 ms and the zenith zero to 0.01″ from a noise-free night, O − C below 0.5 ms and 0.01″', async () => {
    const r = expectReduced(await reduceCamera(TURNED, cameraNightCsv(TURNED, TRUTH, 1, 0, 0)));
    expect(Math.abs(r.constants.clockOffsetS.value - TRUTH.clockOffsetS)).toBeLessThan(1e-4);
    expect(Math.abs(r.constants.zenithZeroArcsec.value - TRUTH.zenithZeroArcsec)).toBeLessThan(0.01);
    expect(r.transits.length).toBe(18);
    for (const t of r.transits) {
      expect(Math.abs(t.ocTimeS), t.starId).toBeLessThan(5e-4);
      expect(Math.abs(t.zenith!.ocZenithArcsec), t.starId).toBeLessThan(0.01);
    }
  });

  it('the same readings taken as an unturned camera (the micrometer-like treatment) miss by far more than their σ', async () => {
    const plain: CameraSetup = { ...TURNED, orientationDeg: 0, parity: 1, referenceColumnPx: TURNED.opticalCentrePx[0] };
    const r = expectReduced(await reduceCamera(plain, cameraNightCsv(TURNED, TRUTH, 2, 0.01, 0.15)));
    const timeMiss = Math.abs(r.constants.clockOffsetS.value - TRUTH.clockOffsetS) / r.constants.clockOffsetS.sigma!;
    const zenithMiss = Math.abs(r.constants.zenithZeroArcsec.value - TRUTH.zenithZeroArcsec) / r.constants.zenithZeroArcsec.sigma!;
    console.log(`ignoring the geometry: clock offset off by ${timeMiss.toFixed(0)}σ, zenith zero by ${zenithMiss.toFixed(0)}σ`);
    expect(Math.max(timeMiss, zenithMiss)).toBeGreaterThan(10);
  });

  it('over 40 noisy nights the clock offset and zenith zero fall within their σ at the normal rates (pull mean ≈ 0, width ≈ Student t)', async () => {
    const pulls = { offset: [] as number[], zero: [] as number[] };
    for (let seed = 100; seed < 140; seed++) {
      const r = expectReduced(await reduceCamera(TURNED, cameraNightCsv(TURNED, TRUTH, seed, 0.01, 0.15)));
      pulls.offset.push((r.constants.clockOffsetS.value - TRUTH.clockOffsetS) / r.constants.clockOffsetS.sigma!);
      pulls.zero.push((r.constants.zenithZeroArcsec.value - TRUTH.zenithZeroArcsec) / r.constants.zenithZeroArcsec.sigma!);
    }
    for (const [name, values] of Object.entries(pulls)) {
      const mean = values.reduce((s, v) => s + v, 0) / values.length;
      const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (values.length - 1));
      console.log(`camera pull ${name}: mean ${mean.toFixed(3)}, sd ${sd.toFixed(3)} over ${values.length} nights`);
      // 40 samples, ν = 17 (Student t width √(17/15) = 1.06): the mean's standard error is 0.17, the sd's about 0.12; 3.5σ bounds.
      expect(Math.abs(mean), name).toBeLessThan(0.6);
      expect(Math.abs(sd - Math.sqrt(17 / 15)), name).toBeLessThan(0.42);
      expect(values.filter((v) => Math.abs(v) < 1).length / values.length, `${name}: share within 1σ (normal 68 %)`).toBeGreaterThan(0.45);
    }
  });

  it('refuses a camera turned by 90°, whose reference column runs along the stars\' motion, naming the fix', async () => {
    const outcome = await reduceCamera({ ...TURNED, orientationDeg: 90 }, cameraNightCsv(TURNED, TRUTH, 3, 0, 0));
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.rejected[0]?.reason).toMatch(/orientation 90° .*check orientationDeg/);
  });
});
