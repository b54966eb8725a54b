// A simulated night, read from the archive folder's files by the importers' parsers, reduced by
// core/reduction's nightly reduction: the fitted constants must be the simulator's truth within
// their formal errors. This ties the simulator's conventions (Mayer signs, clock, zero point,
// flexure, refraction weather) to the reduction's.
import { beforeAll, describe, expect, it } from 'vitest';
import { writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { dateMjd } from '../../core/archive-folder/folder-text.ts';
import { parseClockComparisons } from '../../core/formats/clock-comparisons.ts';
import { parseSiteDescription } from '../../core/formats/site-description.ts';
import { parseStarList } from '../../core/formats/star-list.ts';
import { parseTransitLog } from '../../core/formats/transit-log.ts';
import { reduceObservingNight } from '../../core/reduction/reduce-observing-night.ts';
import { simulateArchive, type SimulatedArchive } from '../../core/simulate/simulate-archive.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';

let archive: SimulatedArchive;
let files: Map<string, string>;
beforeAll(async () => {
  archive = await simulateArchive({ seed: 31, years: 1, starCount: 40, blunderRate: 0, nightsPerYearTarget: 40 });
  files = writeArchiveFolder(archive, archive.truth);
});

describe('simulated night → folder files → nightly reduction', () => {
  it('recovers azimuth, collimation and zenith zero point within 4 formal errors on the busiest nights', async () => {
    const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
    const bytes = (path: string) => encodeUtf8(files.get(path)!);
    const site = parseSiteDescription(bytes('site.json'), 'site.json').rows[0];
    const stars = parseStarList(bytes('stars.csv'), 'stars.csv').rows;
    const transitRows = [...files.keys()].filter((p) => p.startsWith('transits/')).flatMap((p) => parseTransitLog(bytes(p), { fileName: p }).rows);
    const comparisons = parseClockComparisons(bytes('clock-comparisons.csv'), 'clock-comparisons.csv').rows;
    const busiest = [...archive.nights].sort((a, b) => archive.transits.filter((t) => t.nightId === b.id).length - archive.transits.filter((t) => t.nightId === a.id).length).slice(0, 3);
    for (const night of busiest) {
      const truth = archive.truth.nights.find((n) => n.nightId === night.id)!;
      const nightDateMjd = dateMjd(night.localDate);
      const thisNight = transitRows.filter((r) => r.nightDateMjd === nightDateMjd);
      expect(thisNight.length).toBe(archive.transits.filter((t) => t.nightId === night.id).length);
      const outcome = await reduceObservingNight({
        site: site.site, instrument: site.instruments[0], nightDateMjd, stars,
        transits: thisNight, clockComparisons: comparisons.filter((c) => c.nightDateMjd === nightDateMjd),
        levelReadings: null, collimatorReadings: null,
        weather: { temperatureC: night.weather!.temperatureC, pressureHpa: night.weather!.pressureHpa, humidityPercent: night.weather!.relativeHumidityPercent },
        configuration: {
          clockOffsetS: { mode: 'readings' }, clockRateSPerDay: { mode: 'readings' },
          azimuthArcsec: { mode: 'free' }, levelArcsec: { mode: 'fixed', value: truth.levelArcsec },
          collimationArcsec: { mode: 'free' }, zenithZeroArcsec: { mode: 'free' },
        },
        previous: null, flexureArcsec: archive.truth.instruments[0].flexureArcsec, instantFromUtc: (utc) => timeScale.fromUtc(utc),
      }, UNCONTROLLED);
      if (!outcome.ok) throw new Error(`night ${night.id} not reduced: ${JSON.stringify(outcome)}`);
      const c = outcome.result.constants;
      const within = (name: string, fitted: { value: number; sigma: number | null }, trueValue: number) => {
        expect(fitted.sigma, name).not.toBeNull();
        // 4 σ, plus 0.05″ for the catalogue errors (≤ 25 mas) the star list carries.
        expect(Math.abs(fitted.value - trueValue), `${night.id} ${name}: fitted ${fitted.value} ± ${fitted.sigma}, true ${trueValue}`).toBeLessThan(4 * fitted.sigma! + 0.05);
      };
      within('azimuth', c.azimuthArcsec, truth.azimuthArcsec);
      within('collimation', c.collimationArcsec, truth.collimationArcsec);
      within('zenith zero', c.zenithZeroArcsec, truth.zeroPointArcsec);
      // Wire noise 0.03 s over ~6.6 wires: about 0.012 s per transit.
      expect(outcome.result.unitWeightErrorTimeS ?? Infinity).toBeLessThan(0.03);
    }
  });
});
