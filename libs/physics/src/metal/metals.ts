/**
 * Reference data of common film metals.
 */
import type { Citation } from '../semiconductor/material';
import { requireInRange, requireOneOf } from '../validate';
import type { BlochGruneisenParameters } from './bloch-gruneisen';
import { blochGruneisenUnchecked } from './bloch-gruneisen';

/** Metals with reference data. */
export type MetalId = 'Cu' | 'Al' | 'W' | 'Pt' | 'Au' | 'Ni';

/** Reference data of one metal. */
export interface MetalReference {
  id: MetalId;
  name: string;
  /** Resistivity at 20 °C, ohm cm. */
  resistivity20COhmCm: number;
  /** Temperature coefficient at 20 °C, 1/K. */
  alphaPerK: number;
  /** Debye temperature, K. */
  debyeK: number;
  sources: { resistivity: Citation; debye: Citation };
}

const INTRO_TABLES: Citation = {
  label: 'introductory physics tables',
  reference:
    'resistivity and temperature coefficient at 20 °C, e.g. Serway, Physics for Scientists and Engineers',
};
const KITTEL: Citation = {
  label: 'Kittel',
  reference: 'Introduction to Solid State Physics, 8th ed., ch. 5, Debye temperatures table',
  fromMemory: true,
};

function metal(
  id: MetalId,
  name: string,
  rhoOhmM: number,
  alpha: number,
  debyeK: number,
): MetalReference {
  // Tables give ohm m; the library works in ohm cm (1 ohm m = 100 ohm cm).
  return {
    id,
    name,
    resistivity20COhmCm: rhoOhmM * 100,
    alphaPerK: alpha,
    debyeK,
    sources: { resistivity: INTRO_TABLES, debye: KITTEL },
  };
}

/** Metal reference data (handbook values differ by a few per cent; these are the cited ones). */
export const METALS: Readonly<Record<MetalId, MetalReference>> = {
  Cu: metal('Cu', 'Copper', 1.68e-8, 0.0039, 343),
  Al: metal('Al', 'Aluminium', 2.82e-8, 0.0039, 428),
  W: metal('W', 'Tungsten', 5.6e-8, 0.0045, 400),
  Pt: metal('Pt', 'Platinum', 1.06e-7, 0.00392, 240),
  Au: metal('Au', 'Gold', 2.44e-8, 0.0034, 165),
  Ni: metal('Ni', 'Nickel', 6.99e-8, 0.006, 450),
};

/** Temperatures over which the linear reference `metalResistivity` is a fair estimate, K. */
export const METAL_LINEAR_RANGE_K: readonly [number, number] = [200, 600];

/**
 * Linear estimate of a metal's resistivity from the reference data.
 *
 * Formula: rho(T) = rho_20 [1 + alpha (T - 293.15 K)]; a fair estimate from 200 K to 600 K
 * for the pure metals listed (Cu at 100 K is 19 % off), so only that range is accepted; use
 * `metalBlochGruneisen` for 20 K to 1000 K.
 *
 * @param metal metal id
 * @param temperatureK temperature, K (200 to 600)
 * @returns resistivity, ohm cm
 * @example metalResistivity('Cu', 293.15) // 1.68e-6 (ohm cm)
 */
export function metalResistivity(metal: MetalId, temperatureK: number): number {
  const id = requireOneOf('metalResistivity', 'metal', metal, Object.keys(METALS) as MetalId[]);
  const [lo, hi] = METAL_LINEAR_RANGE_K;
  const t = requireInRange('metalResistivity', 'temperatureK', temperatureK, lo, hi, {
    what: 'a temperature',
    unit: 'K',
    allowance: 1e-9,
  });
  const m = METALS[id];
  return m.resistivity20COhmCm * (1 + m.alphaPerK * (t - 293.15));
}

/** Bloch–Grüneisen constants of a metal derived from its reference data. */
export interface MetalBlochGruneisen extends BlochGruneisenParameters {
  /** d ln(rho)/dT of the curve at 20 °C, 1/K (equals the tabulated alpha when `matchesAlpha`). */
  alphaAt20CPerK: number;
  /**
   * False where matching the tabulated alpha would need a negative residual resistivity
   * (W, Pt, Ni: s–d and magnetic scattering make them rise faster than Bloch–Grüneisen allows);
   * the residual is then 0 and only rho(20 °C) is matched.
   */
  matchesAlpha: boolean;
}

/** Temperatures over which the metal model curve follows Bloch–Grüneisen, K. */
export const METAL_MODEL_RANGE_K: readonly [number, number] = [20, 1000];

const T20_K = 293.15;

/** Phonon part per unit coupling, (T/Theta)^5 J5(Theta/T). */
const phonon = (t: number, theta: number): number => blochGruneisenUnchecked(t, 0, 1, theta);

function deriveConstants(m: MetalReference): MetalBlochGruneisen {
  const theta = m.debyeK;
  const h = 1e-3;
  const slope = (phonon(T20_K + h, theta) - phonon(T20_K - h, theta)) / (2 * h);
  const f20 = phonon(T20_K, theta);
  const coupling = (m.alphaPerK * m.resistivity20COhmCm) / slope;
  const residual = m.resistivity20COhmCm - coupling * f20;
  if (residual >= 0) {
    return {
      residualOhmCm: residual,
      couplingOhmCm: coupling,
      debyeK: theta,
      alphaAt20CPerK: m.alphaPerK,
      matchesAlpha: true,
    };
  }
  const pure = m.resistivity20COhmCm / f20;
  return {
    residualOhmCm: 0,
    couplingOhmCm: pure,
    debyeK: theta,
    alphaAt20CPerK: (pure * slope) / m.resistivity20COhmCm,
    matchesAlpha: false,
  };
}

/**
 * Bloch–Grüneisen constants of each metal, derived from the cited reference data: the Debye
 * temperature (Kittel) as Theta, and the coupling A and residual rho_0 solved from
 * rho(20 °C) = rho_0 + A f(293.15 K) and d rho/dT (20 °C) = alpha rho_20 = A f'(293.15 K),
 * f(T) = (T/Theta)^5 J5(Theta/T). Where that needs rho_0 < 0 (see `matchesAlpha`), rho_0 = 0 and
 * A = rho_20 / f(293.15 K). The residual stands for the bulk reference sample's purity; a film
 * adds its own (Matthiessen). Copper from these constants: 0.19, 1.548 and 1.725 µΩ cm at 77,
 * 273.15 and 300 K, against 0.21, 1.543 and 1.725 from Matula 1979 (J. Phys. Chem. Ref. Data 8,
 * 1147; from memory).
 */
export const METAL_BLOCH_GRUNEISEN: Readonly<Record<MetalId, MetalBlochGruneisen>> =
  Object.fromEntries(Object.values(METALS).map((m) => [m.id, deriveConstants(m)])) as Record<
    MetalId,
    MetalBlochGruneisen
  >;

/**
 * Bloch–Grüneisen model resistivity of a reference metal (`METAL_BLOCH_GRUNEISEN`).
 *
 * @param metal metal id
 * @param temperatureK temperature, K (20 to 1000)
 * @returns resistivity, ohm cm
 * @example metalBlochGruneisen('Cu', 300) // 1.725e-6 (ohm cm)
 */
export function metalBlochGruneisen(metal: MetalId, temperatureK: number): number {
  const fn = 'metalBlochGruneisen';
  const id = requireOneOf(fn, 'metal', metal, Object.keys(METALS) as MetalId[]);
  const [lo, hi] = METAL_MODEL_RANGE_K;
  const t = requireInRange(fn, 'temperatureK', temperatureK, lo, hi, {
    what: 'a temperature',
    unit: 'K',
    allowance: 1e-9,
  });
  const c = METAL_BLOCH_GRUNEISEN[id];
  return blochGruneisenUnchecked(t, c.residualOhmCm, c.couplingOhmCm, c.debyeK);
}
