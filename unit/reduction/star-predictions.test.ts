// NightPredictions finds each transit on the night's batch context and evaluates the full model
// once there (core/reduction/star-predictions.ts); it must agree with predictTransit's full
// per-instant search (core/astrometry/transit.ts, itself 3 mas against ERFA) to the batch
// context's stated accuracy: 0.2 mas (night-context.ts) ≈ 14 µs of time; we allow 0.1 ms and 1 mas.
import { describe, expect, it } from 'vitest';
import { iauEarthOrientation } from '../../core/astrometry/iau-earth-orientation.ts';
import { starMotion } from '../../core/astrometry/space-motion.ts';
import { predictTransit } from '../../core/astrometry/transit.ts';
import type { StarListRow } from '../../core/formats/star-list.ts';
import { catalogueStarOf, NightPredictions } from '../../core/reduction/star-predictions.ts';
import { BUNDLED_LEAP_SECONDS } from '../../core/time/bundled-leap-seconds.ts';
import { TimeScale } from '../../core/time/timescale.ts';
import { DEG, MAS } from '../../core/units.ts';

const timeScale = new TimeScale(BUNDLED_LEAP_SECONDS);
const instantFromUtc = (utc: { jd1: number; jd2: number }) => timeScale.fromUtc(utc);
// Invented site and stars (an invented field, not a catalogue).
const site = { latitudeRad: 47.3 * DEG, longitudeRad: 8.2 * DEG, heightM: 410 };
const star = (id: string, raDeg: number, decDeg: number): StarListRow => ({
  row: 1, line: 2, id, label: id, raDeg, decDeg, epochJyear: 2016, pmRaCosDecMasYr: 120, pmDecMasYr: -80, parallaxMas: 40, parallaxSigmaMas: null,
  radialVelocityKmS: 10, magnitude: null, source: 'invented', programmes: [],
});

describe('NightPredictions', () => {
  it('agrees with predictTransit to 0.1 ms and 1 mas for upper and lower culminations on both sides of the zenith', () => {
    const mjd = 60_500; // 2024-07-15
    const predictions = new NightPredictions(site, mjd, instantFromUtc);
    const stars = [star('A', 10, 20), star('B', 95, 47), star('C', 200, 70), star('D', 300, -30), star('E', 250, 85)];
    let checked = 0;
    for (const s of stars) {
      for (const culmination of ['upper', 'lower'] as const) {
        if (culmination === 'lower' && s.decDeg < 45) continue;
        const reference = predictTransit(starMotion(catalogueStarOf(s)), site, null, { jd1: 2_400_000.5 + mjd, jd2: 0.1 }, culmination, instantFromUtc, iauEarthOrientation);
        const referenceUtcS = (reference.utc.jd1 - 2_400_000.5 - mjd + reference.utc.jd2) * 86_400;
        // A rough time 40 s off, as an observed mean wire with a poor clock would give.
        const p = predictions.nearest(s, culmination, referenceUtcS + 40);
        expect(Math.abs(p.utcS - referenceUtcS), `${s.id} ${culmination} time`).toBeLessThan(1e-4);
        expect(Math.abs(p.topocentricDecRad - reference.place.topocentricDeclinationRad), `${s.id} dec`).toBeLessThan(MAS);
        expect(Math.abs(p.zenithDistanceRad - reference.place.topocentricZenithRad), `${s.id} zenith`).toBeLessThan(MAS);
        expect(Math.abs(p.apparentRaRad - reference.place.apparentRaRad), `${s.id} apparent RA`).toBeLessThan(MAS);
        expect(p.side).toBe(reference.side);
        checked++;
      }
    }
    expect(checked).toBe(8);
    expect(predictions.fullSearchCount, 'every transit from the batch context, none by the full search').toBe(0);
  });
});
