import type { AnalysisSweepDto, SweepGeometry } from '@rhotrace/api-types';
import type { VisibleSweep } from '../access/visibility.service';

/** The summary block the analysis answers carry. */
export function sweepSummary(v: VisibleSweep, skipped: number): AnalysisSweepDto {
  return {
    id: v.sweep.id,
    waferId: v.wafer.id,
    waferNumber: v.wafer.number,
    lotId: v.lot.id,
    lotCode: v.lot.code,
    material: v.lot.material,
    method: v.sweep.method,
    stationId: v.sweep.stationId,
    pointCount: v.sweep.pointCount,
    skippedPointCount: skipped,
    minTemperatureK: v.sweep.minTemperatureK,
    maxTemperatureK: v.sweep.maxTemperatureK,
    originalName: v.sweep.originalName,
    createdAt: v.sweep.createdAt.toISOString(),
    geometry: v.sweep.geometry as SweepGeometry,
  };
}
