/**
 * Reference data of common film metals.
 */
import type { Citation } from '../semiconductor/material';
import { requireInRange, requireOneOf } from '../validate';

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
  reference: 'Introduction to Solid State Physics, Debye temperatures table',
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

/**
 * Linear estimate of a metal's resistivity from the reference data.
 *
 * Formula: rho(T) = rho_20 [1 + alpha (T - 293.15 K)]; a fair estimate from about 200 K to
 * 600 K for the pure metals listed (use `blochGruneisen` for wider ranges).
 *
 * @param metal metal id
 * @param temperatureK temperature, K (100 to 1000)
 * @returns resistivity, ohm cm
 * @example metalResistivity('Cu', 293.15) // 1.68e-6 (ohm cm)
 */
export function metalResistivity(metal: MetalId, temperatureK: number): number {
  const id = requireOneOf('metalResistivity', 'metal', metal, Object.keys(METALS) as MetalId[]);
  const t = requireInRange('metalResistivity', 'temperatureK', temperatureK, 100, 1000, {
    what: 'a temperature',
    unit: 'K',
    allowance: 1e-9,
  });
  const m = METALS[id];
  return m.resistivity20COhmCm * (1 + m.alphaPerK * (t - 293.15));
}
