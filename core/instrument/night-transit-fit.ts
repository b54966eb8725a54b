import { SECOND_OF_TIME_ANGLE } from '../units.ts';
import { clampSign } from './culmination.ts';
import type { ClampPosition, Culmination } from './culmination.ts';
import { mayerFactors } from './mayer.ts';
import { solveLeastSquares } from './small-least-squares.ts';

/** One transit for a night fit: a sidereal-clock mean-wire time and the star's apparent place. */
export interface NightTransit {
  /** Apparent right ascension of date (s of time, 0–86400). */
  readonly rightAscensionS: number;
  readonly declinationRad: number;
  /** Sidereal clock reading of the mean wire (s), after personal equation and diurnal aberration. */
  readonly clockTimeS: number;
  readonly culmination: Culmination;
  readonly clamp: ClampPosition;
  /** Level b of the axis at this transit (rad, west end high), from the striding level. */
  readonly levelRad: number;
  /** Relative weight (1 when unknown). */
  readonly weight?: number;
}

/** Night constants in seconds of time with formal errors (s) and residuals (s). */
export interface NightTransitSolution {
  readonly referenceClockS: number;
  readonly clockOffsetS: number;
  readonly clockRateSPerS: number;
  readonly azimuthS: number;
  readonly collimationS: number;
  readonly sigmas: { readonly clockOffsetS: number; readonly clockRateSPerS: number; readonly azimuthS: number; readonly collimationS: number };
  readonly residualsS: readonly number[];
  readonly unitWeightError: number | null;
}

/** α − T reduced to (−43200, 43200] s: the clock may be read modulo one sidereal day. */
function wrapSeconds(s: number): number {
  const day = 86_400;
  const wrapped = ((((s + day / 2) % day) + day) % day) - day / 2;
  return wrapped === -day / 2 ? day / 2 : wrapped;
}

/**
 * The classical per-night solution of a time determination: with b from the level, solve
 * α − [T + b·B] = ΔT + r·(T − T0) + a·A ± c·C for clock correction ΔT, rate r, azimuth a and
 * collimation c (Mayer's formula with rate; H. E. Burton, Theory of the astronomical transit
 * instrument (1903), p. 72). ΔT and b cannot all be free with a: 1, A and B are linearly
 * dependent through tan δ, which is why b comes from the level. Lower culminations use α + 12 h.
 * Needs both clamp positions or a wide spread of sec δ to separate c.
 */
export function fitNightTransits(transits: readonly NightTransit[], latitudeRad: number): NightTransitSolution {
  if (transits.length < 4) throw new RangeError(`fitNightTransits: ${transits.length} transits; at least 4 are needed for clock offset, rate, azimuth and collimation`);
  const t0 = transits.reduce((s, t) => s + (t.clockTimeS - transits[0].clockTimeS), 0) / transits.length + transits[0].clockTimeS;
  const design: number[][] = [];
  const y: number[] = [];
  for (const t of transits) {
    const f = mayerFactors(latitudeRad, t.declinationRad, t.culmination);
    const alpha = t.rightAscensionS + (t.culmination === 'lower' ? 43_200 : 0);
    y.push(wrapSeconds(alpha - t.clockTimeS - (t.levelRad * f.levelFactor) / SECOND_OF_TIME_ANGLE));
    design.push([1, t.clockTimeS - t0, f.azimuthFactor, clampSign(t.clamp) * f.collimationFactor]);
  }
  const weights = transits.map((t) => t.weight ?? 1);
  const solution = solveLeastSquares(design, y, weights, ['clock offset', 'clock rate', 'azimuth', 'collimation']);
  const [offset, rate, azimuth, collimation] = solution.parameters;
  const sigma = (i: number): number => Math.sqrt(solution.covariance[i][i]);
  return {
    referenceClockS: t0,
    clockOffsetS: offset,
    clockRateSPerS: rate,
    azimuthS: azimuth,
    collimationS: collimation,
    sigmas: { clockOffsetS: sigma(0), clockRateSPerS: sigma(1), azimuthS: sigma(2), collimationS: sigma(3) },
    residualsS: solution.residuals,
    unitWeightError: solution.unitWeightError,
  };
}
