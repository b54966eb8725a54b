// Types for the one astronomia function the signature tests use (the package ships none).
declare module 'astronomia/solar' {
  /** Sun's true geometric longitude (rad) and mean anomaly at T Julian centuries from J2000 (Meeus ch. 25). */
  export function trueLongitude(T: number): { lon: number; ano: number };
}
