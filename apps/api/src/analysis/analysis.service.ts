import type {
  ArrheniusPoint,
  AnalysisStep,
  CompareResponse,
  DopantDensityResponse,
  SessionUser,
  SweepAnalysisResponse,
  SweepParseReport,
} from '@rhotrace/api-types';
import { siliconDopantFromResistivity, type F723Dopant } from '@rhotrace/physics';
import { visibleSweep, visibleWafer } from '../access/visibility.service';
import { notFound, unprocessable } from '../errors';
import { hallAnalysis, hallAt300K, hallFactorOf } from './hall-analysis';
import { temperatureGrid, isMetal } from './model.service';
import { interpolateWithin, specCheck, specVerdict } from './spec-check';
import { assessSweep, waferAssessment } from './spec.service';
import { suggestWindows } from './suggested-windows';
import { chooseLeg, describeLegs, flaggedReadings, legThermalLag } from './legs';
import { averageSteps, legReadings, sweepReadings, sweepSteps } from './sweep-data.service';
import { sweepSummary } from './sweep-summary';

/** Arrhenius coordinates of averaged steps (display transforms only). */
export function arrheniusCoordinates(steps: readonly AnalysisStep[]): ArrheniusPoint[] {
  return steps.map((s) => ({
    inverseTemperaturePerKK: 1000 / s.temperatureK,
    lnResistivity: Math.log(s.resistivityOhmCm),
    lnConductivity: -Math.log(s.resistivityOhmCm),
  }));
}

/** `GET /api/sweeps/:id/analysis`. */
export async function sweepAnalysis(
  user: SessionUser,
  sweepId: number,
  requestedLeg?: number | 'all',
  site: string | null = null,
): Promise<SweepAnalysisResponse> {
  const v = await visibleSweep(user, sweepId);
  const { points: all, skipped } = await sweepReadings(v.sweep, undefined, site);
  // a map's readings are its site means per step: one leg, so `leg` is null there
  const readings = await legReadings(v.sweep);
  const legs = describeLegs(readings);
  const leg = chooseLeg(legs, requestedLeg);
  // one leg's points keep their quantities (a Hall sweep's n and mu_H)
  const points =
    leg === null
      ? all
      : readings
          .filter((r) => r.leg === leg)
          .map(({ sequence: _s, leg: _l, excludable: _e, ...point }) => point);
  // All of a sweep's readings: the steps averaged once while the sweep is cached.
  const steps =
    leg === null && site === null ? [...(await sweepSteps(v.sweep))] : averageSteps(points);
  const assessed = await assessSweep(v.sweep, v.wafer, v.lot, steps);
  const factor = hallFactorOf(v.sweep.parseReport);
  const report = v.sweep.parseReport as SweepParseReport;
  const hall = factor === null ? null : hallAnalysis(points, factor);
  return {
    sweep: sweepSummary(v, skipped),
    steps,
    arrhenius: arrheniusCoordinates(steps),
    suggestedWindows: isMetal(v.lot.material)
      ? []
      : suggestWindows(steps, points, {
          material: v.lot.material,
          dopant: v.lot.dopant,
          dopantType: v.lot.dopantType,
        }),
    spec: specCheck(assessed.value, assessed.uncertainty, v.lot.specMinOhmCm, v.lot.specMaxOhmCm),
    legs,
    leg,
    thermalLag: legThermalLag(readings, legs),
    findings: report.findings ?? [],
    flaggedPoints: report.flaggedPoints ?? 0,
    ...(hall ? { hall } : {}),
    importWarnings: report.warnings ?? [],
    flaggedReadings: flaggedReadings(readings, report.findings ?? [], leg),
  };
}

/** Maps a lot's dopant name to the ASTM F723 dopant, or null when F723 does not cover it. */
export function f723Dopant(dopant: string | null): F723Dopant | null {
  const d = (dopant ?? '').trim().toLowerCase();
  if (d === 'b' || d === 'boron') return 'boron';
  if (d === 'p' || d === 'phosphorus') return 'phosphorus';
  return null;
}

/** `GET /api/wafers/:id/dopant`. */
export async function waferDopant(
  user: SessionUser,
  waferId: number,
): Promise<DopantDensityResponse> {
  const { wafer, lot } = await visibleWafer(user, waferId);
  const found = await waferAssessment(wafer, lot);
  if (found.sweepCount === 0) throw notFound(`A sweep of wafer ${wafer.number}`);
  const rho = found.value.resistivityOhmCm;
  if (found.sweepId === null || rho === null || found.value.method === null) {
    throw unprocessable(
      `No sweep of wafer ${wafer.number} gives a resistivity at 23 °C: ${found.value.reason}`,
    );
  }
  const where =
    found.value.method === 'interpolated'
      ? `interpolated at 23 °C (nearest step ${found.value.distanceK!.toFixed(2)} K away)`
      : `corrected to 23 °C from a step ${found.value.distanceK!.toFixed(2)} K away`;
  const verdict = specVerdict(
    rho,
    found.uncertainty.uncertaintyOhmCm,
    lot.specMinOhmCm,
    lot.specMaxOhmCm,
  );
  const base = {
    waferId: wafer.id,
    resistivityAt23COhmCm: rho,
    dopant: lot.dopant,
    sweepId: found.sweepId,
    method: found.value.method,
    distanceK: found.value.distanceK!,
    inSpec: verdict.verdict === null ? null : verdict.verdict === 'pass',
    verdict: verdict.verdict,
    specMinOhmCm: lot.specMinOhmCm,
    specMaxOhmCm: lot.specMaxOhmCm,
    ...found.uncertainty,
  };
  if (lot.material !== 'Si') {
    return {
      ...base,
      dopantDensityCm3: null,
      source: `Sweep ${found.sweepId}, ${where}`,
      reason: `ASTM F723 covers boron- and phosphorus-doped silicon only; this lot is ${lot.material}`,
    };
  }
  const dopant = f723Dopant(lot.dopant);
  if (!dopant) {
    throw unprocessable(
      `ASTM F723 covers boron- and phosphorus-doped silicon only; lot ${lot.code} has dopant ` +
        `${lot.dopant ?? '(not set)'}`,
    );
  }
  let density: number;
  try {
    density = siliconDopantFromResistivity(dopant, rho);
  } catch (error) {
    if (error instanceof RangeError) {
      throw unprocessable(
        `The resistivity at 23 °C is outside ASTM F723's range: ${error.message}`,
      );
    }
    throw error;
  }
  return {
    ...base,
    dopantDensityCm3: density,
    source: `ASTM F723 (${dopant}) from sweep ${found.sweepId}, ${where}`,
    reason: verdict.reason,
  };
}

/** Largest number of sweeps `GET /api/compare` takes. */
export const MAX_COMPARE_SWEEPS = 20;

/** `GET /api/compare?sweeps=...`: every sweep on one temperature grid. */
export async function compareSweeps(
  user: SessionUser,
  sweepIds: readonly number[],
  gridPoints: number,
): Promise<CompareResponse> {
  const loaded = [];
  for (const id of sweepIds) {
    const v = await visibleSweep(user, id);
    const steps = averageSteps((await sweepReadings(v.sweep)).points);
    if (steps.length === 0) throw unprocessable(`Sweep ${id} has no usable points`);
    loaded.push({ v, steps, hall: await hallAt300K(v.sweep) });
  }
  const minK = Math.min(...loaded.map((l) => l.steps[0]!.temperatureK));
  const maxK = Math.max(...loaded.map((l) => l.steps[l.steps.length - 1]!.temperatureK));
  const grid = minK === maxK ? [minK] : temperatureGrid(minK, maxK, gridPoints);
  return {
    temperaturesK: grid,
    curves: loaded.map(({ v, steps, hall }) => ({
      sweepId: v.sweep.id,
      waferId: v.wafer.id,
      waferNumber: v.wafer.number,
      lotId: v.lot.id,
      lotCode: v.lot.code,
      material: v.lot.material,
      minTemperatureK: steps[0]!.temperatureK,
      maxTemperatureK: steps[steps.length - 1]!.temperatureK,
      resistivityOhmCm: grid.map((t) => interpolateWithin(steps, t)),
      ...(hall ? { hall } : {}),
    })),
  };
}
