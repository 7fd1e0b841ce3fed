import type { DopantDensityResponse, DopingInput, LotDto, SemiconductorMaterialDto } from '@rhotrace/api-types';

/** Density the model starts from when the wafer has no measured dopant density, cm^-3. */
export const FALLBACK_DENSITY_CM3 = 1e15;
/** Minority dopant as a fraction of the majority (light compensation), when not known. */
export const COMPENSATION_FRACTION = 0.01;

type Level = SemiconductorMaterialDto['donors'][number];

function pick(levels: Level[] | undefined, name: string | null | undefined): Level | undefined {
  if (!levels) return undefined;
  return levels.find((l) => l.name === name) ?? levels.find((l) => l.isDefault) ?? levels[0];
}

/**
 * Starting doping for the model: the wafer's dopant density (from its 23 °C resistivity) when
 * there is one, the lot's doping type and element, and that element's level in the material.
 */
export function initialDoping(
  lot: Pick<LotDto, 'dopant' | 'dopantType'> | undefined,
  material: SemiconductorMaterialDto | undefined,
  dopant: DopantDensityResponse | null | undefined,
): DopingInput {
  const density = dopant?.dopantDensityCm3 ?? FALLBACK_DENSITY_CM3;
  const pType = lot?.dopantType === 'p';
  const donor = pick(material?.donors, pType ? null : lot?.dopant);
  const acceptor = pick(material?.acceptors, pType ? lot?.dopant : null);
  return {
    donorDensity: pType ? density * COMPENSATION_FRACTION : density,
    acceptorDensity: pType ? density : density * COMPENSATION_FRACTION,
    ...(donor ? { donor: donor.name, donorLevel: donor.levelEv } : {}),
    ...(acceptor ? { acceptor: acceptor.name, acceptorLevel: acceptor.levelEv } : {}),
  };
}
