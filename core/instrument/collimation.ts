import { clampSign } from './culmination.ts';
import type { ClampPosition } from './culmination.ts';

/**
 * Collimation c (rad, clamp-west convention of mayer.ts) from one star observed in both clamp
 * positions: with θ_W, θ_E the clock-corrected sidereal times of the mean wire (rad of hour
 * angle) and the levels in each position, Mayer's formula for both gives
 * c = [(θ_E − θ_W) + (b_E − b_W)·B] / (2C). `levelFactor` B and `collimationFactor` C from
 * mayerFactors() for this star and culmination. Source: Mayer's formula (see mayer.ts).
 */
export function collimationFromReversal(
  siderealTimeClampWestRad: number,
  siderealTimeClampEastRad: number,
  levelClampWestRad: number,
  levelClampEastRad: number,
  levelFactor: number,
  collimationFactor: number,
): number {
  return (siderealTimeClampEastRad - siderealTimeClampWestRad + (levelClampEastRad - levelClampWestRad) * levelFactor) / (2 * collimationFactor);
}

/**
 * Collimation c (rad) from a horizontal collimator: the micrometer wire is set on the
 * collimator's cross with clamp west (reading M_W) and clamp east (M_E); M0 is the reading at
 * which the micrometer wire coincides with the mean wire. `sense` is +1 when increasing readings
 * move the micrometer wire EAST with clamp west. The collimator's own direction cancels:
 * c = −sense·scale·((M_W + M_E)/2 − M0) (our derivation from the definitions in mayer.ts; the
 * method is the classical one, Chauvenet vol. II, collimators).
 */
export function collimationFromCollimator(
  readingClampWestTurns: number,
  readingClampEastTurns: number,
  meanWireReadingTurns: number,
  scaleRadPerTurn: number,
  sense: 1 | -1,
): number {
  return -sense * scaleRadPerTurn * ((readingClampWestTurns + readingClampEastTurns) / 2 - meanWireReadingTurns);
}

/**
 * The nadir quantity b − (±c) (rad) from a mercury-horizon observation: pointing at the nadir, the
 * mean wire and its image reflected in the mercury are separated by twice the line of sight's
 * offset from the vertical plane of the axis. `imageMinusWireWestRad` is the image's
 * displacement relative to the wire, positive toward the west end of the axis.
 * Derivation (ours, from the definitions of mayer.ts): the line of sight L has L·W′ = −c and the
 * nadir N has N·W′ = −b, so L lies b − c west of N and its image as far east:
 * b − c = −½·(image − wire). CAUTION: mercury is toxic — handle it over a tray, ventilate, and
 * follow the observatory's own safety rules.
 */
export function nadirLevelMinusCollimationRad(imageMinusWireWestRad: number): number {
  return -imageMinusWireWestRad / 2;
}

/** Level b (rad) from the nadir quantity and a known collimation (clamp-west convention). */
export function levelFromNadir(nadirLevelMinusCollimation: number, collimationRad: number, clamp: ClampPosition): number {
  return nadirLevelMinusCollimation + clampSign(clamp) * collimationRad;
}

/** Collimation c (rad, clamp-west convention) from the nadir quantity and a known level. */
export function collimationFromNadir(nadirLevelMinusCollimation: number, levelRad: number, clamp: ClampPosition): number {
  return clampSign(clamp) * (levelRad - nadirLevelMinusCollimation);
}
