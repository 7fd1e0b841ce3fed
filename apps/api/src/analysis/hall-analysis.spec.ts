import type { HallAnalysisStep } from '@rhotrace/api-types';
import { describe, expect, it } from 'vitest';
import { hallUncertaintyAt, hallValueAt } from './hall-analysis';

function step(temperatureK: number, densityCm3: number, spreadCm3: number, count: number) {
  return {
    temperatureK,
    carrierDensityCm3: densityCm3,
    carrierDensitySpreadCm3: spreadCm3,
    hallMobilityCm2PerVs: 1000,
    hallMobilitySpreadCm2PerVs: 20,
    hallCoefficientCm3PerC: -6000,
    carrierType: 'n',
    count,
  } satisfies HallAnalysisStep;
}

describe('hallUncertaintyAt', () => {
  // Worked by hand with the law of propagation of uncertainty (JCGM 100:2008, GUM, eq. 10):
  // step means 1.0e15 and 1.2e15 cm^-3 with u = s / sqrt(4) = 1.0e13 and 2.4e13 (1 % and 2 %),
  // f = 0.5 at 300 K: n = sqrt(1.2) 1e15 = 1.0954e15, u_rel = sqrt(0.5^2 1e-4 + 0.5^2 4e-4)
  // = 0.011180, u = 1.2247e13 cm^-3.
  const steps = [step(290, 1.0e15, 2.0e13, 4), step(310, 1.2e15, 4.8e13, 4)];

  it('propagates the step means’ standard errors through the log-linear interpolation', () => {
    expect(hallValueAt(steps, 'carrierDensityCm3', 300)! / 1.0954451e15).toBeCloseTo(1, 6);
    expect(hallUncertaintyAt(steps, 'carrierDensityCm3', 300)! / 1.2247449e13).toBeCloseTo(1, 6);
    // At a step's own temperature only that step counts: 20 / sqrt(4) = 10 cm^2/(V s).
    const atStep = [step(290, 1.0e15, 2.0e13, 4), step(300, 1.1e15, 2.2e13, 4)];
    expect(hallUncertaintyAt(atStep, 'hallMobilityCm2PerVs', 300)).toBeCloseTo(10, 9);
  });

  it('gives none for a step of one reading or a temperature out of reach', () => {
    const single = [step(290, 1.0e15, 0, 1), step(310, 1.2e15, 4.8e13, 4)];
    expect(hallUncertaintyAt(single, 'carrierDensityCm3', 300)).toBeNull();
    expect(hallUncertaintyAt(steps, 'carrierDensityCm3', 340)).toBeNull();
  });
});
