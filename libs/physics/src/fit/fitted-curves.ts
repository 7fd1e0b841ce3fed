/**
 * The curves fitted by `fitArrhenius` and `fitLinearTcr`, evaluated from their parameters, so a
 * stored fit can be drawn without running it again (Bloch–Grüneisen: `blochGruneisen`; the full
 * model: `resistivity`).
 */
import { BOLTZMANN_EV_PER_K } from '../constants';
import { PHYSICS_DEFAULTS } from '../defaults';
import { requireFiniteNumber, requireObject, requirePositive } from '../validate';
import type { ArrheniusParameter } from './arrhenius';
import type { TcrParameter } from './tcr';

/**
 * The value an Arrhenius fit describes at a temperature: the inverse of the fitted line
 *   resistivity:  ln(value * T^m)  = a + Ea / (k T)
 *   conductivity: ln(value * T^-m) = a - Ea / (k T)
 * (the formula `fitArrhenius` fits, same parameters and options).
 *
 * @param parameters `activationEnergyEv` (eV) and `intercept` (a) of an `ArrheniusFit`
 * @param options the fit's quantity and prefactor exponent m (defaults as `fitArrhenius`)
 * @param temperatureK temperature, K (> 0)
 * @returns resistivity in ohm cm, or conductivity in S/cm, as the fit's quantity
 * @example arrheniusValue({ activationEnergyEv: 0.6, intercept: 0 }, {}, 500)
 *   // exp(0.6 / (8.617333262e-5 * 500)) ≈ 1.1e6
 */
export function arrheniusValue(
  parameters: Record<ArrheniusParameter, number>,
  options: { quantity?: 'resistivity' | 'conductivity'; prefactorExponent?: number },
  temperatureK: number,
): number {
  const fn = 'arrheniusValue';
  const p = requireObject(fn, 'parameters', parameters);
  const ea = requireFiniteNumber(fn, 'parameters.activationEnergyEv', p['activationEnergyEv']);
  const a = requireFiniteNumber(fn, 'parameters.intercept', p['intercept']);
  const t = requirePositive(fn, 'temperatureK', temperatureK);
  const quantity = options.quantity ?? PHYSICS_DEFAULTS.arrheniusQuantity;
  const m = options.prefactorExponent ?? PHYSICS_DEFAULTS.arrheniusPrefactorExponent;
  const sign = quantity === 'resistivity' ? 1 : -1;
  return Math.exp(a + (sign * ea) / (BOLTZMANN_EV_PER_K * t) - sign * m * Math.log(t));
}

/**
 * The line a linear TCR fit describes: rho(T) = rho_ref [1 + alpha (T - T_ref)] (as
 * `fitLinearTcr`).
 *
 * @param parameters `referenceResistivityOhmCm` (ohm cm) and `alphaPerK` (1/K)
 * @param referenceK the fit's reference temperature, K (`PHYSICS_DEFAULTS.tcrReferenceK` by default)
 * @param temperatureK temperature, K
 * @returns resistivity, ohm cm
 * @example linearTcrResistivity({ referenceResistivityOhmCm: 1.68e-6, alphaPerK: 0.0039 },
 *   293.15, 393.15) // 1.68e-6 * 1.39 = 2.335e-6
 */
export function linearTcrResistivity(
  parameters: Record<TcrParameter, number>,
  referenceK: number,
  temperatureK: number,
): number {
  const fn = 'linearTcrResistivity';
  const p = requireObject(fn, 'parameters', parameters);
  const rho = requireFiniteNumber(
    fn,
    'parameters.referenceResistivityOhmCm',
    p['referenceResistivityOhmCm'],
  );
  const alpha = requireFiniteNumber(fn, 'parameters.alphaPerK', p['alphaPerK']);
  const ref = requireFiniteNumber(fn, 'referenceK', referenceK);
  const t = requireFiniteNumber(fn, 'temperatureK', temperatureK);
  return rho * (1 + alpha * (t - ref));
}
