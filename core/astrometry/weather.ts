/**
 * Meteorological conditions at the instrument, as the refraction model needs them.
 * `pressureHpa`: total air pressure at the instrument (hPa = mbar), not reduced to sea level.
 * `temperatureC`: air temperature at the instrument (°C). `relativeHumidity`: 0 (dry) to 1
 * (saturated). `wavelengthUm`: effective wavelength of the observation in micrometres; values above
 * 100 µm select the radio formula.
 */
export interface Weather {
  readonly pressureHpa: number;
  readonly temperatureC: number;
  readonly relativeHumidity: number;
  readonly wavelengthUm: number;
}
