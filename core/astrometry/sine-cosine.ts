import { TAU } from '../units.ts';

/** Table nodes per turn: the remainder after the nearest node is at most π/256 = 0.0123 rad. */
const NODES = 256;
const STEP = TAU / NODES;
const INVERSE_STEP = NODES / TAU;
// 2π in two parts (Cody & Waite range reduction): TAU_HIGH is 2π with the low 28 bits of its
// significand cleared, so n·TAU_HIGH is exact for |n| < 2^28; TAU_LOW = 2π − TAU_HIGH to double
// precision (both from 2π to 50 digits).
const TAU_HIGH = 6.283185243606567;
const TAU_LOW = 6.357301909411278e-8;
const nodeCos = new Float64Array(NODES + 1);
const nodeSin = new Float64Array(NODES + 1);
/** The table, for kernels that inline `sinCos` by hand (night-transit-kernel.ts). */
export { NODES as SINE_TABLE_NODES, nodeCos as sineTableCos, nodeSin as sineTableSin, TAU_HIGH as SINE_TAU_HIGH, TAU_LOW as SINE_TAU_LOW };
for (let k = 0; k <= NODES; k++) {
  nodeCos[k] = Math.cos(k * STEP);
  nodeSin[k] = Math.sin(k * STEP);
}

/**
 * cos θ and sin θ of `angleRad` (finite, |θ| < 10⁶ rad) into out[0] and out[1], without a library
 * call: θ is reduced to [0, 2π) with a two-part 2π, split as θ = θₖ + r at the nearest of 256
 * table nodes θₖ = k·2π/256 (|r| ≤ 0.0123 rad), and cos/sin of r from their Taylor series to r⁶
 * and r⁵ (truncation below 1e-17); the angle-addition formulas combine the two. Error: a few
 * units in the last place (< 1e-15 absolute; measured against Math.cos/Math.sin in
 * unit/astrometry/sine-cosine.test.ts). Common practice for table-driven trigonometry; used by the
 * batch kernel where a library call per transit costs as much as the rest of the rotation.
 */
export function sinCos(angleRad: number, out: Float64Array): void {
  const turns = Math.floor(angleRad * (1 / TAU));
  const reduced = angleRad - turns * TAU_HIGH - turns * TAU_LOW;
  const k = Math.round(reduced * INVERSE_STEP);
  const r = reduced - k * STEP;
  const r2 = r * r;
  const cosR = 1 - r2 * (0.5 - r2 * (1 / 24 - r2 * (1 / 720)));
  const sinR = r * (1 - r2 * (1 / 6 - r2 * (1 / 120)));
  // k is −1…256 after rounding at the ends of the turn; node 256 equals node 0 and −1 is folded.
  const index = k < 0 ? k + NODES : k;
  const c = nodeCos[index], s = nodeSin[index];
  out[0] = c * cosR - s * sinR;
  out[1] = s * cosR + c * sinR;
}
