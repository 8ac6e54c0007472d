/**
 * Pressure altitude in the ICAO Standard Atmosphere (ICAO Doc 7488/3, 1993), troposphere only
 * (below 11 000 m, where every glider launch happens): sea-level pressure 1013.25 hPa and
 * temperature 288.15 K, lapse rate 0.0065 K/m, g₀ = 9.80665 m/s², R* = 8.31432 J/(mol·K),
 * M₀ = 0.0289644 kg/mol. Heights are geopotential metres above the 1013.25 hPa level.
 * tests/reference/icao-atmosphere.test.ts checks it against tabulated values.
 */
const P0_HPA = 1013.25;
const T0_K = 288.15;
const LAPSE_K_PER_M = 0.0065;
const EXPONENT = (9.80665 * 0.0289644) / (8.31432 * LAPSE_K_PER_M); // ≈ 5.25588

/** The height (m) at which the standard atmosphere has this pressure (hPa). */
export function pressureToHeightM(hPa: number): number {
  return (T0_K / LAPSE_K_PER_M) * (1 - Math.pow(hPa / P0_HPA, 1 / EXPONENT));
}

/** The standard atmosphere's pressure (hPa) at this height (m). */
export function heightToPressureHpa(heightM: number): number {
  return P0_HPA * Math.pow(1 - (LAPSE_K_PER_M * heightM) / T0_K, EXPONENT);
}

/** Feet to metres (the international foot, exactly 0.3048 m). */
export const FEET_TO_M = 0.3048;
