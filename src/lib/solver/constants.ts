/**
 * Physical defaults (SI). Callers may override both per calculation.
 */

/** Standard acceleration of gravity, m/s² (exact by definition; NIST SP 811, 2008, App. B). */
export const STANDARD_GRAVITY = 9.80665;

/** Density of fresh water used by default, kg/m³ (common practice; 999.7 at 10 °C, 998.2 at 20 °C). */
export const WATER_DENSITY = 1000;
