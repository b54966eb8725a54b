import type { InstrumentRecord } from '../formats/site-description.ts';
import type { Culmination } from '../instrument/culmination.ts';
import { reduceCameraCrossing } from '../instrument/fixed-camera.ts';
import type { CameraGeometry } from '../instrument/fixed-camera.ts';
import { reduceToMeanWire } from '../instrument/wire-reduction.ts';
import type { ClockTimeScale, MeanWireReduction, WireObservation } from '../instrument/wire-reduction.ts';
import { SECOND_OF_TIME_ANGLE } from '../units.ts';

/**
 * Smallest |cos orientation| accepted (cos 80°): at 90° the reference column runs along the
 * stars' diurnal motion and no star crosses it; near it the crossing time amplifies the row
 * noise by 1/|cos θ|.
 */
const SMALLEST_COS_ORIENTATION = Math.cos((80 * Math.PI) / 180);

/** A camera transit reduced to what the rest of the nightly reduction uses for any instrument. */
export interface CameraTransitReading {
  /** The crossing reduced to the instrument's meridian (ξ = 0), as a one-wire mean wire. */
  readonly meanWire: MeanWireReduction;
  /** Zenith-distance offset (rad) from the optical axis on the meridian: the observed z less the zero point. */
  readonly zenithFromReadingRad: number;
  /** Along-track offset ξ (rad, west at upper culmination) of the star at the crossing. */
  readonly alongTrackRad: number;
}

/** The camera's geometry with the plate scale of its pixel zenith scale; throws when either is missing or degenerate. */
export function cameraGeometryOf(instrument: InstrumentRecord): CameraGeometry {
  const { camera, zenithScale } = instrument;
  if (camera === null) throw new RangeError(`instrument '${instrument.id}' is a fixed camera without its camera geometry; add camera {orientationDeg, parity, opticalCentrePx, referenceColumnPx} to the site description`);
  if (zenithScale === null || zenithScale.unit !== 'pixel') throw new RangeError(`instrument '${instrument.id}' is a fixed camera without a zenithScale in pixels; add zenithScale {unit: 'pixel', arcsecPerUnit, sense} to the site description`);
  if (Math.abs(Math.cos((camera.orientationDeg * Math.PI) / 180)) < SMALLEST_COS_ORIENTATION) {
    throw new RangeError(`instrument '${instrument.id}': camera orientation ${camera.orientationDeg}° puts the reference column within 10° of the stars' motion, so the crossing is not defined; check orientationDeg (the angle from the detector's +x axis to the along-track direction)`);
  }
  return { scaleArcsecPerPx: zenithScale.arcsecPerUnit, orientationDeg: camera.orientationDeg, parity: camera.parity, opticalCentrePx: camera.opticalCentrePx, referenceColumnPx: camera.referenceColumnPx };
}

/**
 * Reduces one fixed-camera transit: the single time at which the star's centroid crossed the
 * reference column (clock or UTC seconds of the night) and its row reading `offsetPx`, where
 * sense·offsetPx = y − y0 is the centroid's row less the optical centre's row (so a camera at
 * orientation 0° without mirror reads z − z0 directly, as before the geometry was used).
 *
 * The detector point (reference column, row) is mapped to the sky by reduceCameraCrossing
 * (fixed-camera.ts: orientation, parity, optical centre). The along-track offset ξ acts as a wire
 * at equatorial distance −ξ (a wire with positive interval lies east and is crossed first,
 * wire-reduction.ts), so culmination and the clock's time scale are handled by reduceToMeanWire;
 * a camera is not reversed, so the wire sign is that of clamp west whatever the row says.
 * The row offset η is taken back to the meridian along the star's diurnal circle, which bends
 * toward the pole by ½ξ² tan δ from the great circle through the star perpendicular to the meridian
 * (second-order geometry of the small circle; Smart, Text-Book on Spherical Astronomy, ch. on
 * transit instruments, curvature of a star's path across the field). The sign in z follows the
 * side and culmination (`zenithPerDeclination` = ∂z/∂δ, ±1).
 * Accuracy: tangent-plane mapping to ξ³/3 and η·ξ² (≤ 0.02″ for offsets ≤ 0.5°).
 */
export function reduceCameraTransit(
  wires: readonly WireObservation[],
  offsetPx: number | null,
  geometry: CameraGeometry,
  sense: 1 | -1,
  declinationRad: number,
  culmination: Culmination,
  zenithPerDeclination: 1 | -1,
  clockTimeScale: ClockTimeScale,
): CameraTransitReading {
  if (wires.length !== 1 || wires[0].wireIndex !== 0) {
    throw new RangeError(`a fixed camera times one crossing of its reference column per transit; give only the first time column (${wires.length} times given)`);
  }
  if (offsetPx === null) throw new RangeError('a fixed camera needs the row offset (offsetPx) of each crossing: the crossing time and the zenith distance both depend on it');
  const rowPx = geometry.opticalCentrePx[1] + sense * offsetPx;
  const sky = reduceCameraCrossing(wires[0].clockTimeS, rowPx, declinationRad, geometry, clockTimeScale);
  const meanWire = reduceToMeanWire(wires, [-sky.alongTrackRad / SECOND_OF_TIME_ANGLE], declinationRad, culmination, 'west', clockTimeScale);
  const bendRad = 0.5 * sky.alongTrackRad * sky.alongTrackRad * Math.tan(declinationRad);
  return { meanWire, zenithFromReadingRad: sky.zenithOffsetRad - zenithPerDeclination * bendRad, alongTrackRad: sky.alongTrackRad };
}
