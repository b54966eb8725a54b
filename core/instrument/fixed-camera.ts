import { ARCSEC, SECOND_OF_TIME_ANGLE } from '../units.ts';
import { wireHourAngleIntervalRad, STELLAR_REVOLUTIONS_PER_UT1_DAY } from './wire-reduction.ts';
import type { ClockTimeScale } from './wire-reduction.ts';

/**
 * Geometry of a fixed camera. Pixel coordinates (x, y) map to the tangent plane through the
 * optical axis as [ξ, η] = scale·Rot(orientation)·[parity·(x − x0), y − y0], where ξ is the offset
 * along the stars' diurnal motion (west at upper culmination) and η the offset toward increasing
 * zenith distance. `orientationDeg` is the angle from the detector's +x axis (after parity) to the
 * ξ direction, counter-clockwise seen on the sky; `parity` −1 for a mirrored image.
 * The reference line is the detector column x = referenceColumnPx.
 */
export interface CameraGeometry {
  readonly scaleArcsecPerPx: number;
  readonly orientationDeg: number;
  readonly parity: 1 | -1;
  readonly opticalCentrePx: readonly [number, number];
  readonly referenceColumnPx: number;
}

/** A fixed-camera crossing reduced like a one-wire transit plus a micrometer reading. */
export interface CameraCrossingReduction {
  /** Clock time (s) at which the star crossed the instrument's meridian (ξ = 0). */
  readonly meridianTimeS: number;
  /** Offset (rad) of the star from the optical axis toward larger zenith distance: add to z0. */
  readonly zenithOffsetRad: number;
  /** The star's along-track offset from the optical axis at the crossing (rad). */
  readonly alongTrackRad: number;
}

/**
 * Reduces a crossing of the reference column at clock time `crossingTimeS` with the centroid at
 * row `centroidRowPx`: the along-track offset ξ at the crossing acts as a wire at equatorial
 * distance ξ (hour angle from sin I = sin ξ sec δ, wire-reduction.ts), and η gives the zenith
 * distance offset like a micrometer reading. Source: the one-wire transit reduction (Chauvenet,
 * vol. II) applied to a detector — the camera mapping itself is ours (common practice in plate
 * reduction, first order in the tangent plane: error ≤ ξ³/3, 0.01″ for ξ = 0.5°).
 */
export function reduceCameraCrossing(
  crossingTimeS: number,
  centroidRowPx: number,
  declinationRad: number,
  camera: CameraGeometry,
  clockTimeScale: ClockTimeScale,
): CameraCrossingReduction {
  if (!(camera.scaleArcsecPerPx > 0)) throw new RangeError(`reduceCameraCrossing: plate scale ${camera.scaleArcsecPerPx} arcsec/px must be > 0`);
  const dx = camera.parity * (camera.referenceColumnPx - camera.opticalCentrePx[0]);
  const dy = centroidRowPx - camera.opticalCentrePx[1];
  const theta = (camera.orientationDeg * Math.PI) / 180;
  const scaleRad = camera.scaleArcsecPerPx * ARCSEC;
  // Rotating detector axes by the orientation angle gives the sky axes (ξ along track, η in z).
  const alongTrackRad = scaleRad * (Math.cos(theta) * dx + Math.sin(theta) * dy);
  const zenithOffsetRad = scaleRad * (-Math.sin(theta) * dx + Math.cos(theta) * dy);
  const hourAngleRad = wireHourAngleIntervalRad(alongTrackRad, declinationRad);
  const clockPerSidereal = clockTimeScale === 'sidereal' ? 1 : 1 / STELLAR_REVOLUTIONS_PER_UT1_DAY;
  // The star is ahead of the meridian by the hour angle I, so it crossed the meridian I earlier.
  const meridianTimeS = crossingTimeS - (hourAngleRad / SECOND_OF_TIME_ANGLE) * clockPerSidereal;
  return { meridianTimeS, zenithOffsetRad, alongTrackRad };
}
