import { apply, applyTranspose, rotationX, type Mat3 } from '../../../core/math/mat3.ts';
import { fromSpherical, toSpherical } from '../../../core/math/vec3.ts';
import { ARCSEC, DEG, TAU } from '../../../core/units.ts';
import { TaskCancelledError, type TaskControl } from '../../../core/task/task-control.ts';

/**
 * Mean obliquity of the ecliptic at J2000.0, 84381.406″ (IAU 2006 precession, Capitaine et al.
 * 2003, A&A 412, 567; IERS Conventions 2010 eq. 5.40).
 */
export const MEAN_OBLIQUITY_J2000_RAD = 84_381.406 * ARCSEC;

/** How many stars the task converts between two progress reports and yields to the host. */
export const ECLIPTIC_FIELD_CHUNK = 20_000;

/** Stars within this ecliptic latitude count as "near the ecliptic" (Moon and planets pass there). */
export const NEAR_ECLIPTIC_LIMIT_RAD = 5 * DEG;

export interface EclipticFieldRequest {
  readonly kind: 'ecliptic-field';
  /** Number of synthetic stars, a positive integer. */
  readonly starCount: number;
  /** Seed of the generator that places the stars, an integer in [1, 2³¹ − 2]. */
  readonly seed: number;
}

export interface EclipticFieldResult {
  readonly kind: 'ecliptic-field';
  readonly starCount: number;
  /** Stars with |ecliptic latitude| below NEAR_ECLIPTIC_LIMIT_RAD. */
  readonly nearEclipticCount: number;
  /** Largest angle between a star and its equatorial → ecliptic → equatorial round trip, radians. */
  readonly maxRoundTripErrorRad: number;
}

/**
 * Ecliptic longitude and latitude (radians) of an equatorial direction: the frame rotated by
 * +ε about the x axis (the equinox), λ = atan2(sin α cos ε + tan δ sin ε, cos α) (Meeus,
 * Astronomical Algorithms, eq. 13.1). `obliquityRad` is the mean obliquity of the equinox used.
 */
export function equatorialToEcliptic(raRad: number, decRad: number, obliquityRad: number) {
  const ecliptic = toSpherical(apply(rotationX(obliquityRad), fromSpherical(raRad, decRad)));
  return { longitudeRad: ecliptic.alphaRad, latitudeRad: ecliptic.deltaRad };
}

/** Park–Miller minimal standard generator (Park & Miller 1988, CACM 31, 1192): uniform in (0, 1). */
export function parkMiller(seed: number): () => number {
  if (!Number.isInteger(seed) || seed < 1 || seed > 2_147_483_646) {
    throw new RangeError(`parkMiller: seed must be an integer in [1, 2147483646], got ${seed}`);
  }
  let state = seed;
  return () => {
    state = (state * 48_271) % 2_147_483_647;
    return state / 2_147_483_647;
  };
}

function checkRequest(request: EclipticFieldRequest): void {
  if (!Number.isInteger(request.starCount) || request.starCount < 1) {
    throw new RangeError(`ecliptic-field: starCount must be a positive integer, got ${request.starCount}`);
  }
}

/**
 * A worker self-test that does real work: places `starCount` stars uniformly on the sphere,
 * converts each to ecliptic coordinates and back (core/math rotations), and counts the stars near
 * the ecliptic. Reports progress per chunk; throws TaskCancelledError when cancelled.
 */
export async function runEclipticField(request: EclipticFieldRequest, control: TaskControl): Promise<EclipticFieldResult> {
  checkRequest(request);
  const random = parkMiller(request.seed);
  const rotation: Mat3 = rotationX(MEAN_OBLIQUITY_J2000_RAD);
  const sinNearLimit = Math.sin(NEAR_ECLIPTIC_LIMIT_RAD);
  let nearEclipticCount = 0;
  let maxRoundTripErrorRad = 0;
  for (let done = 0; done < request.starCount; ) {
    if (control.cancellation.isCancelled) throw new TaskCancelledError('ecliptic-field', done);
    const end = Math.min(request.starCount, done + ECLIPTIC_FIELD_CHUNK);
    for (; done < end; done++) {
      // Uniform on the sphere: α uniform, sin δ uniform.
      const equatorial = fromSpherical(TAU * random(), Math.asin(2 * random() - 1));
      const ecliptic = apply(rotation, equatorial);
      if (Math.abs(ecliptic[2]) < sinNearLimit) nearEclipticCount++;
      const back = applyTranspose(rotation, ecliptic);
      const error = Math.hypot(back[0] - equatorial[0], back[1] - equatorial[1], back[2] - equatorial[2]);
      if (error > maxRoundTripErrorRad) maxRoundTripErrorRad = error;
    }
    control.reportProgress(done, request.starCount);
    await control.yieldToHost();
  }
  return { kind: 'ecliptic-field', starCount: request.starCount, nearEclipticCount, maxRoundTripErrorRad };
}
