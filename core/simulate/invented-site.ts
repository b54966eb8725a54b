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
