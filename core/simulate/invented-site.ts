import type { InstrumentRecord, SiteRecord } from '../archive/records.ts';

/**
 * The invented scenario's site and instruments. Bramblecote Hill Observatory does not exist; its
 * numbers are chosen to be typical of a small mid-latitude station (a hilltop at 612 m in a
 * continental climate). All records are `visible`, with the audit time the caller gives.
 */
export const INVENTED_SITE = {
  id: 'site-bramblecote',
  label: 'Bramblecote Hill Observatory (invented)',
  latitudeDeg: 49.347_12,
  longitudeDeg: 16.021_53,
  heightM: 612.4,
  /** Offset of the observers' civil time from UTC, hours (the local date of a night uses it). */
  utcOffsetHours: 1,
} as const;

/**
 * Equatorial intervals of the transit instrument's seven wires from the mean wire, seconds of
 * time, in the order an upper-culmination star crosses them with clamp west (invented; spacing of
 * about 10 s, with the small irregularities a ruled reticle has).
 */
export const TRANSIT_WIRE_INTERVALS_S: readonly number[] = [30.142, 20.087, 10.031, 0.012, -10.048, -20.071, -30.153];
/** Micrometer scale of the transit instrument, arcseconds of zenith distance per turn (invented). */
export const TRANSIT_MICROMETER_ARCSEC_PER_TURN = 60.0317;

export function inventedSite(createdUtc: string): SiteRecord {
  const { id, label, latitudeDeg, longitudeDeg, heightM } = INVENTED_SITE;
  return {
    id, label, latitudeDeg, longitudeDeg, heightM,
    note: 'Invented site of the simulated archive; not a real observatory.',
    visibility: 'visible', createdUtc, updatedUtc: createdUtc,
  };
}

/** The transit instrument of the invented site. */
export function inventedTransitInstrument(createdUtc: string): InstrumentRecord {
  return {
    id: 'instrument-transit',
    label: 'Bramblecote meridian transit (invented)',
    kind: 'transit',
    siteId: INVENTED_SITE.id,
    readingUnit: 'micrometer-turn',
    readingScaleArcsecPerUnit: TRANSIT_MICROMETER_ARCSEC_PER_TURN,
    readingSense: 1,
    wireIntervalsEquatorialS: TRANSIT_WIRE_INTERVALS_S,
    effectiveWavelengthNm: 550,
    clockLabel: 'pier quartz clock',
    note: 'Simulated: seven wires, clamp west throughout; the micrometer count includes the circle setting.',
    visibility: 'visible', createdUtc, updatedUtc: createdUtc,
  };
}

/** Plate scale of the zenith camera, arcseconds per pixel (invented: a 2048-pixel detector on a short refractor). */
export const ZENITH_CAMERA_ARCSEC_PER_PX = 1.8312;
/** Radius of the zenith camera's usable field, degrees (invented; a star is timed only inside it). */
export const ZENITH_CAMERA_FIELD_RADIUS_DEG = 0.5;
/** Timing noise of one reference-column crossing of the camera, seconds (centroid timing; invented). */
export const ZENITH_CAMERA_TIMING_NOISE_S = 0.012;
/** Noise of one camera row offset, arcseconds (invented). */
export const ZENITH_CAMERA_ZENITH_NOISE_ARCSEC = 0.18;

/**
 * The fixed zenith camera of the invented site: it looks straight up and times stars crossing the
 * detector column through its optical centre; the reading is the star's row offset from the optical
 * centre toward larger zenith distance, in pixels (orientation 0°, no mirror, so the row axis is the
 * zenith-distance direction: core/instrument/fixed-camera.ts).
 */
export function inventedZenithCamera(createdUtc: string): InstrumentRecord {
  return {
    id: 'instrument-zenith-camera',
    label: 'Bramblecote zenith camera (invented)',
    kind: 'fixed-camera',
    siteId: INVENTED_SITE.id,
    readingUnit: 'pixel',
    readingScaleArcsecPerUnit: ZENITH_CAMERA_ARCSEC_PER_PX,
    readingSense: 1,
    wireIntervalsEquatorialS: [],
    effectiveWavelengthNm: 640,
    clockLabel: 'camera timing clock',
    note: 'Simulated: a fixed camera pointing at the zenith; one reference column through the optical centre; readings are row offsets in pixels.',
    camera: { orientationDeg: 0, parity: 1, opticalCentrePx: [1024, 1024], referenceColumnPx: 1024 },
    visibility: 'visible', createdUtc, updatedUtc: createdUtc,
  };
}
