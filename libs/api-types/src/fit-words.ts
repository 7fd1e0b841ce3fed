/** Words and units for fits, shared by the web app and the printed reports (one wording). */
import type { FitKind } from './fits';

/** Words and units for the parameters fits report. */
export const PARAMETER_WORDS: Readonly<Record<string, string>> = {
  activationEnergyEv: 'Activation energy (eV)',
  intercept: 'Intercept (ln)',
  impliedEv: 'Implied level or gap (eV)',
  donorDensity: 'Donor density (cm⁻³)',
  acceptorDensity: 'Acceptor density (cm⁻³)',
  donorLevel: 'Donor ionization energy (eV)',
  acceptorLevel: 'Acceptor ionization energy (eV)',
  mobilityScale: 'Mobility scale',
  referenceResistivityOhmCm: 'ρ at reference (Ω·cm)',
  alphaPerK: 'Temperature coefficient (1/K)',
  exponent: 'Mobility exponent',
  mobilityAt300K: 'Hall mobility at 300 K (cm²/(V s))',
  residualOhmCm: 'Residual resistivity (Ω·cm)',
  couplingOhmCm: 'Phonon coupling (Ω·cm)',
  debyeK: 'Debye temperature (K)',
};

/** A fit kind in words. */
export const KIND_WORDS: Readonly<Record<FitKind, string>> = {
  arrhenius: 'Arrhenius window',
  model: 'Full model',
  tcr: 'Linear TCR',
  'bloch-gruneisen': 'Bloch–Grüneisen',
  'carrier-density': 'Hall carrier density',
  'hall-mobility': 'Hall mobility',
};
