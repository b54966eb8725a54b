/** Table nodes cₖ = k/64 on [−1, 1]: the remainder after the nearest node is at most 1/128 in the ratio. */
const NODES = 64;
const nodeAtan = new Float64Array(2 * NODES + 1);
for (let k = -NODES; k <= NODES; k++) nodeAtan[k + NODES] = Math.atan(k / NODES);
const HALF_PI = Math.PI / 2;
const PI = Math.PI;

/**
 * atan2(y, x) in (−π, π] without a library call. With |y| ≤ |x| it is atan(y/x), plus ±π for
 * x < 0; otherwise ±π/2 − atan(x/y). The signed ratio t ∈ [−1, 1] is split at the nearest of 129
 * table nodes cₖ = k/64, atan t = atan cₖ + atan r with r = (t − cₖ)/(1 + t·cₖ), |r| ≤ 1/128, and
 * atan r from its Taylor series to r⁹ (truncation r¹¹/11 < 6e-25). Two divisions, no
 * trigonometric call, and no branch on the sign of y where |y| ≤ x (an hour angle near the
 * meridian, either side). Error: a few units in the last place (< 1e-15 rad, measured against
 * Math.atan2 in unit/astrometry/arctangent.test.ts). Common practice for table-driven inverse
 * trigonometry; the batch kernel takes three per transit, where Math.atan2 costs ~15 ns each.
 * y zero (either sign) or an argument not finite: Math.atan2's answer.
 */
export function atan2Fast(y: number, x: number): number {
  const ax = Math.abs(x), ay = Math.abs(y);
  const swap = ay > ax;
  const big = swap ? ay : ax;
  if (!(big > 0 && big < Infinity) || y === 0) return Math.atan2(y, x);
  const t = swap ? x / y : y / x;
  const k = Math.round(t * NODES);
  const node = k * (1 / NODES);
  const r = (t - node) / (1 + t * node);
  const r2 = r * r;
  const angle = nodeAtan[k + NODES] + r * (1 - r2 * (1 / 3 - r2 * (1 / 5 - r2 * (1 / 7 - r2 * (1 / 9)))));
  if (swap) return (y > 0 ? HALF_PI : -HALF_PI) - angle;
  if (x > 0) return angle;
  // x < 0: the far side of the cut; the sign of y picks +π or −π.
  return (y > 0 ? PI : -PI) + angle;
}
