/** A value with its σ for a table cell ("12.34 ± 0.56"), or an em dash for a term not estimated. */
export function withSigma(value: number | null | undefined, sigma: number | null | undefined, digits: number): string {
  if (value == null) return '—';
  return sigma == null ? value.toFixed(digits) : `${value.toFixed(digits)} ± ${sigma.toFixed(digits)}`;
}

/** A signed number of σ ("+1.3σ"), or an em dash. */
export function inSigmas(value: number | null): string {
  return value === null ? '—' : `${value >= 0 ? '+' : '−'}${Math.abs(value).toFixed(1)}σ`;
}
