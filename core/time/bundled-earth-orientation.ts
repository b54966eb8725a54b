/**
 * The bundled IERS EOP 14 C04 table (1962-01-01 to 2022-11-29, final values) as an
 * EarthOrientationTable, decoded on first use (about 5 ms) and then shared.
 * Source and layout: bundled-eop-c04.ts. For later dates load a current IERS finals2000A or C04
 * file (parseIersFinals / parseIersC04); TimeScale warns when an instant falls outside the table.
 */
import {
  BUNDLED_EOP_DAY_COUNT,
  BUNDLED_EOP_FIRST_MJD,
  BUNDLED_EOP_SOURCE,
  BUNDLED_EOP_UT1_MINUS_UTC_TENTH_MICROSECOND,
  BUNDLED_EOP_X_MICROARCSEC,
  BUNDLED_EOP_Y_MICROARCSEC,
} from './bundled-eop-c04.ts';
import { EarthOrientationTable } from './earth-orientation-table.ts';

let cached: EarthOrientationTable | undefined;

/** The bundled IERS C04 Earth orientation table (decoded once). */
export function bundledEarthOrientationTable(): EarthOrientationTable {
  cached ??= new EarthOrientationTable(
    {
      mjd: Float64Array.from({ length: BUNDLED_EOP_DAY_COUNT }, (_, i) => BUNDLED_EOP_FIRST_MJD + i),
      xArcsec: decodeSecondDifferences(BUNDLED_EOP_X_MICROARCSEC, 1e6),
      yArcsec: decodeSecondDifferences(BUNDLED_EOP_Y_MICROARCSEC, 1e6),
      dut1Seconds: decodeSecondDifferences(BUNDLED_EOP_UT1_MINUS_UTC_TENTH_MICROSECOND, 1e7),
      predicted: new Uint8Array(BUNDLED_EOP_DAY_COUNT),
    },
    BUNDLED_EOP_SOURCE,
  );
  return cached;
}

/** Integers stored as base-36 second differences, divided by `unitsPerValue`. */
function decodeSecondDifferences(encoded: string, unitsPerValue: number): Float64Array {
  const parts = encoded.split(',');
  if (parts.length !== BUNDLED_EOP_DAY_COUNT) {
    throw new Error(`bundled EOP table is damaged: ${parts.length} values for ${BUNDLED_EOP_DAY_COUNT} days; regenerate it with assets/eop/make_bundled_eop.py`);
  }
  const out = new Float64Array(parts.length);
  let value = 0;
  let step = 0;
  for (let i = 0; i < parts.length; i++) {
    step += parseInt(parts[i], 36);
    value += step;
    out[i] = value / unitsPerValue;
  }
  return out;
}
