/**
 * The complementary terms of the equation of the equinoxes, IERS Conventions 2010, chapter 5,
 * table 5.2e (Capitaine, Wallace & McCarthy 2003, A&A 406, 1135), in the arrangement of the IAU
 * SOFA / ERFA routine eect00. Transcribed by a script from that table; evaluation in
 * equation-of-equinoxes.ts.
 *
 * Multipliers, 8 per term: l, l′, F, D, Ω, L_Ve, L_E, pₐ. Amplitudes in arcseconds, 2 per term:
 * sine, cosine. The t⁰ terms come first, then the t¹ terms (t in Julian centuries TT).
 */
export const COMPLEMENTARY_T0_COUNT = 33;
export const COMPLEMENTARY_T1_COUNT = 1;

export const COMPLEMENTARY_MULTIPLIERS = Int8Array.of(
  0, 0, 0, 0, 1, 0, 0, 0,
  0, 0, 0, 0, 2, 0, 0, 0,
  0, 0, 2, -2, 3, 0, 0, 0,
  0, 0, 2, -2, 1, 0, 0, 0,
  0, 0, 2, -2, 2, 0, 0, 0,
  0, 0, 2, 0, 3, 0, 0, 0,
  0, 0, 2, 0, 1, 0, 0, 0,
  0, 0, 0, 0, 3, 0, 0, 0,
  0, 1, 0, 0, 1, 0, 0, 0,
  0, 1, 0, 0, -1, 0, 0, 0,
  1, 0, 0, 0, -1, 0, 0, 0,
  1, 0, 0, 0, 1, 0, 0, 0,
  0, 1, 2, -2, 3, 0, 0, 0,
  0, 1, 2, -2, 1, 0, 0, 0,
  0, 0, 4, -4, 4, 0, 0, 0,
  0, 0, 1, -1, 1, -8, 12, 0,
  0, 0, 2, 0, 0, 0, 0, 0,
  0, 0, 2, 0, 2, 0, 0, 0,
  1, 0, 2, 0, 3, 0, 0, 0,
  1, 0, 2, 0, 1, 0, 0, 0,
  0, 0, 2, -2, 0, 0, 0, 0,
  0, 1, -2, 2, -3, 0, 0, 0,
  0, 1, -2, 2, -1, 0, 0, 0,
  0, 0, 0, 0, 0, 8, -13, -1,
  0, 0, 0, 2, 0, 0, 0, 0,
  2, 0, -2, 0, -1, 0, 0, 0,
  1, 0, 0, -2, 1, 0, 0, 0,
  0, 1, 2, -2, 2, 0, 0, 0,
  1, 0, 0, -2, -1, 0, 0, 0,
  0, 0, 4, -2, 4, 0, 0, 0,
  0, 0, 2, -2, 4, 0, 0, 0,
  1, 0, -2, 0, -3, 0, 0, 0,
  1, 0, -2, 0, -1, 0, 0, 0,
  0, 0, 0, 0, 1, 0, 0, 0,
);

/** Sine and cosine amplitudes, arcseconds. */
export const COMPLEMENTARY_AMPLITUDES_ARCSEC = Float64Array.of(
  2640.96e-6, -0.39e-6,
  63.52e-6, -0.02e-6,
  11.75e-6, 0.01e-6,
  11.21e-6, 0.01e-6,
  -4.55e-6, 0.00e-6,
  2.02e-6, 0.00e-6,
  1.98e-6, 0.00e-6,
  -1.72e-6, 0.00e-6,
  -1.41e-6, -0.01e-6,
  -1.26e-6, -0.01e-6,
  -0.63e-6, 0.00e-6,
  -0.63e-6, 0.00e-6,
  0.46e-6, 0.00e-6,
  0.45e-6, 0.00e-6,
  0.36e-6, 0.00e-6,
  -0.24e-6, -0.12e-6,
  0.32e-6, 0.00e-6,
  0.28e-6, 0.00e-6,
  0.27e-6, 0.00e-6,
  0.26e-6, 0.00e-6,
  -0.21e-6, 0.00e-6,
  0.19e-6, 0.00e-6,
  0.18e-6, 0.00e-6,
  -0.10e-6, 0.05e-6,
  0.15e-6, 0.00e-6,
  -0.14e-6, 0.00e-6,
  0.14e-6, 0.00e-6,
  -0.14e-6, 0.00e-6,
  0.14e-6, 0.00e-6,
  0.13e-6, 0.00e-6,
  -0.11e-6, 0.00e-6,
  0.11e-6, 0.00e-6,
  0.11e-6, 0.00e-6,
  -0.87e-6, 0.00e-6,
);
