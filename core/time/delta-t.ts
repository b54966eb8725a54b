/**
 * ΔT = TT − UT1 from a published model, for instants without measured UT1 (before the EOP table,
 * before 1960 when UTC did not exist).
 *
 * Model: F. Espenak & J. Meeus (2006), "Five Millennium Canon of Solar Eclipses: −1999 to +3000",
 * NASA/TP-2006-214141, section 2.6 ("Polynomial expressions for Delta T"), with its decimal year
 * y = year + (month − 0.5)/12, here y = 2000 + (JD − 2 451 545)/365.2425 (the same to 0.04 yr).
 * No lunar secular-acceleration correction is applied (the polynomials assume ṅ = −25.858″/cy²).
 * Accuracy (from the canon's own discussion): about 1 s 1900–1955, below 1 s 1955–2005 (measured
 * values are the fit's data), then an extrapolation: 74.5 s for 2025 against about 69 s measured
 * (IERS, from memory), so +5 s; ~10 s
 * around 1700, ~20 s around 1600, growing to minutes in antiquity.
 */
import type { JulianDate } from './julian-date.ts';
import { JD_J2000 } from '../units.ts';

/** ΔT = TT − UT1 in seconds at an instant (TT or UT, either is fine at this accuracy). */
export function deltaTSeconds(jd: JulianDate): number {
  return deltaTSecondsAtDecimalYear(2000 + (jd.jd1 - JD_J2000 + jd.jd2) / 365.2425);
}

/** ΔT = TT − UT1 in seconds at the decimal year `y` of the Espenak & Meeus (2006) polynomials. */
export function deltaTSecondsAtDecimalYear(y: number): number {
  if (y < -500) return longTermParabola(y);
  if (y < 500) return polynomial(y / 100, [10583.6, -1014.41, 33.78311, -5.952053, -0.1798452, 0.022174192, 0.0090316521]);
  if (y < 1600) return polynomial((y - 1000) / 100, [1574.2, -556.01, 71.23472, 0.319781, -0.8503463, -0.005050998, 0.0083572073]);
  if (y < 1700) return polynomial(y - 1600, [120, -0.9808, -0.01532, 1 / 7129]);
  if (y < 1800) return polynomial(y - 1700, [8.83, 0.1603, -0.0059285, 0.00013336, -1 / 1174000]);
  if (y < 1860) {
    return polynomial(y - 1800, [13.72, -0.332447, 0.0068612, 0.0041116, -0.00037436, 0.0000121272, -0.0000001699, 0.000000000875]);
  }
  if (y < 1900) return polynomial(y - 1860, [7.62, 0.5737, -0.251754, 0.01680668, -0.0004473624, 1 / 233174]);
  if (y < 1920) return polynomial(y - 1900, [-2.79, 1.494119, -0.0598939, 0.0061966, -0.000197]);
  if (y < 1941) return polynomial(y - 1920, [21.2, 0.84493, -0.0761, 0.0020936]);
  if (y < 1961) return polynomial(y - 1950, [29.07, 0.407, -1 / 233, 1 / 2547]);
  if (y < 1986) return polynomial(y - 1975, [45.45, 1.067, -1 / 260, -1 / 718]);
  if (y < 2005) return polynomial(y - 2000, [63.86, 0.3345, -0.060374, 0.0017275, 0.000651814, 0.00002373599]);
  if (y < 2050) return polynomial(y - 2000, [62.92, 0.32217, 0.005589]);
  if (y < 2150) return longTermParabola(y) - 0.5628 * (2150 - y);
  return longTermParabola(y);
}

/** The long-term parabola of Morrison & Stephenson (2004) used by the canon outside its tables. */
function longTermParabola(y: number): number {
  const u = (y - 1820) / 100;
  return -20 + 32 * u * u;
}

/** Σ coefficients[k] · x^k by Horner's rule. */
function polynomial(x: number, coefficients: readonly number[]): number {
  let sum = 0;
  for (let k = coefficients.length - 1; k >= 0; k--) sum = sum * x + coefficients[k];
  return sum;
}
