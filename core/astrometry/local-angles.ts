import { atan2Fast } from './arctangent.ts';
import { NC_COS_LAT, NC_SIN_LAT } from './night-context.ts';
import { LOCAL_STRIDE } from './night-transit-kernel.ts';
import { RESULT_STRIDE } from './reduction-kernel.ts';

const STRIDE = LOCAL_STRIDE, RESULT = RESULT_STRIDE, COS_LAT = NC_COS_LAT, SIN_LAT = NC_SIN_LAT;

/**
 * Observed hour angle, declination, zenith distance and their partials (layout RESULT_STRIDE,
 * reduction-kernel.ts) of the first `count` transits of the hour-angle-frame scratch `local`
 * (night-transit-kernel.ts), written to `out` from transit `first`: as writeAngles in
 * reduction-kernel.ts, with `atan2Fast` (< 1e-15 rad from Math.atan2) and two reciprocals.
 */
export function writeLocalAngles(c: Float64Array, local: Float64Array, count: number, out: Float64Array, first: number): void {
  const cosLat = c[COS_LAT], sinLat = c[SIN_LAT];
  for (let j = 0, o = first * RESULT; j < count * STRIDE; j += STRIDE, o += RESULT) {
    const x = local[j], y = local[j + 1], z = local[j + 2];
    const p0 = local[j + 3], p1 = local[j + 4], p2 = local[j + 5];
    const k0 = local[j + 6], k1 = local[j + 7], k2 = local[j + 8];
    const horizontal2 = x * x + y * y;
    const horizontal = Math.sqrt(horizontal2);
    const cosZ = x * cosLat + z * sinLat;
    const sinZx = x * sinLat - z * cosLat;
    const sinZ = Math.sqrt(sinZx * sinZx + y * y);
    out[o] = atan2Fast(-y, x);
    out[o + 1] = atan2Fast(z, horizontal);
    out[o + 2] = atan2Fast(sinZ, cosZ);
    const inverseH = 1 / horizontal, inverseH2 = inverseH * inverseH, inverseSinZ = 1 / sinZ;
    out[o + 3] = (y * p0 - x * p1) * inverseH2;
    out[o + 4] = p2 * inverseH;
    out[o + 5] = -(p0 * cosLat + p2 * sinLat) * inverseSinZ;
    out[o + 6] = (y * k0 - x * k1) * inverseH2;
    out[o + 7] = k2 * inverseH;
    out[o + 8] = -(k0 * cosLat + k2 * sinLat) * inverseSinZ;
  }
}
