/**
 * Physical constants, CODATA 2018 (exact SI 2019 values where the SI fixes them).
 *
 * The electron mass is pinned to CODATA 2018 on purpose: the 2022 adjustment moved it, and the
 * library's reference values were computed with 2018.
 */

/** Elementary charge q, C (exact, SI 2019). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;

/** Boltzmann constant k_B, J/K (exact, SI 2019). */
export const BOLTZMANN_J_PER_K = 1.380649e-23;

/** Boltzmann constant k_B, eV/K (k_B / q, CODATA 2018: 8.617333262e-5). */
export const BOLTZMANN_EV_PER_K = 8.617333262e-5;

/** Planck constant h, J s (exact, SI 2019). */
export const PLANCK_J_S = 6.62607015e-34;

/** Electron rest mass m_0, kg (CODATA 2018). */
export const ELECTRON_MASS_KG = 9.1093837015e-31;

/** 0 °C in kelvin (exact by definition of the Celsius scale). */
export const ZERO_CELSIUS_K = 273.15;

/**
 * Allowance on inclusive temperature bounds, K: a value this far outside a bound counts as on it,
 * so conversions such as `-200 + 273.15` that round in the last bit are accepted.
 */
export const BOUND_ALLOWANCE_K = 1e-9;

/** Lowest temperature accepted by the semiconductor functions, K. */
export const MIN_TEMPERATURE_K = 1;

/** Highest temperature accepted by the semiconductor functions, K. */
export const MAX_TEMPERATURE_K = 1500;
