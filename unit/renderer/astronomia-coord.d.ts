// The npm package astronomia ships no types; this declares only the part the renderer tests use
// (coord.js, Meeus chapter 13), under its subpath so it cannot clash with other declarations.
declare module 'astronomia/coord' {
  export class Equatorial {
    constructor(raRad: number, decRad: number);
    toEcliptic(obliquityRad: number): { readonly lon: number; readonly lat: number };
  }
}
