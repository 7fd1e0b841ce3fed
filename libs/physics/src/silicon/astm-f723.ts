/**
 * Resistivity–dopant density conversion for boron- and phosphorus-doped silicon at 23 °C.
 */
import { requireInRange, requireOneOf } from '../validate';

/** Dopants covered by ASTM F723. */
export type F723Dopant = 'boron' | 'phosphorus';

/**
 * Ranges the conversions accept: the density span of the data behind the relations
 * (about 1e12 to 1e21 cm^-3 for boron, 1e12 to 5e20 for phosphorus; from memory) and the
 * resistivities those densities give.
 */
export const ASTM_F723_RANGES: Readonly<
  Record<F723Dopant, { densityCm3: [number, number]; resistivityOhmCm: [number, number] }>
> = {
  boron: { densityCm3: [1e12, 1e21], resistivityOhmCm: [1e-4, 1e4] },
  phosphorus: { densityCm3: [1e12, 5e20], resistivityOhmCm: [2e-4, 5e3] },
};

const DOPANTS: readonly F723Dopant[] = ['boron', 'phosphorus'];

/**
 * Resistivity of silicon at 23 °C from its boron or phosphorus density (ASTM F723, after
 * Thurber et al., NBS Special Publication 400-64, 1981).
 *
 * Formulas (N in cm^-3):
 *   boron:      rho = 1.305e16/N + 1.133e17 / (N [1 + (2.58e-19 N)^-0.737])
 *   phosphorus: rho = (6.242e18/N) 10^Z, y = log10(N) - 16,
 *     Z = (-3.0769 + 2.2108y - 0.62272y^2 + 0.057501y^3) / (1 - 0.68157y + 0.19833y^2 - 0.018376y^3)
 * Each direction is its own published fit: this and `siliconDopantFromResistivity` are not exact
 * inverses (a round trip differs by up to a few per cent).
 *
 * @param dopant 'boron' or 'phosphorus'
 * @param densityCm3 dopant density, cm^-3 (ranges in `ASTM_F723_RANGES`)
 * @returns resistivity at 23 °C, ohm cm
 * @example siliconResistivityFromDopant('boron', 1e16) // 1.4434 (ohm cm)
 */
export function siliconResistivityFromDopant(dopant: F723Dopant, densityCm3: number): number {
  const fn = 'siliconResistivityFromDopant';
  const d = requireOneOf(fn, 'dopant', dopant, DOPANTS);
  const [lo, hi] = ASTM_F723_RANGES[d].densityCm3;
  const n = requireInRange(fn, 'densityCm3', densityCm3, lo, hi, {
    what: 'a dopant density',
    unit: 'cm^-3',
  });
  if (d === 'boron') {
    return 1.305e16 / n + 1.133e17 / (n * (1 + Math.pow(2.58e-19 * n, -0.737)));
  }
  const y = Math.log10(n) - 16;
  const z =
    (-3.0769 + 2.2108 * y - 0.62272 * y * y + 0.057501 * y * y * y) /
    (1 - 0.68157 * y + 0.19833 * y * y - 0.018376 * y * y * y);
  return (6.242e18 / n) * Math.pow(10, z);
}

/**
 * Boron or phosphorus density of silicon from its resistivity at 23 °C (ASTM F723, after
 * Thurber et al., NBS Special Publication 400-64, 1981).
 *
 * Formulas (rho in ohm cm):
 *   boron:      N = 1.330e16/rho + 1.082e17 / (rho [1 + (54.56 rho)^1.105])
 *   phosphorus: N = (6.242e18/rho) 10^Z, x = log10(rho),
 *     Z = (-3.1083 - 3.2626x - 1.2196x^2 - 0.13923x^3) / (1 + 1.0265x + 0.38755x^2 + 0.041833x^3)
 *
 * @param dopant 'boron' or 'phosphorus'
 * @param resistivityOhmCm resistivity at 23 °C, ohm cm (ranges in `ASTM_F723_RANGES`)
 * @returns dopant density, cm^-3
 * @example siliconDopantFromResistivity('phosphorus', 1) // 4.864e15 (cm^-3)
 */
export function siliconDopantFromResistivity(dopant: F723Dopant, resistivityOhmCm: number): number {
  const fn = 'siliconDopantFromResistivity';
  const d = requireOneOf(fn, 'dopant', dopant, DOPANTS);
  const [lo, hi] = ASTM_F723_RANGES[d].resistivityOhmCm;
  const rho = requireInRange(fn, 'resistivityOhmCm', resistivityOhmCm, lo, hi, {
    what: 'a resistivity',
    unit: 'ohm cm',
  });
  if (d === 'boron') {
    return 1.33e16 / rho + 1.082e17 / (rho * (1 + Math.pow(54.56 * rho, 1.105)));
  }
  const x = Math.log10(rho);
  const z =
    (-3.1083 - 3.2626 * x - 1.2196 * x * x - 0.13923 * x * x * x) /
    (1 + 1.0265 * x + 0.38755 * x * x + 0.041833 * x * x * x);
  return (6.242e18 / rho) * Math.pow(10, z);
}
