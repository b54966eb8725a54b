/** A probable cause for a large residual, with how well it fits. */
export interface BlunderCandidate {
  readonly cause: 'wire-miscounted' | 'micrometer-turn-miscounted' | 'clock-whole-second' | 'clock-whole-minute' | 'wrong-culmination' | 'wrong-star';
  /** What the cause would produce (s of time for right ascension, rad for zenith distance). */
  readonly expected: number;
  /** |residual − expected| in units of the residual's sigma: smaller fits better. */
  readonly misfitSigma: number;
  /** Human-readable explanation naming the quantity. */
  readonly detail: string;
}

/** What is known about one transit's residuals and the instrument, for blunder hints. */
export interface BlunderContext {
  /** Right-ascension residual O − C (s of time) and its expected sigma (s); null if none. */
  readonly timeResidualS: number | null;
  readonly timeSigmaS: number;
  /** Zenith-distance residual O − C (rad) and sigma (rad); null if none. */
  readonly zenithResidualRad: number | null;
  readonly zenithSigmaRad: number;
  readonly declinationRad: number;
  /** Spacings (s, equatorial) between adjacent wires, and how many wires were observed. */
  readonly adjacentWireSpacingsS: readonly number[];
  readonly observedWireCount: number;
  /** Micrometer value (rad per turn); null for instruments without one. */
  readonly micrometerRadPerTurn: number | null;
  /** Residual (s) of the same observation if it were the other culmination; null if not computed. */
  readonly otherCulminationResidualS: number | null;
  /** Residuals (s) if the observation belonged to each other programme star. */
  readonly otherStarResidualsS: readonly { readonly starId: string; readonly residualS: number }[];
}

/** A candidate is offered when the residual is at least this many sigma and the cause within `fitSigma`. */
const SIGNIFICANT_SIGMA = 5;
const FIT_SIGMA = 3;

function consider(out: BlunderCandidate[], cause: BlunderCandidate['cause'], residual: number, expected: number, sigma: number, detail: string): void {
  const misfitSigma = Math.abs(residual - expected) / sigma;
  if (misfitSigma <= FIT_SIGMA) out.push({ cause, expected, misfitSigma, detail });
}

function timeCandidates(ctx: BlunderContext, r: number, out: BlunderCandidate[]): void {
  const sigma = ctx.timeSigmaS;
  const secant = 1 / Math.abs(Math.cos(ctx.declinationRad));
  const n = Math.max(1, ctx.observedWireCount);
  for (const spacing of new Set(ctx.adjacentWireSpacingsS)) {
    for (const sign of [1, -1]) {
      const expected = (sign * spacing * secant) / n;
      consider(out, 'wire-miscounted', r, expected, sigma, `one of ${n} wire times entered against the neighbouring wire (spacing ${spacing} s × sec δ / ${n})`);
    }
  }
  for (const sign of [1, -1]) {
    consider(out, 'clock-whole-second', r, sign, sigma, `clock reading off by ${sign > 0 ? '+' : '−'}1 s`);
    consider(out, 'clock-whole-minute', r, 60 * sign, sigma, `clock reading off by ${sign > 0 ? '+' : '−'}1 min`);
  }
  if (ctx.otherCulminationResidualS !== null) {
    consider(out, 'wrong-culmination', r, r - ctx.otherCulminationResidualS, sigma, 'logged as the other culmination: the residual vanishes if the culmination is swapped');
  }
  for (const other of ctx.otherStarResidualsS) {
    // "Much better": the other star's prediction fits within FIT_SIGMA while this one does not.
    if (Math.abs(other.residualS) <= FIT_SIGMA * sigma) {
      consider(out, 'wrong-star', r, r - other.residualS, sigma, `the observation fits programme star ${other.starId} (residual ${other.residualS.toFixed(3)} s)`);
    }
  }
}

/**
 * Names probable causes of a large residual (pure; nothing is changed): a wire miscounted
 * (≈ spacing·sec δ / wires observed), a micrometer turn miscounted (≈ ±1 turn × value), the
 * clock off by a whole second or minute, the wrong culmination, or the wrong star (another
 * programme star's prediction fits). Residuals under 5σ get no hints; candidates fit within 3σ
 * and are sorted best first. These are common practice checks at the telescope, not a test.
 */
export function blunderHints(ctx: BlunderContext): BlunderCandidate[] {
  const out: BlunderCandidate[] = [];
  const r = ctx.timeResidualS;
  if (r !== null && Math.abs(r) >= SIGNIFICANT_SIGMA * ctx.timeSigmaS) timeCandidates(ctx, r, out);
  const z = ctx.zenithResidualRad;
  if (z !== null && ctx.micrometerRadPerTurn !== null && Math.abs(z) >= SIGNIFICANT_SIGMA * ctx.zenithSigmaRad) {
    for (const turns of [1, -1, 2, -2]) {
      consider(out, 'micrometer-turn-miscounted', z, turns * ctx.micrometerRadPerTurn, ctx.zenithSigmaRad, `micrometer turns miscounted by ${turns}`);
    }
  }
  return out.sort((p, q) => p.misfitSigma - q.misfitSigma);
}
