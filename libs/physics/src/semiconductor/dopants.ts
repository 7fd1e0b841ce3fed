/**
 * Dopants, their ionization energies per material, and the `Doping` description of a sample.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import type { IonizationModelId } from '../defaults';
import { describeValue, requireFiniteNumber, requireNonNegative, requireObject } from '../validate';
import { dopantIonization } from './ionization';
import type { Citation, SemiconductorId } from './material';

/** Donor species the tables know. */
export type DonorId = 'P' | 'As' | 'Sb' | 'N' | 'Si' | 'Te';
/** Acceptor species the tables know. */
export type AcceptorId = 'B' | 'Al' | 'Ga' | 'In' | 'Zn' | 'Be' | 'C';

/** Doping of a sample. Densities in cm^-3; levels are ionization energies in eV. */
export interface Doping {
  donorDensity: number;
  acceptorDensity: number;
  /** Donor ionization energy (below the conduction band edge), eV; overrides `donor`. */
  donorLevel?: number;
  /** Acceptor ionization energy (above the valence band edge), eV; overrides `acceptor`. */
  acceptorLevel?: number;
  /** Donor species; picks the level when `donorLevel` is absent. */
  donor?: DonorId;
  /** Acceptor species; picks the level when `acceptorLevel` is absent. */
  acceptor?: AcceptorId;
}

/** Ionization energies of one material, eV, with the default shallow species. */
export interface DopantTable {
  donors: Partial<Record<DonorId, number>>;
  acceptors: Partial<Record<AcceptorId, number>>;
  defaultDonor: DonorId;
  defaultAcceptor: AcceptorId;
  source: Citation;
}

/** Dopant ionization energies per material, eV. */
export const DOPANTS: Readonly<Record<SemiconductorId, DopantTable>> = {
  Si: {
    donors: { P: 0.045, As: 0.054, Sb: 0.039 },
    acceptors: { B: 0.045, Al: 0.067, Ga: 0.072, In: 0.16 },
    defaultDonor: 'P',
    defaultAcceptor: 'B',
    source: { label: 'Sze 1981', reference: 'Physics of Semiconductor Devices, 2nd ed.' },
  },
  Ge: {
    donors: { P: 0.012, As: 0.0127, Sb: 0.0096 },
    acceptors: { B: 0.0104, Al: 0.0102, Ga: 0.0108 },
    defaultDonor: 'As',
    defaultAcceptor: 'Ga',
    source: { label: 'Sze 1981; Solymar & Walsh', reference: 'Physics of Semiconductor Devices' },
  },
  GaAs: {
    donors: { Si: 0.0058, Te: 0.0058 },
    acceptors: { Zn: 0.0307, Be: 0.028, C: 0.026 },
    defaultDonor: 'Si',
    defaultAcceptor: 'Zn',
    source: {
      label: 'Sze 1981',
      reference: 'Physics of Semiconductor Devices, 2nd ed., ionization-energy figure',
      fromMemory: true,
    },
  },
  '4H-SiC': {
    donors: { N: 0.061 },
    acceptors: { Al: 0.2, B: 0.3 },
    defaultDonor: 'N',
    defaultAcceptor: 'Al',
    source: { label: 'device-simulator set', reference: 'N 61 meV, Al 200 meV', fromMemory: true },
  },
};

/** Doping with both levels resolved, as the solvers use it. */
export interface ResolvedDoping {
  donorDensity: number;
  acceptorDensity: number;
  /** Effective donor ionization energy at this doping (after any lowering), eV, >= 0. */
  donorLevelEv: number;
  /** Effective acceptor ionization energy at this doping (after any lowering), eV, >= 0. */
  acceptorLevelEv: number;
  /**
   * Fraction of the donors that still have a bound level (0 to 1); the rest have merged with the
   * band and count as ionized. 0 means fully ionized (at or above the merge density).
   */
  donorBoundFraction: number;
  /** The same for the acceptors. */
  acceptorBoundFraction: number;
}

/** Highest doping density accepted, cm^-3 (above it Boltzmann statistics mean nothing). */
export const MAX_DOPING_CM3 = 1e22;

/** @internal Checks the ionization-model option for a material. */
export function resolveIonizationModel(
  fn: string,
  material: SemiconductorId,
  model: unknown,
): IonizationModelId {
  if (model === undefined) return PHYSICS_DEFAULTS.ionizationModel[material];
  if (model !== 'pearson-bardeen-1949' && model !== 'constant-level') {
    const Err = typeof model === 'string' ? RangeError : TypeError;
    throw new Err(
      `\`${fn}\` requires options.ionizationModel to be one of pearson-bardeen-1949, constant-level, ` +
        `got ${describeValue(model)}`,
    );
  }
  return model;
}

/** @internal Resolves effective levels and bound fractions from isolated levels. */
export function ionizeDoping(
  material: SemiconductorId,
  model: IonizationModelId,
  donorDensity: number,
  acceptorDensity: number,
  donorLevel0Ev: number,
  acceptorLevel0Ev: number,
): ResolvedDoping {
  const total = donorDensity + acceptorDensity;
  const d = dopantIonization(material, model, total, donorLevel0Ev, 'donor');
  const a = dopantIonization(material, model, total, acceptorLevel0Ev, 'acceptor');
  return {
    donorDensity,
    acceptorDensity,
    donorLevelEv: d.levelEv,
    acceptorLevelEv: a.levelEv,
    donorBoundFraction: d.boundFraction,
    acceptorBoundFraction: a.boundFraction,
  };
}

/** @internal Checked densities and isolated (dilute-limit) levels of a Doping. */
export interface CheckedDoping {
  donorDensity: number;
  acceptorDensity: number;
  donorLevel0Ev: number;
  acceptorLevel0Ev: number;
}

/** @internal Checks a Doping and resolves its isolated levels for a material. */
export function checkDoping(fn: string, material: SemiconductorId, doping: unknown): CheckedDoping {
  const d = requireObject(fn, 'doping', doping);
  const donorDensity = requireNonNegative(fn, 'doping.donorDensity', d['donorDensity']);
  const acceptorDensity = requireNonNegative(fn, 'doping.acceptorDensity', d['acceptorDensity']);
  if (donorDensity > MAX_DOPING_CM3 || acceptorDensity > MAX_DOPING_CM3) {
    throw new RangeError(
      `\`${fn}\` requires doping densities of at most ${MAX_DOPING_CM3} cm^-3, got ` +
        `${Math.max(donorDensity, acceptorDensity)}`,
    );
  }
  const table = DOPANTS[material];
  const donorLevel0Ev = resolveLevel(fn, material, d, 'donor', table.donors, table.defaultDonor);
  const acceptorLevel0Ev = resolveLevel(
    fn,
    material,
    d,
    'acceptor',
    table.acceptors,
    table.defaultAcceptor,
  );
  return { donorDensity, acceptorDensity, donorLevel0Ev, acceptorLevel0Ev };
}

/**
 * @internal Checks a Doping and resolves its effective levels and bound fractions for a material
 * under an ionization model (default per material in `PHYSICS_DEFAULTS.ionizationModel`).
 */
export function resolveDoping(
  fn: string,
  material: SemiconductorId,
  doping: unknown,
  ionizationModel?: unknown,
): ResolvedDoping {
  const c = checkDoping(fn, material, doping);
  const model = resolveIonizationModel(fn, material, ionizationModel);
  return ionizeDoping(
    material,
    model,
    c.donorDensity,
    c.acceptorDensity,
    c.donorLevel0Ev,
    c.acceptorLevel0Ev,
  );
}

function resolveLevel(
  fn: string,
  material: SemiconductorId,
  d: Record<string, unknown>,
  kind: 'donor' | 'acceptor',
  levels: Partial<Record<string, number>>,
  fallback: string,
): number {
  const explicit = d[`${kind}Level`];
  if (explicit !== undefined) {
    const v = requireFiniteNumber(fn, `doping.${kind}Level`, explicit);
    if (v <= 0 || v > 1) {
      throw new RangeError(
        `\`${fn}\` requires doping.${kind}Level above 0 and at most 1 eV, got ${v}`,
      );
    }
    return v;
  }
  const name = d[kind];
  if (name === undefined) return levels[fallback]!;
  const level = typeof name === 'string' ? levels[name] : undefined;
  if (level === undefined) {
    const known = Object.keys(levels).join(', ');
    const Err = typeof name === 'string' ? RangeError : TypeError;
    throw new Err(
      `\`${fn}\` requires doping.${kind} to be one of ${known} for ${material}, got ${describeValue(name)}`,
    );
  }
  return level;
}
