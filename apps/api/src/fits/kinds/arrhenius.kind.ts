import type { RegimeName } from '@rhotrace/api-types';
import { DOPANTS, SEMICONDUCTORS, fitArrhenius, interpretArrheniusSlope } from '@rhotrace/physics';
import { z } from 'zod';
import { withPhysicsOnData } from '../../analysis/physics-errors';
import { regimeOfWindow, suggestWindows } from '../../analysis/suggested-windows';
import { averageSteps } from '../../analysis/sweep-data.service';
import { inferCompensation, interpretArrhenius } from '../arrhenius-interpretation';
import { computationOf } from '../fit-computation';
import type { FitKindEntry } from '../fit-kinds';
import { boundsInOrder, fitOptionsShape, kelvin } from '../fit-schemas';

const isSemiconductorId = (m: string): m is (typeof SEMICONDUCTORS)[number] =>
  (SEMICONDUCTORS as readonly string[]).includes(m);

/** The isolated level of the lot's dopant in the material's table (Sze 1981), eV, or null. */
function tabulatedLevel(material: string, dopant: string | null): number | null {
  if (!dopant || !isSemiconductorId(material)) return null;
  const table = DOPANTS[material];
  const levels: Record<string, number | undefined> = { ...table.donors, ...table.acceptors };
  return levels[dopant] ?? null;
}

/**
 * Arrhenius fit through `fitArrhenius` on dwell-step means; the reading is
 * `interpretArrheniusSlope` for the regime (given, or that of the suggested window the fit window
 * overlaps most) and the interpretation states the same as data.
 */
export const arrheniusKind: FitKindEntry<'arrhenius'> = {
  schema: boundsInOrder(
    z
      .object({
        kind: z.literal('arrhenius'),
        minK: kelvin,
        maxK: kelvin,
        quantity: z.enum(['resistivity', 'conductivity']).optional(),
        prefactorExponent: z
          .number()
          .finite()
          .min(-5, 'must be at least -5')
          .max(5, 'must be at most 5')
          .optional(),
        regime: z.enum(['freeze-out', 'extrinsic', 'intrinsic']).optional(),
        compensated: z.boolean().optional(),
        ...fitOptionsShape,
      })
      .strict(),
  ),
  run(request, context) {
    const quantity = request.quantity ?? 'resistivity';
    const prefactorExponent = request.prefactorExponent ?? 0;
    const options = {
      quantity,
      prefactorExponent,
      stepToleranceK: context.stepToleranceK,
      temperatureUncertaintyK: context.temperatureUncertaintyK,
    };
    const r = withPhysicsOnData('Arrhenius fit', () =>
      fitArrhenius(
        context.points.map((p) => ({
          temperatureK: p.temperatureK,
          value: quantity === 'conductivity' ? 1 / p.resistivityOhmCm : p.resistivityOhmCm,
        })),
        options,
      ),
    );
    // Suggested windows cost a pass over every step (about 0.2 s at 100,000 readings): only
    // when the request does not name the regime.
    const suggested = request.regime ? [] : suggestWindows(averageSteps(context.all), context.all);
    const regime: RegimeName | null =
      request.regime ?? regimeOfWindow(suggested, request.minK, request.maxK);
    const ea = r.parameters.activationEnergyEv;
    const compensation =
      regime !== 'freeze-out'
        ? null
        : request.compensated !== undefined
          ? {
              compensation: request.compensated
                ? ('compensated' as const)
                : ('uncompensated' as const),
              source: 'request' as const,
              why: '',
            }
          : inferCompensation(ea, context.all, {
              stepToleranceK: context.stepToleranceK,
              prefactorExponent,
              tableLevelEv: tabulatedLevel(context.material, context.dopant),
            });
    const first = context.points[0]!.temperatureK;
    const last = context.points[context.points.length - 1]!.temperatureK;
    const interpretation = interpretArrhenius(r, {
      regime,
      prefactorExponent,
      compensation,
      meanTemperatureK: (first + last) / 2,
    });
    const text = regime
      ? interpretArrheniusSlope({
          activationEnergyEv: ea,
          regime,
          compensated: compensation?.compensation === 'compensated',
          material: isSemiconductorId(context.material) ? context.material : undefined,
          temperatureK: (first + last) / 2,
        }).text + (request.regime ? '' : ' (Regime taken from the suggested windows.)')
      : 'No regime was given or suggested for this window, so the slope is not interpreted.';
    const computation = computationOf(r, context.points, { reading: text });
    if (interpretation.valueEv !== null)
      computation.parameters['impliedEv'] = interpretation.valueEv;
    computation.interpretation = interpretation;
    computation.curvature = r.curvature;
    // With a regime given the curvature check alone says whether the window bends.
    const spanned = suggested.filter(
      (w) => Math.min(request.maxK, w.maxK) - Math.max(request.minK, w.minK) > 0,
    );
    if (new Set(spanned.map((w) => w.regime)).size > 1) {
      computation.warnings.push(
        `The window overlaps the suggested ${[...new Set(spanned.map((w) => w.regime))].join(' and ')} ranges.`,
      );
    }
    return {
      computation,
      inputs: {
        kind: 'arrhenius',
        minK: request.minK,
        maxK: request.maxK,
        quantity,
        prefactorExponent,
        ...(regime ? { regime } : {}),
        ...(request.compensated !== undefined ? { compensated: request.compensated } : {}),
      },
      parameterSet: 'arrhenius',
    };
  },
};
