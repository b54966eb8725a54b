import type { Weather } from './weather.ts';

/**
 * Coefficients of the refraction model ΔZ = A tan Z + B tan³ Z, where Z is the observed
 * (refracted) zenith distance and ΔZ (radians) is what to add to Z to get the zenith distance in
 * vacuo. `aRad` and `bRad` are in radians. `warnings` lists every input outside the range over
 * which the formulation was tested (the numbers are still computed).
 */
export interface RefractionConstants {
  readonly aRad: number;
  readonly bRad: number;
  readonly warnings: readonly string[];
}

/** Above this wavelength (µm) the radio refractivity formula applies (Rueger 2002). */
const RADIO_THRESHOLD_UM = 100;

/**
 * Refraction constants A, B from the weather at the instrument.
 *
 * Method: saturation vapour pressure from Gill (1982) eqs. A4.5–A4.7; partial pressure of water
 * vapour from the relative humidity after Crane (1976) eq. 2.5.5; refractivity (n − 1) for optical/IR
 * after Hohenkerk & Sinclair (1985, NAO Technical Note 63) and for radio after Rueger (2002); the
 * ratio β of atmospheric scale height to geocentric distance after Stone (1996, PASP 108, 1051,
 * eq. 9, with the empirical adjustment published with the IAU SOFA refraction-constant routine);
 * A = γ(1 − β), B = −γ(β − γ/2) from Green (1987, Spherical Astronomy, eq. 4.31), γ = n − 1.
 *
 * Accuracy (published with the same formulation, against ray tracing through model atmospheres):
 * worst 62 mas, RMS 8 mas (optical/IR) and worst 319 mas, RMS 49 mas (radio) for zenith distances
 * up to 75°, heights 0–5000 m, temperatures 270–300 K, humidity 0–1, wavelengths 0.4–2 µm. The
 * A tan Z + B tan³ Z form itself degrades beyond Z ≈ 75° (0.6″ at 80°): see `refractionWarnings`.
 *
 * Throws a RangeError for physically impossible input (non-finite, negative pressure, humidity
 * outside 0–1, temperature below absolute zero, wavelength ≤ 0). Zero pressure gives A = B = 0.
 */
export function refractionConstants(weather: Weather): RefractionConstants {
  validateWeather(weather);
  const { pressureHpa, temperatureC, relativeHumidity, wavelengthUm } = weather;
  const optical = wavelengthUm <= RADIO_THRESHOLD_UM;
  const waterHpa = waterVapourPressureHpa(pressureHpa, temperatureC, relativeHumidity);
  const temperatureK = temperatureC + 273.15;
  let gamma: number;
  if (optical) {
    const inverseSquare = 1 / (wavelengthUm * wavelengthUm);
    const dryTerm = 77.53484e-6 + (4.39108e-7 + 3.666e-9 * inverseSquare) * inverseSquare;
    gamma = (dryTerm * pressureHpa - 11.2684e-6 * waterHpa) / temperatureK;
  } else {
    gamma = (77.689e-6 * pressureHpa - (6.3938e-6 - 0.375463 / temperatureK) * waterHpa) / temperatureK;
  }
  let beta = 4.4474e-6 * temperatureK;
  if (!optical) beta -= 0.0074 * waterHpa * beta;
  return {
    aRad: gamma * (1 - beta),
    bRad: -gamma * (beta - gamma / 2),
    warnings: weatherWarnings(weather),
  };
}

/** Partial pressure of water vapour (hPa); Gill (1982) saturation pressure with the enhancement factor. */
function waterVapourPressureHpa(pressureHpa: number, temperatureC: number, relativeHumidity: number): number {
  if (pressureHpa <= 0) return 0;
  const t = temperatureC;
  const saturationHpa =
    10 ** ((0.7859 + 0.03477 * t) / (1 + 0.00412 * t)) * (1 + pressureHpa * (4.5e-6 + 6e-10 * t * t));
  return (relativeHumidity * saturationHpa) / (1 - ((1 - relativeHumidity) * saturationHpa) / pressureHpa);
}

function validateWeather(weather: Weather): void {
  const { pressureHpa, temperatureC, relativeHumidity, wavelengthUm } = weather;
  const check = (ok: boolean, message: string): void => {
    if (!ok) throw new RangeError(`refractionConstants: ${message}`);
  };
  check(Number.isFinite(pressureHpa) && pressureHpa >= 0, `pressureHpa must be a finite number ≥ 0 (got ${pressureHpa}); give the station pressure in hPa`);
  check(Number.isFinite(temperatureC) && temperatureC > -273.15, `temperatureC must be a finite number above −273.15 (got ${temperatureC}); give the air temperature in °C`);
  check(Number.isFinite(relativeHumidity) && relativeHumidity >= 0 && relativeHumidity <= 1, `relativeHumidity must lie in 0–1 (got ${relativeHumidity}); a percentage must be divided by 100`);
  check(Number.isFinite(wavelengthUm) && wavelengthUm > 0, `wavelengthUm must be a finite number > 0 (got ${wavelengthUm}); give the effective wavelength in micrometres`);
}

/** Inputs outside the range over which the formulation was tested; each message names the value. */
function weatherWarnings(weather: Weather): string[] {
  const warnings: string[] = [];
  const { pressureHpa, temperatureC, wavelengthUm } = weather;
  if (pressureHpa < 500 || pressureHpa > 1100) {
    warnings.push(`pressureHpa ${pressureHpa} is outside 500–1100 hPa, the range the refraction model was tested on`);
  }
  if (temperatureC < -40 || temperatureC > 50) {
    warnings.push(`temperatureC ${temperatureC} is outside −40…+50 °C, the range the refraction model was tested on`);
  }
  if (wavelengthUm < 0.3 || (wavelengthUm > 2.5 && wavelengthUm <= RADIO_THRESHOLD_UM)) {
    warnings.push(`wavelengthUm ${wavelengthUm} is outside 0.3–2.5 µm (optical) and not radio (> 100 µm); the refractivity formula was not tested there`);
  }
  return warnings;
}
