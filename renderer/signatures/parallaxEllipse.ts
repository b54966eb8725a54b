/** Tropical year in days (common practice for an annual term; the anomalistic year differs by 0.01 %). */
export const YEAR_DAYS = 365.25;

export interface AnnualFit {
  readonly constant: number;
  readonly cosine: number;
  readonly sine: number;
}

/**
 * Least-squares fit of y(t) = constant + cosine·cos(2πt/yr) + sine·sin(2πt/yr) (t in days).
 * A parallax factor is a linear function of Earth's barycentric position, so over a year it is
 * such a sinusoid to the orbit's eccentricity (0.0167: the fit's residual is ≲ 2 % of the amplitude).
 * Throws when fewer than three instants are given or when they do not span enough of the year
 * (the normal matrix is singular): the ellipse is then undetermined.
 */
export function fitAnnual(tDays: readonly number[], y: readonly number[]): AnnualFit {
  if (tDays.length !== y.length) throw new Error(`fitAnnual: ${tDays.length} instants but ${y.length} values; give one value per instant.`);
  if (tDays.length < 3) throw new Error(`fitAnnual: ${tDays.length} instants; an annual sinusoid needs at least 3 spread over the year.`);
  const n = [[0, 0, 0], [0, 0, 0], [0, 0, 0]], r = [0, 0, 0];
  for (let k = 0; k < tDays.length; k++) {
    const phase = (2 * Math.PI * tDays[k]) / YEAR_DAYS;
    const row = [1, Math.cos(phase), Math.sin(phase)];
    for (let i = 0; i < 3; i++) {
      r[i] += row[i] * y[k];
      for (let j = 0; j < 3; j++) n[i][j] += row[i] * row[j];
    }
  }
  const s = solve3(n, r);
  if (s === null) throw new Error('fitAnnual: the instants cover too little of the year to fit an annual sinusoid (singular normal matrix).');
  return { constant: s[0], cosine: s[1], sine: s[2] };
}

/** Cramer's rule on a 3×3 system; null when the determinant is below 1e-12 of the matrix's scale. */
function solve3(a: number[][], b: number[]): [number, number, number] | null {
  const det = (m: number[][]) =>
    m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
  const d = det(a);
  const scale = Math.abs(a[0][0] * a[1][1] * a[2][2]);
  if (!(Math.abs(d) > 1e-12 * scale)) return null;
  const column = (i: number) => a.map((row, k) => row.map((v, j) => (j === i ? b[k] : v)));
  return [det(column(0)) / d, det(column(1)) / d, det(column(2)) / d];
}

/**
 * The closed parallax ellipse of one star from its parallax factors at the observed instants:
 * each factor (∂(α cos δ)/∂ϖ, ∂δ/∂ϖ, dimensionless: mas per mas of parallax) is fitted with an
 * annual sinusoid and the pair is sampled at `samples` phases over one year. The result is the path
 * a star of 1 mas parallax traces on the sky, in mas; multiply by the parallax for the real one.
 */
export function parallaxEllipsePoints(
  factors: { readonly ttDaysSinceJ2000: readonly number[]; readonly raFactor: readonly number[]; readonly decFactor: readonly number[] },
  samples = 73,
): [number, number][] {
  if (!(samples >= 3)) throw new Error(`parallaxEllipsePoints: samples must be ≥ 3, got ${samples}.`);
  const ra = fitAnnual(factors.ttDaysSinceJ2000, factors.raFactor);
  const dec = fitAnnual(factors.ttDaysSinceJ2000, factors.decFactor);
  const points: [number, number][] = [];
  for (let i = 0; i <= samples; i++) {
    const phase = (2 * Math.PI * i) / samples;
    const c = Math.cos(phase), s = Math.sin(phase);
    points.push([ra.constant + ra.cosine * c + ra.sine * s, dec.constant + dec.cosine * c + dec.sine * s]);
  }
  return points;
}
