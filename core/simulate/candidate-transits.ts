import type { Culmination } from '../instrument/culmination.ts';
import { DEG, TAU } from '../units.ts';
import { approximateGmstRad } from './darkness.ts';
import { HOUR_ANGLE_RATE_RAD_PER_DAY } from './simulated-sky.ts';
import { PROGRAMME_ZENITH_LIMIT_DEG } from './star-programme.ts';

/** A transit the observer could take tonight: star index, culmination and its time to ~1 minute. */
export interface CandidateTransit {
  readonly starIndex: number;
  readonly culmination: Culmination;
  readonly approximateUtcMjd: number;
}


/**
 * Every culmination of a programme star that falls inside one of the sessions and passes within
 * `zenithLimitDeg` (default PROGRAMME_ZENITH_LIMIT_DEG; a zenith camera's field radius) of the zenith (lower culminations only for circumpolar stars), in
 * time order. Times from the catalogue right ascension and the approximate sidereal time
 * (precession since the catalogue epoch moves them by up to a few minutes; the exact time comes
 * from the full model later).
 */
export function candidateTransits(
  stars: readonly { readonly raDeg: number; readonly decDeg: number }[],
  sessions: readonly { readonly startMjd: number; readonly endMjd: number }[],
  latitudeDeg: number,
  longitudeDeg: number,
  zenithLimitDeg: number = PROGRAMME_ZENITH_LIMIT_DEG,
): CandidateTransit[] {
  const out: CandidateTransit[] = [];
  stars.forEach((star, starIndex) => {
    const passages: [Culmination, number][] = [];
    if (Math.abs(latitudeDeg - star.decDeg) <= zenithLimitDeg) passages.push(['upper', 0]);
    if (180 - latitudeDeg - star.decDeg <= zenithLimitDeg) passages.push(['lower', Math.PI]);
    for (const [culmination, targetHourAngle] of passages) {
      for (const session of sessions) {
        const hourAngle = approximateGmstRad(session.startMjd) + longitudeDeg * DEG - star.raDeg * DEG;
        const ahead = (((targetHourAngle - hourAngle) % TAU) + TAU) % TAU;
        const utc = session.startMjd + ahead / HOUR_ANGLE_RATE_RAD_PER_DAY;
        if (utc <= session.endMjd) out.push({ starIndex, culmination, approximateUtcMjd: utc });
      }
    }
  });
  return out.sort((a, b) => a.approximateUtcMjd - b.approximateUtcMjd);
}
