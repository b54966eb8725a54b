// The demo's zenith camera (orientation 0°, no mirror, reference column through the optical
// centre: core/simulate/invented-site.ts) must reduce exactly as before the camera geometry entered
// the reduction: through the geometry, ξ = 0 at every crossing and η is the row offset times the
// scale, which is what the reading-as-micrometer path computes. The check is that path itself
// (the instrument without its geometry), on simulated camera nights.
import { beforeAll, describe, expect, it } from 'vitest';
import { encodeFolderFiles, writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { readSolveInputs } from '../../core/joint/solve-inputs.ts';
import type { SolveInputs } from '../../core/joint/solve-inputs.ts';
import { defaultNightConfiguration } from '../../core/reduction/night-inputs.ts';
import { reduceObservingNight } from '../../core/reduction/reduce-observing-night.ts';
import { simulateArchive } from '../../core/simulate/simulate-archive.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import type { InstrumentRecord } from '../../core/formats/site-description.ts';
import { expectReduced } from './reduce-helpers.ts';

let inputs: SolveInputs;
const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());

beforeAll(async () => {
  const archive = await simulateArchive({ seed: 41, years: 1, starCount: 16, blunderRate: 0, nightsPerYearTarget: 40, zenithCameraStarCount: 12 });
  const read = readSolveInputs(encodeFolderFiles(writeArchiveFolder(archive, archive.truth)));
  if (read.inputs === null) throw new Error(`the simulated folder is not readable: ${read.problems.join('; ')}`);
  inputs = read.inputs;
});

async function reduceNight(instrument: InstrumentRecord, mjd: number) {
  const transits = inputs.transits.filter((t) => t.nightDateMjd === mjd && t.instrumentId === instrument.id);
  return expectReduced(await reduceObservingNight({
    site: inputs.site.site, instrument, nightDateMjd: mjd, stars: inputs.stars, transits, clockComparisons: [], levelReadings: null, collimatorReadings: null,
    weather: null, configuration: { ...defaultNightConfiguration(false, false), azimuthArcsec: { mode: 'fixed', value: 0 }, collimationArcsec: { mode: 'fixed', value: 0 } },
    previous: null, flexureArcsec: 0, instantFromUtc: (utc) => timeScale.fromUtc(utc),
  }, UNCONTROLLED));
}

describe('the demo camera through its geometry', () => {
  it('gives the same constants and O − C as the reading taken like a micrometer (to 1e-9 s and 1e-6″) on ten camera nights', async () => {
    const camera = inputs.site.instruments.find((i) => i.kind === 'fixed-camera');
    expect(camera?.camera, 'the simulated site has a fixed camera with its geometry').toBeTruthy();
    const nights = [...new Set(inputs.transits.filter((t) => t.instrumentId === camera!.id).map((t) => t.nightDateMjd!))].slice(0, 10);
    expect(nights.length).toBe(10);
    for (const mjd of nights) {
      const withGeometry = await reduceNight(camera!, mjd);
      const asMicrometer = await reduceNight({ ...camera!, camera: null }, mjd);
      expect(Math.abs(withGeometry.constants.clockOffsetS.value - asMicrometer.constants.clockOffsetS.value)).toBeLessThan(1e-9);
      expect(Math.abs(withGeometry.constants.zenithZeroArcsec.value - asMicrometer.constants.zenithZeroArcsec.value)).toBeLessThan(1e-6);
      withGeometry.transits.forEach((t, k) => {
        expect(Math.abs(t.ocTimeS - asMicrometer.transits[k].ocTimeS)).toBeLessThan(1e-9);
        expect(Math.abs(t.zenith!.ocZenithArcsec - asMicrometer.transits[k].zenith!.ocZenithArcsec)).toBeLessThan(1e-6);
      });
    }
  });
});
