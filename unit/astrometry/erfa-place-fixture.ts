// Loads unit/fixtures/erfa_place.json (made by unit/fixtures/erfa_place.py from ERFA); a missing
// fixture fails with the command that makes it, never a quiet skip.
import { existsSync, readFileSync } from 'node:fs';
import type { Weather } from '../../core/astrometry/weather.ts';

export interface FixtureStar {
  raDeg: number; decDeg: number; pmRaMasYr: number; pmDecMasYr: number;
  parallaxMas: number; rvKmS: number; epochJyear: number;
}
export interface FixtureSite { latDeg: number; lonDeg: number; heightM: number }
export interface FixtureEop { dut1S: number; xpArcsec: number; ypArcsec: number }
export interface FixtureTime { utc: [number, number]; tt: [number, number]; ut1: [number, number] }
export interface FixtureObserved { hourAngleRad: number; declinationRad: number; zenithRad: number; azimuthRad: number }
export interface PlaceCase {
  kind: string; star: FixtureStar; site: FixtureSite; eop: FixtureEop; weather: Weather | null;
  time: FixtureTime; apparent: { raRad: number; decRad: number };
  orientation: { npb: number[]; gastRad: number; polarMotion: number[]; frameBias: number[] };
  observedNoRefraction: FixtureObserved; observed: FixtureObserved;
}
export interface TransitCase {
  kind: string; star: FixtureStar; site: FixtureSite; eop: FixtureEop; weather: Weather | null;
  culmination: 'upper' | 'lower'; afterUtc: [number, number]; transit: FixtureTime;
  observedZenithRad: number; geometricZenithRad: number; declinationRad: number;
  apparent: { raRad: number; decRad: number };
}
export interface RefcoCase extends Weather { aRad: number; bRad: number }
export interface ErfaPlaceFixture {
  header: { erfaVersion: string; generator: string; seed: number };
  refco: RefcoCase[]; places: PlaceCase[]; transits: TransitCase[];
}

const path = new URL('../fixtures/erfa_place.json', import.meta.url);

export function loadErfaPlaceFixture(): ErfaPlaceFixture {
  if (!existsSync(path)) {
    throw new Error(`missing ${path.pathname}: run /usr/bin/python3 unit/fixtures/erfa_place.py (needs python3-erfa)`);
  }
  const data = JSON.parse(readFileSync(path, 'utf8')) as ErfaPlaceFixture;
  if (!data.header?.erfaVersion) throw new Error('erfa_place.json has no ERFA version in its header; regenerate it');
  return data;
}
