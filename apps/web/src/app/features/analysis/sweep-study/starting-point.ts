import { type Signal, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import type { DopingInput, SweepAnalysisResponse } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS } from '@rhotrace/physics';
import { catchError, map, of } from 'rxjs';
import { LotsApi } from '../../lots/lots-api';
import { WafersApi } from '../../wafers/wafers-api';
import { AnalysisApi } from '../analysis-api';
import { scaleToMeasured, startingDoping } from './initial-doping';

/**
 * Where the model of a semiconductor sweep starts, and why: the lot's and wafer's stated doping,
 * else a guess scaled to the measured 23 °C resistivity (`startingDoping`, `scaleToMeasured`).
 * Undefined for a metal film. Call in an injection context (the study's store).
 */
export function startingPointResource(
  analysis: Signal<SweepAnalysisResponse | undefined>,
  isMetal: Signal<boolean>,
) {
  const api = inject(AnalysisApi);
  const lots = inject(LotsApi);
  const wafers = inject(WafersApi);
  const materials = rxResource({
    stream: () => api.materials().pipe(catchError(() => of(null))),
  });
  const lot = rxResource({
    params: () => analysis()?.sweep.lotId,
    stream: ({ params }) => lots.get(params),
  });
  const dopant = rxResource({
    params: () => analysis()?.sweep.waferId,
    stream: ({ params }) => wafers.dopant(params).pipe(catchError(() => of(null))),
  });
  return rxResource({
    params: () => {
      const a = analysis();
      const waiting = lot.isLoading() || dopant.isLoading() || materials.isLoading();
      if (!a || isMetal() || waiting) return undefined;
      const material = materials.value()?.semiconductors.find((m) => m.id === a.sweep.material);
      return { a, lot: lot.value(), material, dopant: dopant.value() };
    },
    stream: ({ params: { a, lot, material, dopant } }) => {
      const base = startingDoping(lot, material, dopant);
      const rho23 = a.spec.resistivityAt23COhmCm ?? dopant?.resistivityAt23COhmCm ?? null;
      if (base.basis !== 'fallback' || rho23 === null || rho23 <= 0 || !material) return of(base);
      const atK = PHYSICS_DEFAULTS.astmF723TemperatureK;
      const modelAt23 = (doping: DopingInput) =>
        api
          .modelCurve({ material: a.sweep.material, doping, fromK: atK, toK: atK + 0.5, steps: 2 })
          .pipe(map((c) => c.points[0]?.resistivityOhmCm ?? null));
      return scaleToMeasured(base, rho23, modelAt23, (d) =>
        startingDoping(lot, material, dopant, d),
      );
    },
  });
}
