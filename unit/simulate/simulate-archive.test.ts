// The simulator's records against its truth, through core/astrometry's own transit search (the
// full, uninterpolated model) and core/instrument's formulas: what a reduction would do by hand.
import { beforeAll, describe, expect, it } from 'vitest';
import type { TransitRecord } from '../../core/archive/records.ts';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { refractionConstants } from '../../core/astrometry/refraction-constants.ts';
import { refractionAtObserved } from '../../core/astrometry/refraction.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import { earthState } from '../../core/astrometry/earth-state.ts';
import { observedWithPartials } from '../../core/astrometry/observed-partials.ts';
import { placeContext } from '../../core/astrometry/place-context.ts';
import { R_HOUR_ANGLE_PER_ABERRATION } from '../../core/astrometry/reduction-kernel.ts';
import { mayerCorrectionRad, mayerFactors } from '../../core/instrument/mayer.ts';
import { reduceToMeanWire } from '../../core/instrument/wire-reduction.ts';
import { trueZenithDistanceRad, zenithDistanceFromReading } from '../../core/instrument/zenith-distance.ts';
import { simulateArchive, type SimulatedArchive } from '../../core/simulate/simulate-archive.ts';
import { TaskCancelledError } from '../../core/task/task-control.ts';
import { skyWeather } from '../../core/simulate/simulate-night.ts';
import { bundledEarthOrientationTable } from '../../core/time/bundled-earth-orientation.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { mjdToJulianDate } from '../../core/time/julian-date.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { ARCSEC, DEG, MAS, SECONDS_PER_DAY } from '../../core/units.ts';
import { EARTH_ROTATION_RATE_RAD_PER_S } from '../../core/astrometry/constants.ts';

const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS, bundledEarthOrientationTable());
const HOUR_ANGLE_RATE = EARTH_ROTATION_RATE_RAD_PER_S * SECONDS_PER_DAY; // rad per day (IERS Conventions 2010 eq. 5.15)
let archive: SimulatedArchive;

beforeAll(async () => {
  archive = await simulateArchive({ seed: 11, years: 1, starCount: 16, blunderRate: 0.03 });
});

/** Residuals of one transit reduced by hand with the truth's constants: time (s) and zenith distance (rad). */
function reduceByHand(a: SimulatedArchive, transit: TransitRecord) {
  const night = a.truth.nights.find((n) => n.nightId === transit.nightId)!;
  const nightRecord = a.nights.find((n) => n.id === transit.nightId)!;
  const star = a.truth.stars.find((s) => s.id === transit.starId)!;
  const instrument = a.instruments[0];
  const site = { latitudeRad: a.site.latitudeDeg * DEG, longitudeRad: a.site.longitudeDeg * DEG, heightM: a.site.heightM };
  const motion = starMotion({ raRad: star.raDeg * DEG, decRad: star.decDeg * DEG, pmRaCosDecMasYr: star.pmRaMasYr, pmDecMasYr: star.pmDecMasYr, parallaxMas: star.parallaxMas, radialVelocityKmS: star.radialVelocityKmS, epochJulianYear: star.epochJulianYear });
  const weather = skyWeather(transit.weather ?? nightRecord.weather!, instrument);
  // Clock reading → UTC with the true clock law (fixed point: the rate term is tiny).
  let utc = transit.clockMjd;
  for (let i = 0; i < 3; i++) utc = transit.clockMjd - (night.clockOffsetS + night.clockRateSPerDay * (utc - night.clockReferenceUtcMjd)) / SECONDS_PER_DAY;
  const start = mjdToJulianDate(utc - 0.1);
  const predicted = predictTransit(motion, site, weather, start, transit.culmination, (u) => timeScale.fromUtc(u), iauEarthOrientation);
  const factors = mayerFactors(site.latitudeRad, predicted.place.topocentricDeclinationRad, transit.culmination);
  const tau = mayerCorrectionRad({ azimuthRad: night.azimuthArcsec * ARCSEC, levelRad: night.levelArcsec * ARCSEC, collimationRad: night.collimationArcsec * ARCSEC }, factors, 'west');
  const predictedUtc = predicted.utc.jd1 - 2_400_000.5 + predicted.utc.jd2 - tau / HOUR_ANGLE_RATE;
  const timeResidualS = (utc - predictedUtc) * SECONDS_PER_DAY;
  const zm = zenithDistanceFromReading(transit.zenithReadings[0], { zeroPointRad: night.zeroPointArcsec * ARCSEC, scaleRadPerUnit: instrument.readingScaleArcsecPerUnit * ARCSEC, sense: instrument.readingSense });
  const refracted = zm + a.truth.instruments[0].flexureArcsec * ARCSEC * Math.sin(zm);
  const vacuum = trueZenithDistanceRad(zm, a.truth.instruments[0].flexureArcsec * ARCSEC, refractionAtObserved(refracted, refractionConstants(weather)));
  const zenithResidualRad = vacuum - predicted.place.topocentricZenithRad;
  return { timeResidualS, zenithResidualRad, wires: transit.wireClockMjd.filter(Number.isFinite).length };
}

describe('simulateArchive', () => {
  it('is deterministic: the same seed gives identical records, another seed different ones', async () => {
    const again = await simulateArchive({ seed: 11, years: 1, starCount: 16, blunderRate: 0.03 });
    expect(JSON.stringify(again)).toBe(JSON.stringify(archive));
    const other = await simulateArchive({ seed: 12, years: 1, starCount: 16, blunderRate: 0.03 });
    expect(JSON.stringify(other.transits)).not.toBe(JSON.stringify(archive.transits));
  });

  it('clean transits reduced by hand with the truth return the true place to the noise level', () => {
    const blundered = new Set(archive.truth.blunders.map((b) => b.transitId));
    const clean = archive.transits.filter((t) => !blundered.has(t.id)).filter((_, i) => i % 3 === 0);
    expect(clean.length).toBeGreaterThan(60);
    let timeSum = 0, timeSquares = 0, expectedSquares = 0, zenithSquares = 0;
    for (const transit of clean) {
      const r = reduceByHand(archive, transit);
      timeSum += r.timeResidualS;
      timeSquares += r.timeResidualS ** 2;
      // Wire noise 0.03 s per wire averaged over the wires seen (common practice: 1/√n).
      expectedSquares += 0.03 ** 2 / r.wires;
      zenithSquares += r.zenithResidualRad ** 2;
    }
    const n = clean.length;
    const timeRms = Math.sqrt(timeSquares / n), expectedRms = Math.sqrt(expectedSquares / n);
    // A model mismatch of 1 mas would be 0.07 ms of time: the residual must be noise only.
    expect(timeRms / expectedRms).toBeGreaterThan(0.75);
    expect(timeRms / expectedRms).toBeLessThan(1.25);
    expect(Math.abs(timeSum / n)).toBeLessThan((4 * expectedRms) / Math.sqrt(n));
    const zenithRms = Math.sqrt(zenithSquares / n);
    expect(zenithRms / (0.3 * ARCSEC)).toBeGreaterThan(0.75);
    expect(zenithRms / (0.3 * ARCSEC)).toBeLessThan(1.25);
  });

  it('writes catalogue values = truth + the catalogue error the truth states, within the stated σ', () => {
    let pulls = 0;
    for (const truth of archive.truth.stars) {
      const listed = archive.stars.find((s) => s.id === truth.id)!;
      const raMas = (((listed.raDeg - truth.raDeg + 540) % 360) - 180) * 3.6e6 * Math.cos(truth.decDeg * DEG);
      expect(Math.abs(raMas - truth.catalogueErrorRaMas)).toBeLessThan(0.01);
      expect(Math.abs((listed.decDeg - truth.decDeg) * 3.6e6 - truth.catalogueErrorDecMas)).toBeLessThan(0.01);
      expect(listed.pmRaMasYr - truth.pmRaMasYr).toBeCloseTo(truth.catalogueErrorPmRaMasYr, 9);
      expect(listed.parallaxMas - truth.parallaxMas).toBeCloseTo(truth.catalogueErrorParallaxMas, 9);
      expect(listed.parallaxErrorMas).toBe(truth.catalogueSigmaParallaxMas);
      pulls += (truth.catalogueErrorDecMas / truth.catalogueSigmaPositionMas) ** 2;
    }
    // χ² of 16 unit-normal pulls: 5–35 holds with probability > 99 % (chi-square table).
    expect(pulls).toBeGreaterThan(5);
    expect(pulls).toBeLessThan(35);
  });

  it('lists every planted blunder, each on a transit that exists and that a hand reduction flags', () => {
    const { blunders } = archive.truth;
    expect(new Set(blunders.map((b) => b.kind))).toEqual(new Set(['wire-miscounted', 'turn-slipped', 'star-swapped', 'clock-second']));
    const ids = new Set(archive.transits.map((t) => t.id));
    for (const blunder of blunders) {
      expect(ids.has(blunder.transitId)).toBe(true);
      const transit = archive.transits.find((t) => t.id === blunder.transitId)!;
      if (blunder.kind === 'clock-second') expect(Math.abs(Math.abs(reduceByHand(archive, transit).timeResidualS) - 1)).toBeLessThan(0.15);
      if (blunder.kind === 'turn-slipped') expect(Math.abs(reduceByHand(archive, transit).zenithResidualRad) / ARCSEC).toBeGreaterThan(55);
      if (blunder.kind === 'star-swapped') expect(blunder.trueStarId).not.toBe(transit.starId);
      if (blunder.kind === 'wire-miscounted') {
        // A wire written in its neighbour's column leaves a residual of about one wire spacing (10 s sec δ).
        const star = archive.truth.stars.find((s) => s.id === transit.starId)!;
        const base = Math.floor(transit.clockMjd);
        const wires = transit.wireClockMjd.map((m, wireIndex) => ({ wireIndex, clockTimeS: (m - base) * SECONDS_PER_DAY })).filter((w) => Number.isFinite(w.clockTimeS));
        const reduced = reduceToMeanWire(wires, archive.instruments[0].wireIntervalsEquatorialS, star.decDeg * DEG, transit.culmination, 'west', 'mean-solar');
        expect(Math.max(...reduced.residualsS.map(Math.abs))).toBeGreaterThan(4);
      }
    }
  });

  it('a non-zero Δκ moves every transit by Δκ times the aberration factor of the reduction kernel', async () => {
    const request = { seed: 5, years: 1, starCount: 12, blunderRate: 0, nightsPerYearTarget: 25 };
    const base = await simulateArchive(request);
    const shifted = await simulateArchive({ ...request, deltaKappaArcsec: 0.5 });
    expect(shifted.transits.length).toBe(base.transits.length);
    const site = { latitudeRad: base.site.latitudeDeg * DEG, longitudeRad: base.site.longitudeDeg * DEG, heightM: base.site.heightM };
    let largest = 0;
    base.transits.forEach((t, i) => {
      // Same seed, same noise draws: the difference of clock times is the aberration change alone.
      const dtS = (shifted.transits[i].clockMjd - t.clockMjd) * SECONDS_PER_DAY;
      const star = base.truth.stars.find((s) => s.id === t.starId)!;
      const motion = starMotion({ raRad: star.raDeg * DEG, decRad: star.decDeg * DEG, pmRaCosDecMasYr: star.pmRaMasYr, pmDecMasYr: star.pmDecMasYr, parallaxMas: star.parallaxMas, radialVelocityKmS: star.radialVelocityKmS, epochJulianYear: star.epochJulianYear });
      const instant = timeScale.fromUtc(mjdToJulianDate(t.utcMjd));
      const context = placeContext(instant.tt.jd1 - 2_451_545 + instant.tt.jd2, earthState(instant.tt), iauEarthOrientation(instant), site, null);
      const partials = observedWithPartials(context, motion);
      // The crossing happens where the hour angle reaches its target: Δt = −ΔH / (dH/dt).
      const expectedS = (-(partials[R_HOUR_ANGLE_PER_ABERRATION] * 0.5 * ARCSEC) / HOUR_ANGLE_RATE) * SECONDS_PER_DAY;
      const onSkyErrorRad = ((dtS - expectedS) / SECONDS_PER_DAY) * HOUR_ANGLE_RATE * Math.cos(star.decDeg * DEG);
      expect(Math.abs(onSkyErrorRad)).toBeLessThan(0.5 * MAS);
      largest = Math.max(largest, Math.abs(expectedS * 15 * Math.cos(star.decDeg * DEG)));
    });
    expect(largest).toBeGreaterThan(0.3);
  });

  it('has realistic seasons and gaps: more nights in the dark half-year, runs of cloudy days, counts near the target', async () => {
    const long = await simulateArchive({ seed: 3, years: 4, starCount: 30, blunderRate: 0 });
    const dates = long.nights.map((n) => n.localDate);
    const month = (d: string) => Number(d.slice(5, 7));
    const dark = dates.filter((d) => month(d) >= 10 || month(d) <= 3).length;
    expect(dark).toBeGreaterThan(dates.length - dark);
    const mjds = dates.map((d) => Date.UTC(Number(d.slice(0, 4)), month(d) - 1, Number(d.slice(8, 10))) / 86_400_000);
    const gaps = mjds.slice(1).map((m, i) => m - mjds[i]);
    expect(gaps.filter((g) => g >= 6).length).toBeGreaterThan(8);
    expect(dates.length / 4).toBeGreaterThan(110 * 0.7);
    expect(dates.length / 4).toBeLessThan(110 * 1.3);
    const perNight = (winter: boolean) => {
      const nights = long.nights.filter((n) => (month(n.localDate) >= 10 || month(n.localDate) <= 3) === winter).map((n) => n.id);
      return long.transits.filter((t) => nights.includes(t.nightId)).length / nights.length;
    };
    expect(perNight(true)).toBeGreaterThan(perNight(false));
  });

  it('reports progress in nights and stops with TaskCancelledError when cancelled', async () => {
    const seen: [number, number][] = [];
    const cancellation = { isCancelled: false };
    const control = { cancellation, reportProgress: (done: number, total: number) => { seen.push([done, total]); if (done >= 20) cancellation.isCancelled = true; }, yieldToHost: () => Promise.resolve() };
    await expect(simulateArchive({ seed: 1, years: 2, starCount: 6 }, control)).rejects.toBeInstanceOf(TaskCancelledError);
    expect(seen[0][0]).toBe(0);
    expect(seen.at(-1)![0]).toBe(20);
    expect(seen[0][1]).toBeGreaterThan(100);
  });

  it('refuses a bad request with the field named', async () => {
    await expect(simulateArchive({ years: 0 })).rejects.toThrow(/years/);
    await expect(simulateArchive({ startDate: '2021-02-30' })).rejects.toThrow(/day/);
  });
});
