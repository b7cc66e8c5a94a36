/**
 * Atmospheric pressure at an elevation: the reference for gauge pressures where a station reports no
 * station pressure. Gauge = absolute − local atmospheric pressure.
 */
import { InputError } from "../errors.js";
import { STANDARD_ATMOSPHERE_PA, STANDARD_GRAVITY_M_S2 } from "../units/index.js";

/**
 * Atmospheric pressure at an elevation by the ISO 2533 standard atmosphere, troposphere layer:
 * P = P₀·(1 − L·H/T₀)^(g₀·M/(R*·L)) with H the geopotential height H = r·h/(r + h), r = 6 356 766 m,
 * T₀ = 288.15 K, L = 0.0065 K/m, P₀ = 101 325 Pa, g₀·M/(R*·L) = 5.255 877.
 *
 * @param elevationM - elevation above mean sea level, m (−1000 to 11 000)
 * @returns atmospheric pressure, Pa absolute
 *
 * References: ISO 2533:1975, Standard Atmosphere (troposphere: T₀, L, M = 0.0289644 kg/mol,
 * R* = 8.31432 J/(mol·K), r = 6 356 766 m).
 *
 * @example
 * standardAtmospherePa(1500); // ≈ 84 556 Pa
 */
export function standardAtmospherePa(elevationM: number): number {
  if (!(elevationM >= -1000 && elevationM <= 11000)) {
    throw new InputError(
      `elevationM: ${elevationM} m is outside the standard atmosphere's troposphere (expected −1000 to 11000 m)`,
    );
  }
  const r = 6356766;
  const h = (r * elevationM) / (r + elevationM);
  const t0 = 288.15;
  const lapse = 0.0065;
  const exponent = (STANDARD_GRAVITY_M_S2 * 0.0289644) / (8.31432 * lapse);
  return STANDARD_ATMOSPHERE_PA * (1 - (lapse * h) / t0) ** exponent;
}
