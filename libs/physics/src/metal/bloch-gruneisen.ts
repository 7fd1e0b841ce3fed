/**
 * Bloch–Grüneisen resistivity of a simple metal and its transport integral J5.
 */
import {
  requireFiniteNumber,
  requireInRange,
  requireNonNegative,
  requireObject,
  requirePositive,
} from '../validate';

/** 5! zeta(5) = J5(infinity) (zeta(5) = 1.03692775514337, Abramowitz & Stegun table 23.3). */
export const J5_INFINITY = 120 * 1.03692775514337;

// 10-point Gauss–Legendre nodes and weights on [-1, 1] (Abramowitz & Stegun table 25.4).
const GL_X = [
  0.1488743389816312, 0.4333953941292472, 0.6794095682990244, 0.8650633666889845,
  0.9739065285171717,
];
const GL_W = [
  0.2955242247147529, 0.2692667193099963, 0.219086362515982, 0.1494513491505806, 0.0666713443086881,
];

/** Integrand z^5 e^z / (e^z - 1)^2, written with expm1 so it stays accurate as z -> 0. */
function integrand(z: number): number {
  if (z === 0) return 0;
  const em1 = Math.expm1(z);
  return (z * z * z * z * z * (em1 + 1)) / (em1 * em1);
}

/** Upper incomplete gamma Gamma(6, y) = 120 e^-y sum_{j=0}^{5} y^j / j!. */
function gamma6(y: number): number {
  return 120 * Math.exp(-y) * (1 + y * (1 + (y / 2) * (1 + (y / 3) * (1 + (y / 4) * (1 + y / 5)))));
}

/**
 * Transport integral J5(x) = integral_0^x z^5 / ((e^z - 1)(1 - e^-z)) dz.
 *
 * Method: for x <= 8, composite 10-point Gauss–Legendre on panels of width at most 0.5 (the
 * integrand is analytic within 2 pi of the real axis, so this is exact to about 1e-15 relative);
 * for x > 8, J5(x) = 5! zeta(5) - sum_{k>=1} Gamma(6, k x) / k^5 (expanding 1/(e^z-1)^2 in e^-kz),
 * which converges geometrically there. Small x: J5 ≈ x^4/4 - x^6/72.
 *
 * @param x Theta / T (>= 0)
 * @example blochGruneisenJ5(1) // 0.2366
 */
export function blochGruneisenJ5(x: number): number {
  const v = requireNonNegative('blochGruneisenJ5', 'x', x);
  return j5Unchecked(v);
}

/** @internal J5 without checks. */
export function j5Unchecked(x: number): number {
  if (x === 0) return 0;
  if (x > 8) {
    let tail = 0;
    for (let k = 1; k <= 60; k++) {
      const term = gamma6(k * x) / Math.pow(k, 5);
      tail += term;
      if (term < 1e-18 * J5_INFINITY) break;
    }
    return J5_INFINITY - tail;
  }
  const panels = Math.max(1, Math.ceil(x / 0.5));
  const width = x / panels;
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = (p + 0.5) * width;
    const half = width / 2;
    for (let i = 0; i < GL_X.length; i++) {
      sum += GL_W[i]! * (integrand(mid - half * GL_X[i]!) + integrand(mid + half * GL_X[i]!));
    }
  }
  return sum * (width / 2);
}

/** Bloch–Grüneisen parameters. */
export interface BlochGruneisenParameters {
  /** Residual (impurity and defect) resistivity rho_0, ohm cm (>= 0). */
  residualOhmCm: number;
  /** Electron–phonon coupling constant A, ohm cm (>= 0). */
  couplingOhmCm: number;
  /** Debye (transport) temperature Theta, K (> 0). */
  debyeK: number;
}

/** Temperatures accepted by the metal functions, K. */
export const METAL_TEMPERATURE_RANGE_K: readonly [number, number] = [0.01, 5000];

/**
 * Bloch–Grüneisen resistivity of a simple metal.
 *
 * Formula: rho(T) = rho_0 + A (T/Theta)^5 J5(Theta/T) (see `blochGruneisenJ5`): linear in T
 * (rho_0 + A T / (4 Theta)) well above Theta, T^5 far below it.
 * Assumptions: phonon scattering with a Debye spectrum, Matthiessen's rule for rho_0, no
 * electron–electron or magnetic scattering (so transition metals such as Ni deviate).
 * Source: F. Bloch, Z. Phys. 59, 208 (1930); E. Grüneisen, Ann. Phys. 408, 530 (1933); Ziman,
 * Electrons and Phonons (1960).
 *
 * @param temperatureK temperature, K (0.01 to 5000)
 * @param params residualOhmCm, couplingOhmCm, debyeK
 * @returns resistivity, ohm cm
 * @example blochGruneisen(343, { residualOhmCm: 0, couplingOhmCm: 1e-5, debyeK: 343 })
 *   // 2.366e-6 (ohm cm)
 */
export function blochGruneisen(temperatureK: number, params: BlochGruneisenParameters): number {
  const fn = 'blochGruneisen';
  const t = requireInRange(
    fn,
    'temperatureK',
    temperatureK,
    METAL_TEMPERATURE_RANGE_K[0],
    METAL_TEMPERATURE_RANGE_K[1],
    {
      what: 'a temperature',
      unit: 'K',
      allowance: 1e-9,
    },
  );
  const p = requireObject(fn, 'params', params);
  const rho0 = requireNonNegative(fn, 'params.residualOhmCm', p['residualOhmCm']);
  const a = requireNonNegative(fn, 'params.couplingOhmCm', p['couplingOhmCm']);
  const theta = requirePositive(
    fn,
    'params.debyeK',
    requireFiniteNumber(fn, 'params.debyeK', p['debyeK']),
  );
  return blochGruneisenUnchecked(t, rho0, a, theta);
}

/** @internal Bloch–Grüneisen without checks. */
export function blochGruneisenUnchecked(t: number, rho0: number, a: number, theta: number): number {
  const r = t / theta;
  return rho0 + a * r * r * r * r * r * j5Unchecked(1 / r);
}
