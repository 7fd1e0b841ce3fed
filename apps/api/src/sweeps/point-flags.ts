/**
 * Marks suspicious points without refusing them: a resistivity jump between neighbours and a
 * temperature going against the ramp.
 */
import { JUMP_FACTOR } from '@rhotrace/api-types';
import type { ConvertedPoint } from './convert';

/** A step against the ramp direction larger than this is a reversal (thermometer noise is less). */
export const REVERSAL_TOLERANCE_K = 0.5;

function rows(points: ConvertedPoint[]): string {
  const shown = points
    .slice(0, 10)
    .map((p) => p.sourceRows[0])
    .join(', ');
  return points.length > 10 ? `${shown} and ${points.length - 10} more` : shown;
}

/**
 * Adds `jump` and `temperature-reversal` flags in place and returns one warning per kind.
 * The ramp direction is that from the first to the last point.
 */
export function flagSuspiciousPoints(points: ConvertedPoint[]): string[] {
  const warnings: string[] = [];
  if (points.length < 2) return warnings;
  const direction = Math.sign(points[points.length - 1]!.temperatureK - points[0]!.temperatureK);
  const jumps: ConvertedPoint[] = [];
  const reversals: ConvertedPoint[] = [];
  for (let i = 1; i < points.length; i++) {
    const prev = points[i - 1]!;
    const p = points[i]!;
    const ratio = p.resistivityOhmCm / prev.resistivityOhmCm;
    if (ratio > JUMP_FACTOR || ratio < 1 / JUMP_FACTOR) {
      p.flags.push('jump');
      jumps.push(p);
    }
    if (
      direction !== 0 &&
      (p.temperatureK - prev.temperatureK) * direction < -REVERSAL_TOLERANCE_K
    ) {
      p.flags.push('temperature-reversal');
      reversals.push(p);
    }
  }
  if (jumps.length) {
    warnings.push(
      `${jumps.length} point(s) differ from the previous one by more than ${JUMP_FACTOR} times in resistivity (rows ${rows(jumps)})`,
    );
  }
  if (reversals.length) {
    warnings.push(
      `the temperature goes against the ramp at ${reversals.length} point(s) (rows ${rows(reversals)})`,
    );
  }
  return warnings;
}
