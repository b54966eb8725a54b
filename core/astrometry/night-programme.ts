import type { EarthOrientationModel } from './orientation-model.ts';
import type { TwoPartJulianDate } from './instant.ts';
import type { Site } from './site.ts';
import type { StarMotion } from './space-motion.ts';
import { sunAtTransit, type SunAtTransit } from './sun-at-transit.ts';
import { type Culmination, type InstantFromUtc, predictTransit, type TransitPrediction } from './transit.ts';
import type { Weather } from './weather.ts';

/** One line of a night's programme: which star, its predicted transit and the Sun then. */
export interface ProgrammeEntry {
  readonly starIndex: number;
  readonly prediction: TransitPrediction;
  readonly sun: SunAtTransit;
}

/**
 * Every transit of `stars` (upper and/or lower culminations, as `culminations` asks) between
 * `fromUtc` and `untilUtc` (UTC two-part JDs), ordered by time, each with the Sun check. A window
 * longer than a sidereal day yields repeated transits of the same star. Culminations below the
 * horizon (geometric zenith distance ≥ 90°) are left out unless `includeBelowHorizon`.
 */
export function nightProgramme(
  stars: readonly StarMotion[],
  site: Site,
  weather: Weather | null,
  fromUtc: TwoPartJulianDate,
  untilUtc: TwoPartJulianDate,
  culminations: readonly Culmination[],
  instantFromUtc: InstantFromUtc,
  orientationModel: EarthOrientationModel,
  includeBelowHorizon = false,
): ProgrammeEntry[] {
  const until = untilUtc.jd1 + untilUtc.jd2;
  if (!(until > fromUtc.jd1 + fromUtc.jd2)) {
    throw new RangeError('nightProgramme: untilUtc must be later than fromUtc');
  }
  const entries: ProgrammeEntry[] = [];
  stars.forEach((motion, starIndex) => {
    for (const culmination of culminations) {
      let after = fromUtc;
      for (;;) {
        const prediction = predictTransit(motion, site, weather, after, culmination, instantFromUtc, orientationModel);
        if (prediction.utc.jd1 + prediction.utc.jd2 > until) break;
        const place = prediction.place;
        after = { jd1: prediction.utc.jd1, jd2: prediction.utc.jd2 + 0.01 };
        if (!includeBelowHorizon && place.topocentricZenithRad >= Math.PI / 2) continue;
        entries.push({
          starIndex,
          prediction,
          sun: sunAtTransit(prediction.context, place.topocentricHourAngleRad, place.topocentricDeclinationRad),
        });
      }
    }
  });
  return entries.sort((a, b) => a.prediction.utc.jd1 - b.prediction.utc.jd1 + (a.prediction.utc.jd2 - b.prediction.utc.jd2));
}
