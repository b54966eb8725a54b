// The fixed zenith camera of the simulator: what it observes, how the archive folder keeps it, and
// that core/reduction's nightly reduction takes a camera night and recovers the camera's true
// constants within their formal errors (the check that simulator and reduction agree).
import { beforeAll, describe, expect, it } from 'vitest';
import { readArchiveFolder, writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { dateMjd } from '../../core/archive-folder/folder-text.ts';
import { parseClockComparisons } from '../../core/formats/clock-comparisons.ts';
import { parseSiteDescription } from '../../core/formats/site-description.ts';
import { parseStarList } from '../../core/formats/star-list.ts';
import { parseTransitLog } from '../../core/formats/transit-log.ts';
import { reduceObservingNight } from '../../core/reduction/reduce-observing-night.ts';
import { ZENITH_CAMERA_ARCSEC_PER_PX, ZENITH_CAMERA_FIELD_RADIUS_DEG } from '../../core/simulate/invented-site.ts';
import { simulateArchive, type SimulatedArchive } from '../../core/simulate/simulate-archive.ts';
import { resolveSimulationOptions } from '../../core/simulate/simulation-options.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';

const CAMERA = 'instrument-zenith-camera';
let archive: SimulatedArchive;
let files: Map<string, string>;
beforeAll(async () => {
  archive = await simulateArchive({ seed: 41, years: 1, starCount: 16, blunderRate: 0, nightsPerYearTarget: 40, zenithCameraStarCount: 12 });
  files = writeArchiveFolder(archive, archive.truth);
});

describe('simulateArchive with zenithCameraStarCount > 0', () => {
  it('adds a fixed camera that only times stars inside its field, one reference line, pixel readings', () => {
    const camera = archive.instruments.find((i) => i.id === CAMERA);
    expect(camera?.kind).toBe('fixed-camera');
    expect(camera?.wireIntervalsEquatorialS).toEqual([]);
    expect(archive.stars.length).toBe(16 + 12);
    const cameraTransits = archive.transits.filter((t) => t.instrumentId === CAMERA);
    expect(cameraTransits.length).toBeGreaterThan(50);
    const latitude = archive.site.latitudeDeg;
    for (const t of cameraTransits) {
      const star = archive.truth.stars.find((s) => s.id === t.starId)!;
      expect(Math.abs(star.decDeg - latitude)).toBeLessThanOrEqual(ZENITH_CAMERA_FIELD_RADIUS_DEG);
      expect(t.culmination).toBe('upper');
      expect(t.wireClockMjd).toEqual([]);
      // A row offset inside a field of ±0.5° (plus the zero point): under 1000 px at 1.83″/px.
      expect(Math.abs(t.zenithReadings[0])).toBeLessThan((ZENITH_CAMERA_FIELD_RADIUS_DEG * 3600) / ZENITH_CAMERA_ARCSEC_PER_PX + 20);
    }
    // The camera's nights are its own, so a date can hold a transit night and a camera night.
    const cameraNights = archive.nights.filter((n) => n.instrumentId === CAMERA);
    expect(new Set(cameraNights.map((n) => n.id)).size).toBe(cameraNights.length);
    expect(archive.truth.nights.filter((n) => n.instrumentId === CAMERA).length).toBe(cameraNights.length);
    expect(archive.truth.instruments.map((i) => i.id)).toEqual(['instrument-transit', CAMERA]);
  });

  it('keeps the programme and the transit instrument\'s true drift of the same request without a camera', async () => {
    const plain = await simulateArchive({ seed: 41, years: 1, starCount: 16, blunderRate: 0, nightsPerYearTarget: 40 });
    expect(plain.instruments.map((i) => i.id)).toEqual(['instrument-transit']);
    expect(plain.stars).toEqual(archive.stars.slice(0, 16));
    // The zenith stars add candidates (so the night's draws differ), but drift and events draw
    // from their own streams: every night both archives kept has the same true constants.
    const withCamera = new Map(archive.truth.nights.map((n) => [n.nightId, n]));
    const common = plain.truth.nights.filter((n) => withCamera.has(n.nightId));
    expect(common.length).toBeGreaterThan(plain.truth.nights.length / 2);
    for (const night of common) expect(withCamera.get(night.nightId)).toEqual(night);
    expect(archive.events.filter((e) => e.instrumentId === 'instrument-transit')).toEqual(plain.events);
  });

  it('refuses a zenith star count outside 0–60 or not whole, naming the option', () => {
    expect(resolveSimulationOptions({}).zenithCameraStarCount).toBe(0);
    expect(() => resolveSimulationOptions({ zenithCameraStarCount: 61 })).toThrow(/zenithCameraStarCount must be an integer in 0…60 \(got 61\)/);
    expect(() => resolveSimulationOptions({ zenithCameraStarCount: 2.5 })).toThrow(/zenithCameraStarCount/);
  });

  it('round-trips through the archive folder with the camera geometry', () => {
    const read = readArchiveFolder(new Map([...files].map(([path, text]) => [path, encodeUtf8(text)])), archive.site.createdUtc);
    expect(read.rejected).toEqual([]);
    expect(read.content?.instruments.find((i) => i.id === CAMERA)).toEqual(archive.instruments.find((i) => i.id === CAMERA));
    expect(read.content?.transits.filter((t) => t.instrumentId === CAMERA)).toEqual(archive.transits.filter((t) => t.instrumentId === CAMERA));
  });

  it('the nightly reduction takes a camera night: collimation and zenith zero within 4 formal errors', async () => {
    const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
    const bytes = (path: string) => encodeUtf8(files.get(path)!);
    const site = parseSiteDescription(bytes('site.json'), 'site.json').rows[0];
    const camera = site.instruments.find((i) => i.id === CAMERA)!;
    expect(camera.camera).toEqual({ orientationDeg: 0, parity: 1, opticalCentrePx: [1024, 1024], referenceColumnPx: 1024 });
    const stars = parseStarList(bytes('stars.csv'), 'stars.csv').rows;
    const rows = [...files.keys()].filter((p) => p.startsWith('transits/')).flatMap((p) => parseTransitLog(bytes(p), { fileName: p }).rows).filter((r) => r.instrumentId === CAMERA);
    const comparisons = parseClockComparisons(bytes('clock-comparisons.csv'), 'clock-comparisons.csv').rows;
    const cameraNights = archive.nights.filter((n) => n.instrumentId === CAMERA);
    const busiest = [...cameraNights].sort((a, b) => archive.transits.filter((t) => t.nightId === b.id).length - archive.transits.filter((t) => t.nightId === a.id).length).slice(0, 3);
    for (const night of busiest) {
      const truth = archive.truth.nights.find((n) => n.nightId === night.id)!;
      const nightDateMjd = dateMjd(night.localDate);
      const thisNight = rows.filter((r) => r.nightDateMjd === nightDateMjd);
      expect(thisNight.length).toBe(archive.transits.filter((t) => t.nightId === night.id).length);
      // At the zenith Mayer's A vanishes and B = C = sec φ: level and azimuth are held at their
      // true values (a tiltmeter's job), collimation takes the rest.
      const outcome = await reduceObservingNight({
        site: site.site, instrument: camera, nightDateMjd, stars, transits: thisNight,
        clockComparisons: comparisons.filter((c) => c.nightDateMjd === nightDateMjd && c.instrumentId === CAMERA),
        levelReadings: null, collimatorReadings: null,
        weather: { temperatureC: night.weather!.temperatureC, pressureHpa: night.weather!.pressureHpa, humidityPercent: night.weather!.relativeHumidityPercent },
        configuration: {
          clockOffsetS: { mode: 'readings' }, clockRateSPerDay: { mode: 'readings' },
          azimuthArcsec: { mode: 'fixed', value: truth.azimuthArcsec }, levelArcsec: { mode: 'fixed', value: truth.levelArcsec },
          collimationArcsec: { mode: 'free' }, zenithZeroArcsec: { mode: 'free' },
        },
        previous: null, flexureArcsec: 0, instantFromUtc: (utc) => timeScale.fromUtc(utc),
      }, UNCONTROLLED);
      if (!outcome.ok) throw new Error(`camera night ${night.id} not reduced: ${JSON.stringify(outcome)}`);
      const c = outcome.result.constants;
      for (const [name, fitted, trueValue] of [['collimation', c.collimationArcsec, truth.collimationArcsec], ['zenith zero', c.zenithZeroArcsec, truth.zeroPointArcsec]] as const) {
        expect(fitted.sigma, name).not.toBeNull();
        // 4 σ, plus 0.05″ for the catalogue errors (≤ 25 mas) the star list carries.
        expect(Math.abs(fitted.value - trueValue), `${night.id} ${name}: fitted ${fitted.value} ± ${fitted.sigma}, true ${trueValue}`).toBeLessThan(4 * fitted.sigma! + 0.05);
      }
    }
  });
});
