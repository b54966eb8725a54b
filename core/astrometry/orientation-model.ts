import type { EarthOrientation } from './earth-orientation.ts';
import type { AstrometricInstant } from './instant.ts';

/**
 * Supplies the Earth orientation (NPB, GAST, polar-motion matrix) of an instant. The IAU 2006/2000A
 * implementation is `iauEarthOrientation`; tests may pass reference values instead.
 */
export type EarthOrientationModel = (instant: AstrometricInstant) => EarthOrientation;
