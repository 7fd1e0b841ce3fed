import type { CompareResponse } from '@rhotrace/api-types';
import { overlayFigure, valueAt23C } from './overlay-figure';

const answer: CompareResponse = {
  temperaturesK: [290, 300, 310, 1000],
  curves: [
    {
      sweepId: 1,
      waferId: 1,
      waferNumber: 'W01',
      lotId: 7,
      lotCode: 'L-7',
      material: 'Si',
      minTemperatureK: 290,
      maxTemperatureK: 1000,
      resistivityOhmCm: [9, 10, 11, 40],
    },
    {
      sweepId: 2,
      waferId: 2,
      waferNumber: 'W02',
      lotId: 7,
      lotCode: 'L-7',
      material: 'Si',
      minTemperatureK: 300,
      maxTemperatureK: 1000,
      resistivityOhmCm: [null, 20, 22, 80],
    },
  ],
};

const base = {
  unit: 'K',
  view: 'temperature',
  logY: true,
  normalise: false,
  specLot: null,
} as const;

describe('the overlay figure', () => {
  it('reads a value at 23 °C by linear interpolation on the grid, or none outside it', () => {
    // Hand computation: 9 + (10 - 9) * (296.15 - 290) / (300 - 290) = 9.615.
    expect(valueAt23C(answer.temperaturesK, answer.curves[0]!.resistivityOhmCm)).toBeCloseTo(
      9.615,
      12,
    );
    expect(valueAt23C(answer.temperaturesK, answer.curves[1]!.resistivityOhmCm)).toBeNull();
  });

  it('divides each curve by its 23 °C value and says which sweeps could not be', () => {
    const f = overlayFigure(answer, { ...base, normalise: true });
    const [only] = f.data as Array<{ y: number[]; name: string }>;
    expect(f.data).toHaveLength(1);
    expect(only!.y[1]).toBeCloseTo(10 / 9.615, 12);
    expect(f.leftOut).toEqual(['L-7 W02 (sweep 2): does not reach 23 °C']);
    expect((f.layout.yaxis as { title: { text: string } }).title.text).toBe('ρ / ρ(23 °C)');
  });

  it('draws an Arrhenius view against 1000/T and a linear axis on request', () => {
    const f = overlayFigure(answer, { ...base, view: 'arrhenius', logY: false });
    expect((f.data[0] as { x: number[] }).x).toEqual([1000 / 290, 1000 / 300, 1000 / 310, 1]);
    expect(f.layout.yaxis.type).toBe('linear');
    expect(f.layout.xaxis.title.text).toBe('1000 / T (1/K)');
  });

  it('shades the lot’s spec band in Ω·cm, never on a normalised axis', () => {
    const specLot = { code: 'L-7', specMinOhmCm: 8, specMaxOhmCm: 12 };
    const f = overlayFigure(answer, { ...base, specLot });
    const [band] = (f.layout as { shapes: Array<{ y0: number; y1: number }> }).shapes;
    expect([band!.y0, band!.y1]).toEqual([8, 12]);
    expect('shapes' in overlayFigure(answer, { ...base, specLot, normalise: true }).layout).toBe(
      false,
    );
  });
});
