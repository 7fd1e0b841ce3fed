import { BOLTZMANN_EV_PER_K, fitArrhenius, modelCurve } from '@rhotrace/physics';
import { describe, expect, it } from 'vitest';
import { inferCompensation, interpretArrhenius } from './arrhenius-interpretation';

const k = BOLTZMANN_EV_PER_K;
const activated = (ea: number) =>
  fitArrhenius(
    [700, 750, 800, 850, 900].map((t, i) => ({
      temperatureK: t,
      value: Math.exp(ea / (k * t)) * (1 + 0.01 * Math.sin(i)),
    })),
  );

describe('interpretArrhenius', () => {
  it('reads the intrinsic slope as Eg(0 K) = 2 Ea with twice its standard error', () => {
    // Morin & Maita 1954 (Phys. Rev. 96, 28): Ea ≈ Eg/2 with Eg extrapolated linearly to 0 K.
    const fit = activated(0.6);
    const i = interpretArrhenius(fit, {
      regime: 'intrinsic',
      prefactorExponent: 1.5,
      compensation: null,
      meanTemperatureK: 800,
    });
    expect(i.property).toBe('band-gap-0K');
    expect(i.valueEv).toBeCloseTo(2 * fit.parameters.activationEnergyEv, 12);
    expect(i.standardErrorEv).toBeCloseTo(2 * fit.standardErrors.activationEnergyEv!, 12);
    expect(i.compensationSource).toBe('not-applicable');
    expect(i.prefactorExponent).toBe(1.5);
    expect(i.note).toMatch(/T\^1\.5/);
  });

  it('assumes Ed/2 and says so when the compensation is unknown', () => {
    const fit = activated(0.02);
    const i = interpretArrhenius(fit, {
      regime: 'freeze-out',
      prefactorExponent: 0,
      compensation: { compensation: 'unknown', source: 'inferred', why: 'no change of slope' },
      meanTemperatureK: 800,
    });
    expect(i.valueEv).toBeCloseTo(2 * fit.parameters.activationEnergyEv, 12);
    expect(i.note).toMatch(/Ed\/2 is assumed/);
  });
});

describe('inferCompensation', () => {
  it('sees no change of slope on an uncompensated model curve and falls back on the table', () => {
    // Si:P 1e16 uncompensated: Ea ≈ Ed/2 throughout freeze-out (Sze 1981, from memory).
    const all = modelCurve(
      'Si',
      { donorDensity: 1e16, acceptorDensity: 0 },
      Array.from({ length: 186 }, (_, i) => 15 + i),
    ).map((p) => ({ temperatureK: p.temperatureK, resistivityOhmCm: p.resistivityOhmCm }));
    const ea = 0.0235;
    const options = { stepToleranceK: 0.5, prefactorExponent: 0 };
    expect(inferCompensation(ea, all, { ...options, tableLevelEv: null }).compensation).toBe(
      'unknown',
    );
    const r = inferCompensation(ea, all, { ...options, tableLevelEv: 0.045 });
    expect(r.compensation).toBe('uncompensated');
    expect(r.why).toMatch(/E0\/2 of the tabulated level/);
  });
});
