import type { HallAnalysis } from '@rhotrace/api-types';
import { startingHallDoping } from '../hall-density-fit/hall-density-fit';
import { hallModels } from './hall-models';

const hall: HallAnalysis = {
  steps: [30, 100, 300, 400].map((t) => ({
    temperatureK: t,
    carrierDensityCm3: 1e15,
    carrierDensitySpreadCm3: 0,
    hallMobilityCm2PerVs: 1000,
    hallCoefficientCm3PerC: -6000,
    carrierType: 'n' as const,
    count: 1,
  })),
  carrierType: 'n',
  hallFactor: 1,
  carrierDensityAt300KCm3: 1e15,
  hallMobilityAt300KCm2PerVs: 1000,
  freezeOutWindow: null,
};

describe('hallModels', () => {
  const doping = {
    values: { donorDensity: 1e15, acceptorDensity: 1e14, donorLevel: 0.045 },
    label: 'entered',
  };

  it('saturates the neutrality curve at N_D - N_A and freezes it out when cold', () => {
    // Extrinsic range: n = N_D - N_A (common practice, no source).
    const m = hallModels('Si', hall, doping, null);
    const n = m.density!.densitiesCm3;
    const t = m.density!.temperaturesK;
    const at = (k: number) => n[t.findIndex((x) => x >= k)]!;
    expect(at(300) / 9e14).toBeCloseTo(1, 1);
    expect(at(30)).toBeLessThan(1e13);
    expect(m.modelMobility!.mobilities.every((v) => v > 0)).toBe(true);
  });

  it('draws the power law through mu_300 at 300 K within its window only', () => {
    const m = hallModels('Si', hall, null, {
      exponent: -2.5,
      mobilityAt300K: 1400,
      minK: 150,
      maxK: 400,
    });
    const law = m.powerLaw!;
    expect(Math.min(...law.temperaturesK)).toBeGreaterThanOrEqual(150);
    const i = law.temperaturesK.findIndex((x) => x >= 300);
    expect(law.mobilities[i]! / (1400 * (law.temperaturesK[i]! / 300) ** -2.5)).toBeCloseTo(1, 12);
    expect(m.density).toBeNull();
  });

  it('draws no model for a material the physics does not know', () => {
    expect(hallModels('Cu', hall, doping, null).density).toBeNull();
  });
});

describe('startingHallDoping', () => {
  it('starts near the 300 K density with the material’s own default levels', () => {
    // Sze 1981: P 45 meV in Si; As 12.7 meV in Ge (the tables' defaults).
    const si = startingHallDoping('Si', hall);
    expect(si.donorDensity).toBeCloseTo(1.1e15, -10);
    expect(si.acceptorDensity).toBeCloseTo(5.5e13, -8);
    expect(si.donorLevel).toBe(0.045);
    expect(startingHallDoping('Ge', hall).donorLevel).toBe(0.0127);
    const p = startingHallDoping('Si', { ...hall, carrierType: 'p' });
    expect(p.acceptorDensity).toBeGreaterThan(p.donorDensity);
  });
});
