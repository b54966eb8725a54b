import type { SimulationOptions } from './simulation-options.ts';

/**
 * The known truth behind a simulated archive, JSON-serialisable (written as `truth.json`). Every
 * number is what the simulator applied, in the unit its name carries. Sign conventions are those
 * of core/instrument (Mayer's a, b, c: positive makes an upper-culmination star cross early;
 * clock: reading − UTC) and of the records (zero point: zenith distance of reading 0).
 */
export interface TrueStar {
  /** The StarRecord id the transits refer to. */
  readonly id: string;
  readonly catalogueId: string;
  /** True ICRS place at `epochJulianYear`, degrees. */
  readonly raDeg: number;
  readonly decDeg: number;
  readonly epochJulianYear: number;
  readonly parallaxMas: number;
  /** μα·cos δ, mas per Julian year. */
  readonly pmRaMasYr: number;
  readonly pmDecMasYr: number;
  readonly radialVelocityKmS: number;
  /** Catalogue minus truth, as written to the star list: Δα·cos δ and Δδ (mas), Δμ (mas/yr), Δϖ (mas). */
  readonly catalogueErrorRaMas: number;
  readonly catalogueErrorDecMas: number;
  readonly catalogueErrorPmRaMasYr: number;
  readonly catalogueErrorPmDecMasYr: number;
  readonly catalogueErrorParallaxMas: number;
  /** The stated σ of the catalogue the errors were drawn with: position (mas), proper motion (mas/yr), parallax (mas). */
  readonly catalogueSigmaPositionMas: number;
  readonly catalogueSigmaPmMasYr: number;
  readonly catalogueSigmaParallaxMas: number;
}

/** One instrument's state on one night (constant through the night). */
export interface TrueNightState {
  readonly nightId: string;
  readonly instrumentId: string;
  /** UTC MJD the clock law refers to. */
  readonly clockReferenceUtcMjd: number;
  /** Clock reading − UTC at the reference instant, seconds. */
  readonly clockOffsetS: number;
  /** Clock rate, seconds per day (positive: the clock gains). */
  readonly clockRateSPerDay: number;
  readonly azimuthArcsec: number;
  readonly levelArcsec: number;
  readonly collimationArcsec: number;
  /** Zenith distance of reading 0, arcseconds. */
  readonly zeroPointArcsec: number;
  /** Latitude variation Δφ applied that night, arcseconds. */
  readonly latitudeVariationArcsec: number;
}

export type BlunderKind = 'wire-miscounted' | 'turn-slipped' | 'star-swapped' | 'clock-second';

export interface PlantedBlunder {
  readonly transitId: string;
  readonly kind: BlunderKind;
  /** What was done, in words with the numbers. */
  readonly detail: string;
  /** For a swapped star: the star actually observed (the record names another). */
  readonly trueStarId?: string;
}

export interface TrueInstrument {
  readonly id: string;
  readonly flexureArcsec: number;
  readonly readingScaleArcsecPerUnit: number;
  readonly readingSense: 1 | -1;
}

export interface SimulationTruth {
  readonly generator: string;
  readonly options: SimulationOptions;
  readonly global: {
    /** Injected correction to the constant of aberration, arcseconds (0: standard κ). */
    readonly deltaKappaArcsec: number;
    readonly thermalRaArcsecPerC: number;
    readonly thermalDecArcsecPerC: number;
    readonly thermalReferenceTemperatureC: number;
    readonly latitudeVariationAmplitudeArcsec: number;
    readonly latitudeVariationPeriodDays: number;
    /** How the sky was modelled, so a reduction can be set up the same way. */
    readonly skyModel: string;
  };
  readonly instruments: readonly TrueInstrument[];
  readonly stars: readonly TrueStar[];
  readonly nights: readonly TrueNightState[];
  /** Every instrument event as planted (also in site.json): steps of a, b, c and zero point in the note. */
  readonly events: readonly { readonly id: string; readonly instrumentId: string; readonly utcMjd: number; readonly kind: string; readonly note: string }[];
  readonly blunders: readonly PlantedBlunder[];
}
