/**
 * Electron and hole drift mobility against temperature and total impurity density.
 */
import type { MobilityModelId } from '../defaults';
import { PHYSICS_DEFAULTS } from '../defaults';
import { logisticComplement } from '../numeric/log-math';
import { requireNonNegative, requireOneOf, requireTemperatureK } from '../validate';
import type { Carrier, Citation, SemiconductorId } from './material';
import { requireCarrier, requireSemiconductor } from './material';

/** Arora–Hauser–Roulston parameters for one carrier. */
export interface AroraParameters {
  muMin: number;
  b1: number;
  mu0: number;
  b2: number;
  nRef: number;
  b3: number;
  alpha: number;
  b4: number;
}

/**
 * Arora, Hauser & Roulston 1982 silicon set (IEEE Trans. Electron Devices 29, 292), fitted over
 * about 200–500 K and 1e13–1e20 cm^-3.
 */
export const ARORA_1982_SILICON: Readonly<Record<Carrier, AroraParameters>> = {
  electron: {
    muMin: 88,
    b1: -0.57,
    mu0: 1252,
    b2: -2.33,
    nRef: 1.26e17,
    b3: 2.4,
    alpha: 0.88,
    b4: -0.146,
  },
  hole: {
    muMin: 54.3,
    b1: -0.57,
    mu0: 407,
    b2: -2.23,
    nRef: 2.35e17,
    b3: 2.4,
    alpha: 0.88,
    b4: -0.146,
  },
};

/** Caughey–Thomas parameters for one carrier, at 300 K. */
export interface CaugheyThomasParameters {
  /** cm^2/(V s) */
  muMin: number;
  /** Lattice-limited (undoped) mobility at 300 K, cm^2/(V s). */
  muMax: number;
  /** cm^-3 */
  nRef: number;
  alpha: number;
}

/** Caughey–Thomas sets per material with their sources. */
export const CAUGHEY_THOMAS_SETS: Readonly<
  Record<
    SemiconductorId,
    { electron: CaugheyThomasParameters; hole: CaugheyThomasParameters; source: Citation }
  >
> = {
  Si: {
    electron: { muMin: 65, muMax: 1330, nRef: 8.5e16, alpha: 0.72 },
    hole: { muMin: 47.7, muMax: 495, nRef: 6.3e16, alpha: 0.76 },
    source: { label: 'Caughey & Thomas 1967', reference: 'Proc. IEEE 55, 2192 (1967)' },
  },
  Ge: {
    electron: { muMin: 0, muMax: 3900, nRef: 1e17, alpha: 0.5 },
    hole: { muMin: 0, muMax: 1900, nRef: 1e17, alpha: 0.5 },
    source: {
      label: 'Hilsum 1974 form; Sze 1981 lattice values',
      reference: 'Electron. Lett. 10, 259 (1974): mu = mu_L / (1 + sqrt(N / 1e17))',
      fromMemory: true,
    },
  },
  GaAs: {
    electron: { muMin: 500, muMax: 9400, nRef: 6e16, alpha: 0.394 },
    hole: { muMin: 20, muMax: 491.5, nRef: 1.48e17, alpha: 0.38 },
    source: {
      label: 'Sotoodeh et al. 2000',
      reference: 'J. Appl. Phys. 87, 2890 (2000)',
      fromMemory: true,
    },
  },
  '4H-SiC': {
    electron: { muMin: 40, muMax: 947, nRef: 1.94e17, alpha: 0.61 },
    hole: { muMin: 15.9, muMax: 124, nRef: 1.76e19, alpha: 0.34 },
    source: {
      label: 'Roschke & Schwierz 2001',
      reference: 'IEEE Trans. Electron Devices 48, 1442 (2001)',
      fromMemory: true,
    },
  },
};

/** Lattice exponent of the ideal acoustic-phonon model: mu_L ~ T^-3/2. */
export const IDEAL_LATTICE_EXPONENT = 1.5;

/** Options of the mobility functions. */
export interface MobilityOptions {
  /** Model; default per material in `PHYSICS_DEFAULTS.mobilityModel` (Si: 'arora-1982'). */
  mobilityModel?: MobilityModelId;
}

const MODELS: readonly MobilityModelId[] = ['arora-1982', 'caughey-thomas-ideal'];

/** @internal Resolves and checks the mobility model for a material. */
export function resolveMobilityModel(
  fn: string,
  material: SemiconductorId,
  model: unknown,
): MobilityModelId {
  if (model === undefined) return PHYSICS_DEFAULTS.mobilityModel[material];
  const id = requireOneOf(fn, 'mobilityModel', model, MODELS);
  if (id === 'arora-1982' && material !== 'Si') {
    throw new RangeError(
      `\`${fn}\` requires mobilityModel 'caughey-thomas-ideal' for ${material}, got "arora-1982"`,
    );
  }
  return id;
}

/**
 * @internal A mobility model's temperature-only factors at one temperature, in the common form
 * mu = base + scale / (1 + exp(exponent (ln N - lnDensityRef))), so a curve or a fit computes
 * them once. Powers are taken as exp(b ln x), which V8 evaluates several times faster than
 * Math.pow (equal within a few ulps).
 */
export interface MobilityTerms {
  base: number;
  scale: number;
  lnDensityRef: number;
  exponent: number;
}

/** ln N_ref of each Arora carrier, taken once (a curve needs them at every temperature). */
const ARORA_LN_REF: Readonly<Record<Carrier, number>> = {
  electron: Math.log(ARORA_1982_SILICON.electron.nRef),
  hole: Math.log(ARORA_1982_SILICON.hole.nRef),
};

/** @internal The temperature-only factors of `mobilityUnchecked`. */
export function mobilityTerms(
  material: SemiconductorId,
  carrier: Carrier,
  temperatureK: number,
  model: MobilityModelId,
): MobilityTerms {
  return mobilityTermsAtLn(material, carrier, Math.log(temperatureK / 300), model);
}

/**
 * @internal `mobilityTerms` from ln(T / 300), so the two carriers of one temperature share the
 * logarithm.
 */
export function mobilityTermsAtLn(
  material: SemiconductorId,
  carrier: Carrier,
  lnTn: number,
  model: MobilityModelId,
): MobilityTerms {
  if (model === 'arora-1982') {
    const p = ARORA_1982_SILICON[carrier];
    return {
      base: p.muMin * Math.exp(p.b1 * lnTn),
      scale: p.mu0 * Math.exp(p.b2 * lnTn),
      lnDensityRef: ARORA_LN_REF[carrier] + p.b3 * lnTn,
      exponent: p.alpha * Math.exp(p.b4 * lnTn),
    };
  }
  const p = CAUGHEY_THOMAS_SETS[material][carrier];
  const lattice = p.muMax * Math.exp(-IDEAL_LATTICE_EXPONENT * lnTn);
  return {
    base: p.muMin,
    scale: lattice - p.muMin,
    lnDensityRef: Math.log(p.nRef),
    exponent: p.alpha,
  };
}

/**
 * @internal Mobility from its temperature terms at a total impurity density, given as its
 * logarithm (-Infinity for none) so a curve takes it once.
 */
export function mobilityAt(terms: MobilityTerms, lnImpurityDensity: number): number {
  return (
    terms.base +
    terms.scale / (1 + Math.exp(terms.exponent * (lnImpurityDensity - terms.lnDensityRef)))
  );
}

/**
 * @internal d mu / d ln N of `mobilityAt`: with x = exponent (ln N - ln N_ref),
 * -scale exponent e^x / (1 + e^x)^2, written as two logistic factors so it cannot overflow.
 */
export function mobilitySlopeAt(terms: MobilityTerms, lnImpurityDensity: number): number {
  const x = terms.exponent * (lnImpurityDensity - terms.lnDensityRef);
  return -terms.scale * terms.exponent * logisticComplement(x) * logisticComplement(-x);
}

/** @internal Mobility without input checks. */
export function mobilityUnchecked(
  material: SemiconductorId,
  carrier: Carrier,
  temperatureK: number,
  impurityDensity: number,
  model: MobilityModelId,
): number {
  return mobilityAt(
    mobilityTerms(material, carrier, temperatureK, model),
    Math.log(impurityDensity),
  );
}

/**
 * Drift mobility of electrons or holes.
 *
 * Default for silicon (`PHYSICS_DEFAULTS.mobilityModel`): Arora, Hauser & Roulston 1982, with
 * Tn = T / 300,
 *   mu = mu_min Tn^b1 + mu_0 Tn^b2 / (1 + [N / (N_ref Tn^b3)]^(alpha Tn^b4)),
 * whose lattice exponents b2 are the measured -2.33 (electrons) and -2.23 (holes).
 * Other materials, and silicon with `mobilityModel: 'caughey-thomas-ideal'`: Caughey–Thomas with
 * the ideal acoustic-phonon lattice term mu_L = mu_max (T/300)^-3/2,
 *   mu = mu_min + (mu_L - mu_min) / (1 + (N / N_ref)^alpha).
 * Lattice and impurity scattering combine through the doping-dependent formula itself, not by
 * Matthiessen's rule. N is the total impurity density N_D + N_A (ionized or not).
 * Fitted ranges: Arora 200–500 K; Caughey–Thomas sets at 300 K; elsewhere they extrapolate.
 * Sources: N. D. Arora, J. R. Hauser, D. J. Roulston, IEEE Trans. Electron Devices 29, 292 (1982);
 * D. M. Caughey, R. E. Thomas, Proc. IEEE 55, 2192 (1967); sets in `CAUGHEY_THOMAS_SETS`.
 *
 * @param material semiconductor id
 * @param carrier 'electron' or 'hole'
 * @param temperatureK temperature, K (1 to 1500)
 * @param totalImpurityDensity N_D + N_A, cm^-3 (>= 0)
 * @param options optional mobility model
 * @returns mobility, cm^2/(V s)
 * @example mobility('Si', 'electron', 300, 1e17) // 777.4 (cm^2/(V s))
 */
export function mobility(
  material: SemiconductorId,
  carrier: Carrier,
  temperatureK: number,
  totalImpurityDensity: number,
  options: MobilityOptions = {},
): number {
  const m = requireSemiconductor('mobility', material);
  const c = requireCarrier('mobility', carrier);
  const t = requireTemperatureK('mobility', temperatureK);
  const n = requireNonNegative('mobility', 'totalImpurityDensity', totalImpurityDensity);
  if (n > 1e22) {
    throw new RangeError(
      `\`mobility\` requires totalImpurityDensity of at most 1e22 cm^-3, got ${n}`,
    );
  }
  const model = resolveMobilityModel('mobility', m, options?.mobilityModel);
  return mobilityUnchecked(m, c, t, n, model);
}
