/**
 * Dopant levels at any density: the level lowering of Pearson & Bardeen and the continuous
 * merge of the bound level with the band.
 */
import type { IonizationModelId } from '../defaults';
import { PHYSICS_DEFAULTS } from '../defaults';
import type { Citation, SemiconductorId } from './material';

/** Static relative permittivity of each semiconductor, with its source. */
export const RELATIVE_PERMITTIVITY: Readonly<
  Record<SemiconductorId, { value: number; source: Citation }>
> = {
  Si: { value: 11.9, source: { label: 'Sze 1981', reference: 'Physics of Semiconductor Devices' } },
  Ge: { value: 16.0, source: { label: 'Sze 1981', reference: 'Physics of Semiconductor Devices' } },
  GaAs: {
    value: 13.1,
    source: { label: 'Sze 1981', reference: 'Physics of Semiconductor Devices' },
  },
  '4H-SiC': {
    value: 9.7,
    source: { label: 'device-simulator set', reference: 'perpendicular to c', fromMemory: true },
  },
};

/**
 * Lowering constant alpha of E(N) = E0 - alpha N^(1/3) for a material, eV cm: silicon's
 * measured constant (`PHYSICS_DEFAULTS.levelLoweringEvCm.Si`, Pearson & Bardeen 1949) scaled by
 * eps_Si / eps. The lowering is the Coulomb energy of an ionized impurity at the mean spacing
 * N^(-1/3), q^2 / (4 pi eps N^(-1/3)), which scales as 1 / eps (Pearson & Bardeen's own
 * argument); the scaling to other materials is Rhotrace's, not a published constant.
 * An explicit `levelLoweringEvCm` entry for a material wins over the scaling.
 *
 * @param material semiconductor id
 * @returns alpha, eV cm
 * @example levelLoweringEvCm('Ge') // 2.23e-8
 */
export function levelLoweringEvCm(material: SemiconductorId): number {
  const table: Readonly<Partial<Record<SemiconductorId, number>>> =
    PHYSICS_DEFAULTS.levelLoweringEvCm;
  const own = table[material];
  if (own !== undefined) return own;
  const si = PHYSICS_DEFAULTS.levelLoweringEvCm.Si;
  return (si * RELATIVE_PERMITTIVITY.Si.value) / RELATIVE_PERMITTIVITY[material].value;
}

/**
 * Density at which a dopant's level has merged with the band, cm^-3: under
 * `pearson-bardeen-1949` where the lowered level reaches the band edge, (E0 / alpha)^3 (for P
 * and B in silicon 3.4e18, near the measured Mott density of 3.7e18 for Si:P); under
 * `constant-level` the tabulated `PHYSICS_DEFAULTS.mottDensityCm3`.
 *
 * @param material semiconductor id
 * @param model ionization model
 * @param isolatedLevelEv dilute-limit ionization energy E0, eV (> 0)
 * @param kind 'donor' or 'acceptor'
 * @returns merge density, cm^-3
 * @example mergeDensityCm3('Si', 'pearson-bardeen-1949', 0.045, 'donor') // 3.375e18
 */
export function mergeDensityCm3(
  material: SemiconductorId,
  model: IonizationModelId,
  isolatedLevelEv: number,
  kind: 'donor' | 'acceptor',
): number {
  if (model === 'constant-level') return PHYSICS_DEFAULTS.mottDensityCm3[material][kind];
  return Math.pow(isolatedLevelEv / levelLoweringEvCm(material), 3);
}

/**
 * @internal Decades below the merge density at which the merge of a level with the band
 * begins: D = D0 sqrt(max(1, E0 / E_ref)) with D0 = `PHYSICS_DEFAULTS.mergeOnsetDecades` (1.5)
 * and E_ref = `PHYSICS_DEFAULTS.mergeReferenceLevelEv` (45 meV). A deep level is still far
 * from the band where the merge begins, so its bound share must fall over more decades for the
 * ionized fraction, and with it rho, to change gradually with doping.
 */
export function mergeOnsetDecades(isolatedLevelEv: number): number {
  const depth = Math.max(1, isolatedLevelEv / PHYSICS_DEFAULTS.mergeReferenceLevelEv);
  return PHYSICS_DEFAULTS.mergeOnsetDecades * Math.sqrt(depth);
}

/**
 * @internal Share b of the dopants that still hold a bound level at impurity density N: exactly
 * 1 up to the onset N_on = N_merge 10^-D (`mergeOnsetDecades`), exactly 0 from N_merge on, and
 * between them b = 1 - (3 s^2 - 2 s^3) with s = ln(N / N_on) / ln(N_merge / N_on), continuous
 * with a continuous derivative at both ends. The rest count as merged with the band (ionized at
 * any temperature), as in the band-tail picture of Altermatt et al. 2006 (J. Appl. Phys. 100,
 * 113714), but with no merged share at all below N_on: a power law such as Altermatt's would
 * leave a temperature-independent leak of carriers far below the Mott density. Between N_on
 * and N_merge the merged share stands in for impurity-band conduction, which it overstates at
 * low temperature (hopping is not modelled).
 */
export function boundShare(
  impurityDensity: number,
  mergeDensity: number,
  isolatedLevelEv: number,
): number {
  const onset = mergeDensity * Math.pow(10, -mergeOnsetDecades(isolatedLevelEv));
  if (impurityDensity <= onset) return 1;
  if (impurityDensity >= mergeDensity) return 0;
  const s = Math.log(impurityDensity / onset) / Math.log(mergeDensity / onset);
  return 1 - s * s * (3 - 2 * s);
}

/**
 * @internal Effective level and bound share of one dopant species (see `carrierDensities`).
 * `impurityDensity` is N_D + N_A: the lowering comes from the Coulomb fields of all ionized
 * impurities, compensating ones included.
 */
export function dopantIonization(
  material: SemiconductorId,
  model: IonizationModelId,
  impurityDensity: number,
  isolatedLevelEv: number,
  kind: 'donor' | 'acceptor',
): { levelEv: number; boundFraction: number } {
  const merge = mergeDensityCm3(material, model, isolatedLevelEv, kind);
  const levelEv =
    model === 'constant-level'
      ? isolatedLevelEv
      : Math.max(0, isolatedLevelEv - levelLoweringEvCm(material) * Math.cbrt(impurityDensity));
  return { levelEv, boundFraction: boundShare(impurityDensity, merge, isolatedLevelEv) };
}
