/** Below this, ln Γ is shifted up by the recurrence before the asymptotic series is used. */
const SERIES_START = 15;

/**
 * Coefficients B_2k / (2k(2k−1)) of Stirling's series from the Bernoulli numbers B2 = 1/6,
 * B4 = −1/30, B6 = 1/42, B8 = −1/30, B10 = 5/66, B12 = −691/2730, B14 = 7/6 (A&S 6.1.41, 23.2).
 */
const STIRLING = [1 / 12, -1 / 360, 1 / 1260, -1 / 1680, 1 / 1188, -691 / 360360, 1 / 156];

/**
 * ln Γ(x) for finite x > 0: the recurrence Γ(x) = Γ(x+n)/(x(x+1)…(x+n−1)) (A&S 6.1.15) brings
 * the argument to ≥ 15, where Stirling's series (A&S 6.1.41) truncated after the x⁻¹³ term is
 * accurate to ~1e-19 (first omitted term |B16|/(240·15¹⁵)). Overall ~2e-16 relative to
 * max(1, |ln Γ(x)|). Throws for x ≤ 0 or non-finite x: the solver's statistics never need them.
 */
export function logGamma(x: number): number {
  if (!(x > 0 && Number.isFinite(x))) throw new RangeError(`logGamma: x = ${x}; pass a finite positive number`);
  let shift = 0;
  let product = 1;
  let z = x;
  while (z < SERIES_START) {
    product *= z;
    z += 1;
    shift++;
  }
  const inverse = 1 / z;
  const inverse2 = inverse * inverse;
  let series = 0;
  for (let k = STIRLING.length - 1; k >= 0; k--) series = series * inverse2 + STIRLING[k];
  const stirling = (z - 0.5) * Math.log(z) - z + 0.5 * Math.log(2 * Math.PI) + series * inverse;
  return shift > 0 ? stirling - Math.log(product) : stirling;
}
