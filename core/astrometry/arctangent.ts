/** Table nodes on [0, 1]: the remainder after the nearest node is at most 1/128 in the ratio. */
const NODES = 64;
const nodeAtan = new Float64Array(NODES + 1);
for (let k = 0; k <= NODES; k++) nodeAtan[k] = Math.atan(k / NODES);
const HALF_PI = Math.PI / 2;
const PI = Math.PI;

/**
 * atan2(y, x) in (−π, π] without a library call. The octant is found from the signs and the
 * larger of |x| and |y|; the ratio t ∈ [0, 1] is split at the nearest of 64 table nodes
 * cₖ = k/64, atan t = atan cₖ + atan r with r = (t − cₖ)/(1 + t·cₖ), |r| ≤ 1/128, and atan r from
 * its Taylor series to r⁹ (truncation r¹¹/11 < 6e-25). Two divisions, no trigonometric call.
 * Error: a few units in the last place (< 1e-15 rad, measured against Math.atan2 in
 * unit/astrometry/arctangent.test.ts). Common practice for table-driven inverse trigonometry; the
 * batch kernel takes three per transit, where Math.atan2 costs ~15 ns each. Both arguments zero
 * or not finite: Math.atan2's answer.
 */
export function atan2Fast(y: number, x: number): number {
  const ax = Math.abs(x), ay = Math.abs(y);
  const swap = ay > ax;
  const big = swap ? ay : ax;
  if (!(big > 0 && big < Infinity)) return Math.atan2(y, x);
  const t = (swap ? ax : ay) / big;
  const k = Math.round(t * NODES);
  const node = k * (1 / NODES);
  const r = (t - node) / (1 + t * node);
  const r2 = r * r;
  let angle = nodeAtan[k] + r * (1 - r2 * (1 / 3 - r2 * (1 / 5 - r2 * (1 / 7 - r2 * (1 / 9)))));
  if (swap) angle = HALF_PI - angle;
  if (x < 0) angle = PI - angle;
  return y < 0 || (y === 0 && 1 / y < 0) ? -angle : angle;
}
