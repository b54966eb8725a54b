// The npm package astronomia ships no types; this declares only what the astrometry tests use
// (apparent.js ch. 23, base.js, coord.js, sexagesimal.js of Meeus' Astronomical Algorithms).
declare module 'astronomia/apparent' {
  import type { Equatorial } from 'astronomia/coord';
  import type { Angle, HourAngle } from 'astronomia/sexagesimal';
  /** Apparent place from J2000 with Ron–Vondrák aberration, IAU 1976 precession, IAU 1980 nutation. */
  export function positionRonVondrak(eqFrom: Equatorial, epochTo: number, pmRa: HourAngle, pmDec: Angle): Equatorial;
  /** Nutation in RA and Dec (Meeus 23.1), radians. */
  export function nutation(ra: number, dec: number, jd: number): [number, number];
  /** Annual aberration in RA and Dec (Meeus 23.3, classical), radians. */
  export function aberration(ra: number, dec: number, jd: number): [number, number];
}
declare module 'astronomia/coord' {
  export class Equatorial {
    constructor(ra?: number, dec?: number);
    ra: number;
    dec: number;
  }
}
declare module 'astronomia/sexagesimal' {
  export class Angle {
    constructor(negative: boolean, d: number, m: number, s: number);
    rad(): number;
  }
  export class HourAngle extends Angle {}
}
declare module 'astronomia/base' {
  export function JDEToJulianYear(jde: number): number;
}
