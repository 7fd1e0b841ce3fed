import { describe, expect, it } from 'vitest';
import type { SweepMethod } from '@rhotrace/api-types';
import { HttpError } from '../../errors';
import { resolveGeometry, type GeometryInputs } from './resolve-geometry';

const inputs = (method: SweepMethod, over: Partial<GeometryInputs> = {}): GeometryInputs => ({
  method,
  request: {},
  wafer: { thicknessCm: null },
  lot: { thicknessCm: null, diameterCm: null },
  station: null,
  file: {},
  needsRtd: false,
  ...over,
});

function missing(call: () => unknown): string[] {
  try {
    call();
  } catch (error) {
    if (!(error instanceof HttpError)) throw error;
    expect(error.message).toBe('The sweep cannot be converted without more geometry');
    return (error.details as Array<{ field: string }>).map((d) => d.field);
  }
  throw new Error('expected a 400');
}

describe('resolve geometry', () => {
  it('names what each method still needs, in one answer', () => {
    expect(missing(() => resolveGeometry(inputs('four-point')))).toEqual([
      'thicknessCm',
      'spacingCm',
    ]);
    expect(missing(() => resolveGeometry(inputs('bar')))).toEqual([
      'thicknessCm',
      'barLengthCm',
      'barWidthCm',
    ]);
    expect(missing(() => resolveGeometry(inputs('van-der-pauw', { needsRtd: true })))).toEqual([
      'thicknessCm',
      'rtdR0Ohm',
    ]);
    expect(resolveGeometry(inputs('resistivity'))).toEqual({ sources: {} });
  });

  it('prefers the request, then the wafer, lot or station, then the file', () => {
    const geometry = resolveGeometry(
      inputs('four-point', {
        request: { spacingCm: 0.15 },
        wafer: { thicknessCm: null },
        lot: { thicknessCm: 0.0525, diameterCm: 10 },
        station: { probeSpacingCm: 0.1, rtdR0Ohm: null },
        file: { thicknessCm: 0.05, diameterCm: 15 },
      }),
    );
    expect(geometry).toEqual({
      thicknessCm: 0.0525,
      spacingCm: 0.15,
      diameterCm: 10,
      sources: { thicknessCm: 'lot', spacingCm: 'request', diameterCm: 'lot' },
    });
  });

  it('keeps a known thickness on a resistivity sweep and never asks for it', () => {
    expect(resolveGeometry(inputs('resistivity', { file: { thicknessCm: 0.05 } }))).toEqual({
      thicknessCm: 0.05,
      sources: { thicknessCm: 'file' },
    });
  });
});
