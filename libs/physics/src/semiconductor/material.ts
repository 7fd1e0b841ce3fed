/**
 * The semiconductors the library models and the check that a material id is one of them.
 */
import { requireOneOf } from '../validate';

/** Semiconductor materials with full parameter sets. */
export type SemiconductorId = 'Si' | 'Ge' | 'GaAs' | '4H-SiC';

/** Charge carrier kind. */
export type Carrier = 'electron' | 'hole';

/** All supported semiconductor ids, in display order. */
export const SEMICONDUCTORS: readonly SemiconductorId[] = ['Si', 'Ge', 'GaAs', '4H-SiC'];

/** Display names of the semiconductors. */
export const SEMICONDUCTOR_NAMES: Readonly<Record<SemiconductorId, string>> = {
  Si: 'Silicon',
  Ge: 'Germanium',
  GaAs: 'Gallium arsenide',
  '4H-SiC': 'Silicon carbide (4H polytype)',
};

/** A literature source for a parameter set. */
export interface Citation {
  /** Short author-year label, e.g. "Thurmond 1975". */
  label: string;
  /** Journal, book or standard reference. */
  reference: string;
  /** True where the value was taken from memory and not confirmed against a copy of the source. */
  fromMemory?: boolean;
}

/** Throws unless `material` is a supported semiconductor id. */
export function requireSemiconductor(fn: string, material: unknown): SemiconductorId {
  return requireOneOf(fn, 'material', material, SEMICONDUCTORS);
}

/** Throws unless `carrier` is 'electron' or 'hole'. */
export function requireCarrier(fn: string, carrier: unknown): Carrier {
  return requireOneOf(fn, 'carrier', carrier, ['electron', 'hole'] as const);
}
