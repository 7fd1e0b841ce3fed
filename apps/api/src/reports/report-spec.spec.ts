import type { SpecCheckDto } from '@rhotrace/api-types';
import { describe, expect, it } from 'vitest';
import { storedLine, sweepFacts } from './report-pdf';
import { specLines } from './report-spec';

const spec: SpecCheckDto = {
  resistivityAt23COhmCm: 14.95,
  inSpec: false,
  verdict: 'indeterminate',
  specMinOhmCm: 8,
  specMaxOhmCm: 15,
  method: 'corrected',
  distanceK: 4.9,
  reason: 'The value lies within its expanded uncertainty (k = 2) of a spec limit',
  uncertaintyOhmCm: 0.12,
  coverageFactor: 2,
  uncertaintyBudget: [
    {
      source: 'temperature-sensor',
      standardUncertaintyOhmCm: 0.06,
      relative: 0.06 / 14.95,
      distribution: 'rectangular',
      note: '±0.42 K',
    },
  ],
};

describe('the printed 23 °C lines', () => {
  it('print the value ± U with k, the method, the verdict and each budget line', () => {
    const [value, ...budget] = specLines(spec);
    expect(value).toBe(
      'Spec 8 to 15 Ω·cm; at 23 °C 14.95 ± 0.12 (k = 2) Ω·cm, corrected from a step ' +
        '4.90 K away; too close to call (a spec limit lies within value ± U: the measurement ' +
        'cannot decide)',
    );
    expect(budget).toEqual(['   temperature sensor: 0.060 Ω·cm (0.40 %, rectangular) – ±0.42 K']);
  });

  it("write a thin film's small values as powers of ten and say what was not assessed", () => {
    const [value, ...budget] = specLines({
      ...spec,
      resistivityAt23COhmCm: 1.079e-5,
      specMinOhmCm: 0.000005,
      specMaxOhmCm: 0.000012,
      verdict: 'pass',
      method: 'interpolated',
      uncertaintyOhmCm: 1.5e-7,
      uncertaintyBudget: [
        {
          source: 'thickness',
          standardUncertaintyOhmCm: 0,
          relative: 0,
          distribution: 'rectangular',
          note: 'Not assessed: the lot states no thickness tolerance',
        },
      ],
    });
    expect(value).toMatch(
      /^Spec 5 × 10\^-6 to 1\.2 × 10\^-5 Ω·cm; at 23 °C 1\.079 × 10\^-5 ± 1\.5 × 10\^-7 \(k = 2\)/,
    );
    expect(value).not.toMatch(/\de-\d|0\.0000/);
    expect(budget).toEqual(['   thickness: not assessed: the lot states no thickness tolerance']);
  });

  it('print why there is no value', () => {
    expect(
      specLines({ ...spec, resistivityAt23COhmCm: null, reason: 'The sweep does not reach 23 °C' }),
    ).toEqual(['Spec 8 to 15 Ω·cm; no value at 23 °C: The sweep does not reach 23 °C']);
  });
});

describe('the printed sweep heading and facts', () => {
  it('name the method, the thermometer and the geometry in words, never their stored keys', () => {
    const heading = storedLine({
      sweepId: 7,
      sweepName: 'ramp.csv',
      measuredAt: '2026-12-01T10:00:00.000Z',
      method: 'van-der-pauw',
    });
    expect(heading).toBe('Sweep 7 (ramp.csv), stored 2026-12-01 10:00 UTC, Van der Pauw square');
    const facts = sweepFacts({
      material: 'Si',
      dopant: 'B',
      station: { name: 'Bench A', probeSpacingCm: 0.1588, thermometer: 'table' },
      geometry: { thicknessCm: 0.0525, spacingCm: 0.1588 },
    }).join('\n');
    expect(facts).toContain('Station Bench A (probe spacing 1.588 mm, sensor read through its');
    expect(facts).toContain('Geometry: thickness 525 µm, probe spacing 1.588 mm');
    expect(facts).not.toMatch(/van-der-pauw|Cm\b|\btable\b thermometer/);
  });
});
