/**
 * One transit as the joint solve uses it: the nightly reduction's O − C at the catalogue place
 * (and at the night's own clock, a, b, c and zero point), the geometry the model's partials need,
 * and the stated precision. Angles in milliarcseconds (the solve's working unit, see
 * build-joint-problem.ts), times as noted.
 */
export interface JointObservation {
  readonly night: number;
  readonly star: number;
  readonly culmination: 'upper' | 'lower';
  /** UTC of the mean wire, MJD, and TT as days since J2000.0. */
  readonly utcMjd: number;
  readonly ttDaysSinceJ2000: number;
  /** Julian years since the star's catalogue epoch. */
  readonly yearsFromEpoch: number;
  /** O − C in right ascension on the sky, Δα·cos δ (mas), and its stated 1σ (mas). */
  readonly ocRaMas: number;
  readonly sigmaRaMas: number;
  readonly cosDec: number;
  /** Mayer's factors A, B and clamp sign × C, as the nightly reduction used them. */
  readonly mayerA: number;
  readonly mayerB: number;
  readonly mayerC: number;
  /** UTC of the mean wire minus the night's clock reference, days. */
  readonly clockDtDays: number;
  /** O − C in zenith distance (true − predicted, mas) and 1σ; NaN when the transit has no reading. */
  readonly ocZenithMas: number;
  readonly sigmaZenithMas: number;
  readonly zenithRad: number;
  readonly refractionMas: number;
  /** ∂z/∂δ: −1 south of the zenith and at lower culmination, +1 north of it (upper). */
  readonly zenithPerDec: number;
  readonly temperatureC: number;
  /** Input weight factor of the log row (0: rejected by the user). */
  readonly logWeight: number;
  /**
   * Whether the nightly reduction screened the time or the zenith distance out as a gross blunder
   * (not a statistical rejection, which the joint solve's own robust weights judge). Such a
   * component enters with weight 0: a gross blunder (a clock a minute off, a wrong star) is
   * thousands of σ away and would otherwise swamp the first, unweighted pass of the joint fit.
   */
  readonly nightlyOutlierRa: boolean;
  readonly nightlyOutlierZenith: boolean;
  /** Kernel factors at the observed instant (rad per rad): ∂H/∂ϖ, ∂z/∂ϖ, ∂H/∂κ, ∂z/∂κ. */
  hourAnglePerParallax: number;
  zenithPerParallax: number;
  hourAnglePerAberration: number;
  zenithPerAberration: number;
}

/** One night of one instrument as the joint solve sees it. */
export interface JointNight {
  readonly id: string;
  readonly instrumentId: string;
  readonly nightDateMjd: number;
  /** Prior of the clock terms from the comparisons (offset σ s, rate σ s/day), null without comparisons. */
  readonly clockPrior: { readonly offsetSigmaS: number; readonly rateSigmaSPerDay: number | null } | null;
  /** Prior σ of b from the striding level (arcsec; b was held at the readings' mean), null without readings. */
  readonly levelPriorSigmaArcsec: number | null;
  /** The nightly reduction's constants, to which the joint corrections are added. */
  readonly nightly: { readonly clockOffsetS: number; readonly clockRateSPerDay: number; readonly azimuthArcsec: number; readonly levelArcsec: number; readonly collimationArcsec: number; readonly zenithZeroArcsec: number };
}
