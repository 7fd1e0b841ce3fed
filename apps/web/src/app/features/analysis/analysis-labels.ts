/** Every word the study page and the desks show for fits, regimes and parameters. */
import type {
  FitInterpretation,
  FitRequest,
  HallScattering,
  RegimeName,
} from '@rhotrace/api-types';

/** A parameter a full-model fit may free. */
export type FreeParameter = Extract<FitRequest, { kind: 'model' }>['free'][number];

/**
 * The compensation a person states for a freeze-out reading: `inferred` leaves `compensated` out
 * of the request (the API works it out), the others send true or false.
 */
export type CompensationChoice = 'inferred' | 'compensated' | 'uncompensated';

/** Parameter and kind words are shared with the printed reports. */
export { KIND_WORDS, PARAMETER_WORDS } from '@rhotrace/api-types';

export const FREE_WORDS: Readonly<Record<FreeParameter, string>> = {
  donorDensity: 'Donor density',
  acceptorDensity: 'Acceptor density',
  donorLevel: 'Donor level',
  acceptorLevel: 'Acceptor level',
  mobilityScale: 'Mobility scale',
};

export const REGIME_WORDS: Readonly<Record<RegimeName, string>> = {
  'freeze-out': 'Freeze-out',
  extrinsic: 'Extrinsic',
  intrinsic: 'Intrinsic',
};

export const PROPERTY_WORDS: Readonly<Record<NonNullable<FitInterpretation['property']>, string>> =
  {
    'band-gap-0K': 'Band gap extrapolated to 0 K',
    'dopant-level': 'Dopant ionization energy',
  };

export const COMPENSATION_CHOICE_WORDS: Readonly<Record<CompensationChoice, string>> = {
  inferred: 'Infer from the data',
  compensated: 'Compensated',
  uncompensated: 'Uncompensated',
};

export const COMPENSATION_WORDS: Readonly<Record<FitInterpretation['compensation'], string>> = {
  compensated: 'compensated',
  uncompensated: 'uncompensated',
  unknown: 'compensation unknown',
};

export const COMPENSATION_SOURCE_WORDS: Readonly<
  Record<FitInterpretation['compensationSource'], string>
> = {
  request: 'as stated',
  inferred: 'inferred from the data',
  'not-applicable': 'not applicable',
};

/** The quantity an Arrhenius plot shows: its toggle, legend and axis words. */
export const QUANTITY_WORDS: Readonly<
  Record<'resistivity' | 'conductivity', { toggle: string; legend: string; axis: string }>
> = {
  resistivity: { toggle: 'ln ρ', legend: 'measured ln ρ', axis: 'ln(ρ / Ω·cm)' },
  conductivity: { toggle: 'ln σ', legend: 'measured ln σ', axis: 'ln(σ · Ω·cm)' },
};

/** The T^m prefactor exponents offered for an Arrhenius window, with their words. */
export const PREFACTOR_CHOICES: ReadonlyArray<{ value: number; words: string }> = [
  { value: 0, words: 'm = 0' },
  { value: 1.5, words: 'm = 3/2' },
  { value: -1.5, words: 'm = −3/2' },
];

/** Words for a parameter, a kind or a regime not in the maps: the key itself. */
export function wordsFor(map: Readonly<Record<string, string>>, key: string): string {
  return map[key] ?? key;
}

/** The scattering mechanism a Hall-mobility exponent suggests. */
export const SCATTERING_WORDS: Readonly<Record<HallScattering, string>> = {
  'acoustic-phonon': 'acoustic phonons',
  'acoustic-and-optical-phonon': 'acoustic and optical phonons (lattice)',
  'ionized-impurity': 'ionized impurities',
  mixed: 'a mixture of lattice and impurity scattering',
};
