/**
 * Plain-language reading of an Arrhenius activation energy.
 */
import { requireFiniteNumber, requireObject, requireOneOf, requireTemperatureK } from '../validate';
import { bandGapUnchecked, VARSHNI_PARAMETERS } from '../semiconductor/band-gap';
import type { SemiconductorId } from '../semiconductor/material';
import { SEMICONDUCTORS } from '../semiconductor/material';
import type { Regime } from '../semiconductor/neutrality';

/** Result of `interpretArrheniusSlope`. */
export interface ArrheniusReading {
  /** What the activation energy estimates. */
  quantity: 'band gap' | 'dopant ionization energy' | 'none';
  /** The implied value of that quantity, eV (null in the extrinsic range). */
  impliedEv: number | null;
  /** Multiplier applied to the activation energy (2 for Eg/2 or Ed/2, 1 for Ed). */
  factor: number | null;
  /** One or two sentences for the user. */
  text: string;
}

/**
 * Reads an activation energy from `fitArrhenius` in the light of the regime and compensation.
 *
 * Rules (Sze 1981; Blakemore 1962; from memory for the freeze-out slopes):
 * - intrinsic: n_i ~ exp(-Eg/2kT), so Ea ≈ Eg/2 and the gap is about 2 Ea; the value is the gap
 *   extrapolated linearly to 0 K (about 1.21 eV for Si, Morin & Maita 1954), not Eg at the
 *   measurement temperature;
 * - freeze-out, uncompensated: n ≈ sqrt(Nc Nd / 2) exp(-Ed/2kT), Ea ≈ Ed/2;
 * - freeze-out, compensated (n well below the compensating density): n ~ exp(-Ed/kT), Ea ≈ Ed;
 * - extrinsic: carriers are constant; the slope reflects mobility and is not an activation.
 * A T^m prefactor (`fitArrhenius` option) moves the result by about m k T.
 *
 * @param input activationEnergyEv, regime, compensated (freeze-out only; default false),
 *   optional material and mean temperatureK for a comparison
 * @example interpretArrheniusSlope({ activationEnergyEv: 0.6, regime: 'intrinsic', material: 'Si' })
 *   // { quantity: 'band gap', impliedEv: 1.2, factor: 2, text: 'Intrinsic range: ...' }
 */
export function interpretArrheniusSlope(input: {
  activationEnergyEv: number;
  regime: Regime;
  compensated?: boolean;
  material?: SemiconductorId;
  temperatureK?: number;
}): ArrheniusReading {
  const fn = 'interpretArrheniusSlope';
  const o = requireObject(fn, 'input', input);
  const ea = requireFiniteNumber(fn, 'activationEnergyEv', o['activationEnergyEv']);
  const regime = requireOneOf(fn, 'regime', o['regime'], [
    'freeze-out',
    'extrinsic',
    'intrinsic',
  ] as const);
  const compensated = o['compensated'] === undefined ? false : o['compensated'];
  if (typeof compensated !== 'boolean')
    throw new TypeError(`\`${fn}\` requires compensated to be a boolean`);
  const material =
    o['material'] === undefined
      ? undefined
      : requireOneOf(fn, 'material', o['material'], SEMICONDUCTORS);
  const t =
    o['temperatureK'] === undefined ? undefined : requireTemperatureK(fn, o['temperatureK']);
  const f = (v: number): string => v.toFixed(3);
  if (regime === 'extrinsic') {
    return {
      quantity: 'none',
      impliedEv: null,
      factor: null,
      text:
        `Extrinsic range: the dopants are fully ionized, so the slope (${f(ea)} eV) reflects the ` +
        'temperature dependence of mobility, not an activation energy.',
    };
  }
  if (ea <= 0) {
    return {
      quantity: 'none',
      impliedEv: null,
      factor: null,
      text: `The activation energy ${f(ea)} eV is not positive: the window does not show a thermally activated ${regime} range.`,
    };
  }
  if (regime === 'intrinsic') {
    const gap = 2 * ea;
    let text = `Intrinsic range: Ea ≈ Eg/2, so the band gap is about ${f(gap)} eV (the gap extrapolated linearly to 0 K).`;
    if (material) {
      const eg0 = VARSHNI_PARAMETERS[material].eg0Ev;
      const egT = t === undefined ? undefined : bandGapUnchecked(material, t);
      text += ` For ${material} the model gap is ${f(eg0)} eV at 0 K${egT === undefined ? '' : ` and ${f(egT)} eV at ${t!.toFixed(0)} K`}.`;
    }
    return { quantity: 'band gap', impliedEv: gap, factor: 2, text };
  }
  const factor = compensated ? 1 : 2;
  const level = factor * ea;
  const text = compensated
    ? `Freeze-out range, compensated sample: Ea ≈ Ed, so the dopant ionization energy is about ${f(level)} eV.`
    : `Freeze-out range, uncompensated sample: Ea ≈ Ed/2, so the dopant ionization energy is about ${f(level)} eV ` +
      '(if the sample is compensated, Ea ≈ Ed instead).';
  return { quantity: 'dopant ionization energy', impliedEv: level, factor, text };
}
