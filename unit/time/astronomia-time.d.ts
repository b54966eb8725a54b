// The npm package astronomia ships no types; this declares only the parts the time and Earth tests
// use (julian.js ch. 7, sidereal.js ch. 12, nutation.js ch. 22 of Meeus), by subpath.
declare module 'astronomia/julian' {
  export function CalendarGregorianToJD(year: number, month: number, day: number): number;
}
declare module 'astronomia/sidereal' {
  /** Mean sidereal time at Greenwich, IAU 1982, in seconds of time [0, 86400). */
  export function mean(jd: number): number;
  /** Apparent sidereal time at Greenwich in seconds of time [0, 86400). */
  export function apparent(jd: number): number;
}
declare module 'astronomia/nutation' {
  /** IAU 1980 nutation [Δψ, Δε] in radians at a JDE. */
  export function nutation(jde: number): [number, number];
  /** Mean obliquity (IAU 1980, Meeus 22.2) in radians. */
  export function meanObliquity(jde: number): number;
}
