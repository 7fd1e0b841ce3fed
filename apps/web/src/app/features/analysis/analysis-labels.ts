/** Every word the study page and the desks show for fits, regimes and parameters. */
import type {
  FitInterpretation,
  FitRequest,
  HallScattering,
  RegimeName,
} from '@rhotrace/api-types';
import { SEMICONDUCTOR_NAMES } from '@rhotrace/physics';

/** Materials in running text ("silicon"). */
const MATERIAL_WORDS: Readonly<Record<string, string>> = Object.fromEntries(
  Object.entries(SEMICONDUCTOR_NAMES).map(([id, name]) => [id, name.toLowerCase()]),
);

/** A parameter a full-model fit may free. */
export type FreeParameter = Extract<FitRequest, { kind: 'model' }>['free'][number];

/**
 * The compensation a person states for a freeze-out reading: `inferred` leaves `compensated` out
 * of the request (the API works it out), the others send true or false.
 */
export type CompensationChoice = 'inferred' | 'compensated' | 'uncompensated';

/** Options of the Arrhenius window fit. */
export interface ArrheniusOptions {
  quantity: 'resistivity' | 'conductivity';
  prefactorExponent: number;
  compensation: CompensationChoice;
}

/** Parameter and kind words are shared with the printed reports. */
export { KIND_WORDS, PARAMETER_WORDS } from '@rhotrace/api-types';

/** A fit's name in a plot legend (the window and which fit follow it). */
export const FIT_TRACE_WORDS: Readonly<Record<string, string>> = {
  arrhenius: 'Arrhenius fit',
  model: 'Full-model fit',
  tcr: 'Linear TCR fit',
  'bloch-gruneisen': 'Bloch–Grüneisen fit',
  'carrier-density': 'Carrier-density fit',
  'hall-mobility': 'Hall-mobility fit',
};

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

const PARAMETER_SET_WORDS: Readonly<Record<string, string>> = {
  arrhenius: 'Arrhenius line',
  'linear-tcr': 'linear temperature coefficient',
  'bloch-gruneisen': 'Bloch–Grüneisen',
  'hall-mobility-power-law': 'Hall mobility power law',
};

/**
 * A stored model version (`physics@0.1.0+Si:si-scaled-t15`) in words: "Model: silicon,
 * Rhotrace physics 0.1". The version string stays in the stored fit and its exports.
 */
export function modelVersionWords(version: string): string {
  const match = /^physics@(\d+)\.(\d+)[^+]*\+(.*)$/.exec(version);
  if (!match) return `Model: ${version}`;
  const [, major, minor, set = ''] = match;
  const material = set.includes(':') ? set.slice(0, set.indexOf(':')) : null;
  const metal = /^metal-(.+)-bg$/.exec(set)?.[1];
  const what = material
    ? (MATERIAL_WORDS[material] ?? material)
    : metal
      ? `${metal} reference`
      : (PARAMETER_SET_WORDS[set] ?? set);
  return `Model: ${what}, Rhotrace physics ${major}.${minor}`;
}
