import type { StarRecord } from '../archive/records.ts';
import { DEG, MAS } from '../units.ts';
import type { SeededRandom } from './seeded-random.ts';
import type { TrueStar } from './simulation-truth.ts';

/** Epoch of the invented catalogue (and of the true places), Julian year TDB. */
export const CATALOGUE_EPOCH_JULIAN_YEAR = 2000.0;
/** Largest zenith distance the programme uses at either culmination, degrees (refraction stays well modelled). */
export const PROGRAMME_ZENITH_LIMIT_DEG = 65;

/** A programme star: its truth and the catalogue record written to the star list. */
export interface ProgrammeStar {
  readonly truth: TrueStar;
  readonly catalogue: StarRecord;
}

/**
 * Invents `count` stars for a site at `latitudeDeg` (north, 20–70°). Right ascensions are spread
 * evenly with jitter; declinations fall in three bands: south of the zenith (≈45 %), north of it
 * but not circumpolar (≈30 %), and circumpolar with both culminations within
 * PROGRAMME_ZENITH_LIMIT_DEG (≈25 %). Parallaxes are mostly small (log-uniform 1.5–25 mas), with
 * one star in twelve nearby (80–300 mas) and a proper motion to match (up to ~1″/yr). The star
 * list carries catalogue values = truth + errors with a stated σ per star (position σ 2–25 mas,
 * proper motion σ 0.5–4 mas/yr, parallax σ 0.4–3 mas: an older ground-based catalogue, so a solve
 * has something to correct). Ids and catalogue ids "ML-NNN" (invented; the same string, as the
 * star list file has one id column).
 */
export function inventStars(count: number, latitudeDeg: number, random: SeededRandom, createdUtc: string): ProgrammeStar[] {
  if (!(latitudeDeg >= 20 && latitudeDeg <= 70)) throw new RangeError(`inventStars: latitude ${latitudeDeg}° is outside the 20–70° N the programme bands are built for`);
  const stars: ProgrammeStar[] = [];
  for (let index = 0; index < count; index++) {
    const raDeg = ((index + random.between(0.1, 0.9)) * 360) / count;
    const decDeg = inventDeclination(index, latitudeDeg, random);
    stars.push(inventStar(index, raDeg, decDeg, random, createdUtc));
  }
  return stars;
}

/**
 * Invents `count` stars that pass within `fieldRadiusDeg` of the zenith at upper culmination
 * (|δ − φ| ≤ 0.8 · fieldRadiusDeg, so the image stays inside a zenith camera's field), right
 * ascensions spread evenly with jitter, space motions as inventStars. They are numbered after the
 * programme: the first gets "ML-NNN" with NNN = firstIndex + 1.
 */
export function inventZenithStars(count: number, firstIndex: number, latitudeDeg: number, fieldRadiusDeg: number, random: SeededRandom, createdUtc: string): ProgrammeStar[] {
  if (!(fieldRadiusDeg > 0 && fieldRadiusDeg <= 5)) throw new RangeError(`inventZenithStars: field radius ${fieldRadiusDeg}° must be in (0, 5]`);
  const stars: ProgrammeStar[] = [];
  for (let k = 0; k < count; k++) {
    const raDeg = ((k + random.between(0.1, 0.9)) * 360) / count;
    const decDeg = latitudeDeg + random.between(-0.8, 0.8) * fieldRadiusDeg;
    stars.push(inventStar(firstIndex + k, raDeg, decDeg, random, createdUtc));
  }
  return stars;
}

function inventStar(index: number, raDeg: number, decDeg: number, random: SeededRandom, createdUtc: string): ProgrammeStar {
  const nearby = index % 12 === 5;
  const parallaxMas = nearby ? random.between(80, 300) : Math.exp(random.between(Math.log(1.5), Math.log(25)));
  // Tangential speeds of 15–90 km/s: μ = v_t / (4.74 d), d in pc = 1000/ϖ (Smart, Stellar Kinematics).
  const tangentialKmS = random.between(15, 90);
  const pmTotalMasYr = Math.min((tangentialKmS * parallaxMas) / 4.74, 1100);
  const pmAngle = random.between(0, 2 * Math.PI);
  const catalogueId = `ML-${String(index + 1).padStart(3, '0')}`;
  const id = catalogueId;
  const truth = { id, catalogueId, raDeg, decDeg, epochJulianYear: CATALOGUE_EPOCH_JULIAN_YEAR, parallaxMas,
    pmRaMasYr: pmTotalMasYr * Math.sin(pmAngle), pmDecMasYr: pmTotalMasYr * Math.cos(pmAngle),
    radialVelocityKmS: random.normal(0, 25) };
  return withCatalogue(truth, random, createdUtc);
}

function inventDeclination(index: number, latitudeDeg: number, random: SeededRandom): number {
  const band = index % 4;
  const circumpolarLow = 180 - latitudeDeg - PROGRAMME_ZENITH_LIMIT_DEG; // lower culmination z ≤ limit
  if (band === 3) return random.between(Math.max(circumpolarLow, 90 - latitudeDeg) + 1, 86);
  if (band === 1) return random.between(latitudeDeg + 1, Math.max(latitudeDeg + 2, circumpolarLow - 1));
  return random.between(latitudeDeg - PROGRAMME_ZENITH_LIMIT_DEG + 2, latitudeDeg - 0.5);
}

function withCatalogue(truth: Omit<TrueStar, `catalogueError${string}` | `catalogueSigma${string}`>, random: SeededRandom, createdUtc: string): ProgrammeStar {
  const positionSigmaMas = random.between(2, 25);
  const pmSigmaMasYr = random.between(0.5, 4);
  const parallaxSigmaMas = random.between(0.4, 3);
  const full: TrueStar = {
    ...truth,
    catalogueErrorRaMas: random.normal(0, positionSigmaMas),
    catalogueErrorDecMas: random.normal(0, positionSigmaMas),
    catalogueErrorPmRaMasYr: random.normal(0, pmSigmaMasYr),
    catalogueErrorPmDecMasYr: random.normal(0, pmSigmaMasYr),
    catalogueErrorParallaxMas: random.normal(0, parallaxSigmaMas),
    catalogueSigmaPositionMas: positionSigmaMas,
    catalogueSigmaPmMasYr: pmSigmaMasYr,
    catalogueSigmaParallaxMas: parallaxSigmaMas,
  };
  const cosDec = Math.cos(full.decDeg * DEG);
  let raDeg = full.raDeg + (full.catalogueErrorRaMas * MAS) / cosDec / DEG;
  raDeg = ((raDeg % 360) + 360) % 360;
  const catalogue: StarRecord = {
    id: full.id,
    catalogueId: full.catalogueId,
    label: `${full.catalogueId} (invented)`,
    raDeg,
    decDeg: full.decDeg + (full.catalogueErrorDecMas * MAS) / DEG,
    catalogueEpochJulianYear: full.epochJulianYear,
    pmRaMasYr: full.pmRaMasYr + full.catalogueErrorPmRaMasYr,
    pmDecMasYr: full.pmDecMasYr + full.catalogueErrorPmDecMasYr,
    parallaxMas: full.parallaxMas + full.catalogueErrorParallaxMas,
    parallaxErrorMas: parallaxSigmaMas,
    radialVelocityKmS: Math.round(full.radialVelocityKmS * 10) / 10,
    magnitude: Math.round(random.between(3.5, 7.5) * 100) / 100,
    source: `invented catalogue; position σ ${positionSigmaMas.toFixed(1)} mas, proper motion σ ${pmSigmaMasYr.toFixed(2)} mas/yr`,
    programmes: ['simulated programme'],
    visibility: 'visible', createdUtc, updatedUtc: createdUtc,
  };
  return { truth: full, catalogue };
}
