import { ARCSEC } from '../units.ts';

/**
 * One setting of the striding level: the divisions of the bubble's WEST and EAST ends, each
 * counted from the middle of the tube outward (the scale numbered both ways from the centre).
 */
export interface LevelSetting {
  readonly westDiv: number;
  readonly eastDiv: number;
}

/** Readings in the direct and the reversed (end-for-end) position of the level. */
export interface StridingLevelReadings {
  readonly direct: readonly LevelSetting[];
  readonly reversed: readonly LevelSetting[];
  /** Value of one division (arcsec per division), from the level's calibration. */
  readonly divisionArcsec: number;
}

/**
 * Inclination b of the axis (rad), positive when the WEST end is high:
 * b = d·(Σw − Σe)/n with n the number of end readings, i.e. b = (d/4)[(w + w′) − (e + e′)] for one
 * direct and one reversed setting. Reversal cancels the level's own error (the inequality of its
 * legs), which is why the direct and reversed counts must match. Pivot inequality is not included.
 * Source: Chauvenet, Manual of Spherical and Practical Astronomy, vol. II (striding level);
 * worked example in H. E. Burton, Theory of the astronomical transit instrument (1903), p. 32.
 */
export function levelFromStridingReadings(readings: StridingLevelReadings): number {
  const { direct, reversed, divisionArcsec } = readings;
  if (direct.length === 0 || direct.length !== reversed.length) {
    throw new RangeError(
      `levelFromStridingReadings: ${direct.length} direct and ${reversed.length} reversed settings; give the same non-zero number of each so the level's own error cancels`,
    );
  }
  if (!(divisionArcsec > 0) || !Number.isFinite(divisionArcsec)) {
    throw new RangeError(`levelFromStridingReadings: division value ${divisionArcsec} arcsec must be a positive number from the level's calibration`);
  }
  const all = [...direct, ...reversed];
  for (const [i, s] of all.entries()) {
    if (!Number.isFinite(s.westDiv) || !Number.isFinite(s.eastDiv)) {
      throw new RangeError(`levelFromStridingReadings: setting ${i + 1} has a non-finite reading (${s.westDiv}, ${s.eastDiv})`);
    }
  }
  const westMinusEast = all.reduce((sum, s) => sum + s.westDiv - s.eastDiv, 0);
  return ((divisionArcsec * westMinusEast) / (2 * all.length)) * ARCSEC;
}
