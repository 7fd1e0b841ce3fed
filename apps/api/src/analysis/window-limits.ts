import type { AnalysisStep } from '@rhotrace/api-types';
import {
  DOPANTS,
  SEMICONDUCTORS,
  dopingFromResistivity,
  windowLimits,
  type AcceptorId,
  type DonorId,
  type SemiconductorId,
  type WindowLimits,
} from '@rhotrace/physics';

/** The lot facts the suggested windows are checked against. */
export interface WindowSample {
  material: string;
  /** The lot's dopant as entered (symbol or English name), or null. */
  dopant: string | null;
  dopantType: 'n' | 'p' | null;
}

/** Temperature the net doping is read at when the extrinsic window holds it, K. */
export const DOPING_READ_TEMPERATURE_K = 300;

const NAMES: Readonly<Record<string, string>> = {
  phosphorus: 'P',
  arsenic: 'As',
  antimony: 'Sb',
  nitrogen: 'N',
  silicon: 'Si',
  tellurium: 'Te',
  boron: 'B',
  aluminium: 'Al',
  aluminum: 'Al',
  gallium: 'Ga',
  indium: 'In',
  zinc: 'Zn',
  beryllium: 'Be',
  carbon: 'C',
};

/**
 * The dopant species of a lot as the physics tables name it, with the conduction type it
 * implies; empty when the name is not a dopant of that material.
 */
export function dopantSpecies(
  material: SemiconductorId,
  dopant: string | null,
): { donor?: DonorId; acceptor?: AcceptorId; type?: 'n' | 'p' } {
  const raw = (dopant ?? '').trim();
  const symbol = NAMES[raw.toLowerCase()] ?? raw;
  const table = DOPANTS[material];
  const donor = Object.keys(table.donors).find((k) => k.toLowerCase() === symbol.toLowerCase());
  if (donor) return { donor: donor as DonorId, type: 'n' };
  const acceptor = Object.keys(table.acceptors).find(
    (k) => k.toLowerCase() === symbol.toLowerCase(),
  );
  if (acceptor) return { acceptor: acceptor as AcceptorId, type: 'p' };
  return {};
}

/**
 * Where the model puts the end of freeze-out (half the net doping ionized) and the start of the
 * intrinsic range (n_i = 3 N_net) for this sample (`windowLimits` of the physics library), with
 * the net doping read from the extrinsic steps: the model inverted (`dopingFromResistivity`) at
 * the step nearest 300 K, uncompensated. A reason instead when the sample gives no reading.
 */
export function modelWindowLimits(
  sample: WindowSample,
  extrinsicSteps: readonly AnalysisStep[],
): WindowLimits | { reason: string } {
  if (!(SEMICONDUCTORS as readonly string[]).includes(sample.material)) {
    return { reason: `${sample.material} has no semiconductor model to check the window against.` };
  }
  const material = sample.material as SemiconductorId;
  const species = dopantSpecies(material, sample.dopant);
  const type = sample.dopantType ?? species.type;
  if (!type) {
    return {
      reason:
        'The lot has no dopant type, so the window is not checked against the regime ' +
        'transitions of the model.',
    };
  }
  const nearest = [...extrinsicSteps].sort(
    (a, b) =>
      Math.abs(a.temperatureK - DOPING_READ_TEMPERATURE_K) -
      Math.abs(b.temperatureK - DOPING_READ_TEMPERATURE_K),
  )[0];
  const sameType = species.type === type ? species : {};
  const doping = nearest
    ? dopingFromResistivity(
        material,
        type,
        nearest.resistivityOhmCm,
        nearest.temperatureK,
        sameType.donor
          ? { donor: sameType.donor }
          : sameType.acceptor
            ? { acceptor: sameType.acceptor }
            : {},
      )
    : null;
  if (!doping) {
    return {
      reason:
        'No extrinsic range to read the net doping from, so the window is not checked ' +
        'against the regime transitions of the model.',
    };
  }
  return windowLimits(material, doping);
}
