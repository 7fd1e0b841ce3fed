import { describe, expect, it } from 'vitest';
import { modelCurve } from '../semiconductor/resistivity';
import { fitArrhenius } from './arrhenius';
import { interpretArrheniusSlope } from './interpret';

const arrhenius = (donorDensity: number, acceptorDensity: number, temps: number[], m = 0) =>
  fitArrhenius(
    modelCurve('Si', { donorDensity, acceptorDensity }, temps).map((p) => ({
      temperatureK: p.temperatureK,
      value: p.resistivityOhmCm,
    })),
    { prefactorExponent: m },
  ).parameters.activationEnergyEv;
const range = (a: number, b: number): number[] =>
  Array.from({ length: b - a + 1 }, (_, i) => a + i);

describe('interpretArrheniusSlope', () => {
  it('reads the intrinsic slope as half the 0 K-extrapolated gap', () => {
    // Morin & Maita 1954, Phys. Rev. 96, 28: about 1.21 eV for Si. Tolerance 0.05 eV.
    const ea = arrhenius(1e14, 0, range(700, 1000));
    const r = interpretArrheniusSlope({
      activationEnergyEv: ea,
      regime: 'intrinsic',
      material: 'Si',
      temperatureK: 850,
    });
    expect(r.quantity).toBe('band gap');
    expect(r.factor).toBe(2);
    expect(Math.abs(r.impliedEv! - 1.21)).toBeLessThan(0.05);
    expect(r.text).toMatch(/Eg\/2/);
  });

  it('reads freeze-out as Ed/2 uncompensated and Ed compensated', () => {
    // Sze; Blakemore (from memory): slopes Ed/2 and Ed. Model sweeps 15–30 K, P in Si (45 meV),
    // T^1.5 prefactor to take out most of the mobility term. Tolerance 10 % of the level the
    // model uses at 1e16, lowered by Pearson & Bardeen 1949: 0.045 - 3e-8 (1e16)^(1/3) eV.
    const ed = 0.045 - 3e-8 * Math.cbrt(1e16);
    const un = interpretArrheniusSlope({
      activationEnergyEv: arrhenius(1e16, 0, range(15, 30), 1.5),
      regime: 'freeze-out',
    });
    expect(un.factor).toBe(2);
    expect(Math.abs(un.impliedEv! / ed - 1)).toBeLessThan(0.1);
    const comp = interpretArrheniusSlope({
      activationEnergyEv: arrhenius(1e16, 1e14, range(15, 30), 1.5),
      regime: 'freeze-out',
      compensated: true,
    });
    expect(comp.factor).toBe(1);
    expect(Math.abs(comp.impliedEv! / ed - 1)).toBeLessThan(0.1);
  });

  it('declines to read an activation energy in the extrinsic range', () => {
    const r = interpretArrheniusSlope({ activationEnergyEv: -0.02, regime: 'extrinsic' });
    expect(r.quantity).toBe('none');
    expect(r.impliedEv).toBeNull();
  });
});

describe('interpretArrheniusSlope invalid inputs', () => {
  it('rejects bad arguments', () => {
    expect(() =>
      interpretArrheniusSlope({ activationEnergyEv: Number.NaN, regime: 'intrinsic' }),
    ).toThrow(/`interpretArrheniusSlope`.*activationEnergyEv/);
    expect(() =>
      interpretArrheniusSlope({ activationEnergyEv: 0.5, regime: 'metallic' as 'intrinsic' }),
    ).toThrow(/regime/);
    expect(() =>
      interpretArrheniusSlope({
        activationEnergyEv: 0.5,
        regime: 'intrinsic',
        material: 'Xx' as 'Si',
      }),
    ).toThrow(/material/);
  });
});
