import type {
  DopantDensityResponse,
  DopingInput,
  LotDto,
  SemiconductorMaterialDto,
} from '@rhotrace/api-types';
import { type Observable, catchError, map, of, switchMap } from 'rxjs';
import { formatExponent } from '../../../shared/engineering';

/** Density the model starts from when the wafer has no measured dopant density, cm^-3. */
export const FALLBACK_DENSITY_CM3 = 1e15;
/** Minority dopant as a fraction of the majority (light compensation), when not known. */
export const COMPENSATION_FRACTION = 0.01;

type Level = SemiconductorMaterialDto['donors'][number];

/** Where the majority density came from. */
export type DensityBasis = 'measured' | 'scaled' | 'fallback';

/** The model's starting doping and, in words, where each number came from. */
export interface StartingDoping {
  doping: DopingInput;
  majority: 'donor' | 'acceptor';
  basis: DensityBasis;
  /** One sentence for the page, e.g. "Donors (P) 1.55e15 cm⁻³ from …; acceptors 1 % of that …". */
  note: string;
}

function pick(levels: Level[] | undefined, name: string | null | undefined): Level | undefined {
  if (!levels) return undefined;
  return levels.find((l) => l.name === name) ?? levels.find((l) => l.isDefault) ?? levels[0];
}

/**
 * Starting doping for the model. The lot's doping type decides the majority (n: donors, p:
 * acceptors; unknown: donors); the majority density is the wafer's dopant density from its
 * 23 °C resistivity when the API has one, else FALLBACK_DENSITY_CM3; the minority is
 * COMPENSATION_FRACTION of it (light compensation). The lot's dopant names the majority level
 * when the material knows it; every other level is the material's default.
 */
export function startingDoping(
  lot: Pick<LotDto, 'dopant' | 'dopantType'> | undefined,
  material: SemiconductorMaterialDto | undefined,
  dopant: DopantDensityResponse | null | undefined,
  densityOverride?: { densityCm3: number; basis: 'scaled' },
): StartingDoping {
  const measured = dopant?.dopantDensityCm3 ?? null;
  const density = densityOverride?.densityCm3 ?? measured ?? FALLBACK_DENSITY_CM3;
  const basis: DensityBasis = densityOverride
    ? 'scaled'
    : measured !== null
      ? 'measured'
      : 'fallback';
  const pType = lot?.dopantType === 'p';
  const donor = pick(material?.donors, pType ? null : lot?.dopant);
  const acceptor = pick(material?.acceptors, pType ? lot?.dopant : null);
  const doping: DopingInput = {
    donorDensity: pType ? density * COMPENSATION_FRACTION : density,
    acceptorDensity: pType ? density : density * COMPENSATION_FRACTION,
    ...(donor ? { donor: donor.name, donorLevel: donor.levelEv } : {}),
    ...(acceptor ? { acceptor: acceptor.name, acceptorLevel: acceptor.levelEv } : {}),
  };
  const majorityWord = pType ? 'Acceptors' : 'Donors';
  const minorityWord = pType ? 'donors' : 'acceptors';
  const majorityName = (pType ? acceptor : donor)?.name;
  const minorityName = (pType ? donor : acceptor)?.name;
  const typeWord = lot?.dopantType
    ? `${lot.dopantType}-type lot`
    : 'lot of unknown type, taken as n';
  const from =
    basis === 'measured'
      ? `from the 23 °C resistivity (${dopant?.source ?? 'measured'})`
      : basis === 'scaled'
        ? 'scaled so the model meets the measured 23 °C resistivity'
        : 'a default guess (no measured density for this material)';
  const note =
    `${majorityWord}${majorityName ? ` (${majorityName})` : ''} ${formatExponent(density)} cm⁻³, ${from}; ` +
    `${minorityWord}${minorityName ? ` (${minorityName})` : ''} ${Math.round(COMPENSATION_FRACTION * 100)} % of that ` +
    `as light compensation (${typeWord}). Edit any value to redraw the model.`;
  return { doping, majority: pType ? 'acceptor' : 'donor', basis, note };
}

/** Majority density of a doping, cm^-3. */
export function majorityDensity(start: StartingDoping): number {
  return start.majority === 'acceptor' ? start.doping.acceptorDensity : start.doping.donorDensity;
}

/**
 * With no measured density, scales the majority density until the model meets the measured
 * 23 °C resistivity (ρ ∝ 1/N in the extrinsic range; two steps absorb the mobility's change).
 * `modelAt23` answers the model's resistivity at the ASTM F723 reference temperature.
 */
export function scaleToMeasured(
  base: StartingDoping,
  rho23OhmCm: number,
  modelAt23: (doping: DopingInput) => Observable<number | null>,
  make: (override: { densityCm3: number; basis: 'scaled' }) => StartingDoping,
): Observable<StartingDoping> {
  const step = (from: StartingDoping, rho: number | null): StartingDoping | null => {
    if (rho === null || !(rho > 0)) return null;
    const scaled = Math.min(1e21, Math.max(1e10, (majorityDensity(from) * rho) / rho23OhmCm));
    return make({ densityCm3: Number(scaled.toPrecision(3)), basis: 'scaled' });
  };
  return modelAt23(base.doping).pipe(
    switchMap((rho) => {
      const first = step(base, rho);
      if (!first) return of(base);
      return modelAt23(first.doping).pipe(map((rho2) => step(first, rho2) ?? first));
    }),
    catchError(() => of(base)),
  );
}
