import { describe, expect, it } from 'vitest';
import { PHYSICS_DEFAULTS } from '../defaults';
import { densityOfStates } from './density-of-states';

describe('densityOfStates', () => {
  it('uses the documented silicon default (si-scaled-t15: 2.69e19 and 2.915e19 at 300 K)', () => {
    expect(PHYSICS_DEFAULTS.densityOfStatesSet.Si).toBe('si-scaled-t15');
    const d = densityOfStates('Si', 300);
    expect(d.conduction).toBeCloseTo(2.69e19, -14);
    expect(d.valence).toBeCloseTo(2.915e19, -14);
  });

  it('reproduces the Sze 1981 300 K values', () => {
    // Sze, Physics of Semiconductor Devices, 2nd ed.: Si 2.8e19 / 1.04e19, Ge 1.04e19 / 6.0e18,
    // GaAs 4.7e17 / 7.0e18 cm^-3. Tolerance 1e-12 relative (tabulated constants).
    const si = densityOfStates('Si', 300, { densityOfStatesSet: 'sze-t15' });
    expect(si.conduction / 2.8e19).toBeCloseTo(1, 12);
    expect(si.valence / 1.04e19).toBeCloseTo(1, 12);
    expect(densityOfStates('Ge', 300).conduction / 1.04e19).toBeCloseTo(1, 12);
    expect(densityOfStates('GaAs', 300).valence / 7.0e18).toBeCloseTo(1, 12);
  });

  it('scales as T^1.5 for parabolic bands', () => {
    // Sze 1981: Nc, Nv proportional to T^(3/2). Tolerance 1e-12 relative.
    const ratio = densityOfStates('Ge', 600).conduction / densityOfStates('Ge', 300).conduction;
    expect(ratio).toBeCloseTo(Math.pow(2, 1.5), 12);
  });

  it('offers the Green 1990 silicon set with its own exponents', () => {
    // Green 1990, J. Appl. Phys. 67, 2944: Nc = 2.86e19 (T/300)^1.58, Nv = 3.10e19 (T/300)^1.85.
    const d = densityOfStates('Si', 450, { densityOfStatesSet: 'si-green-1990' });
    expect(d.conduction / (2.86e19 * Math.pow(1.5, 1.58))).toBeCloseTo(1, 12);
    expect(d.valence / (3.1e19 * Math.pow(1.5, 1.85))).toBeCloseTo(1, 12);
  });
});

describe('densityOfStates invalid inputs', () => {
  it('rejects out-of-range temperatures, unknown sets and sets for another material', () => {
    expect(() => densityOfStates('Si', 0.5)).toThrow(/`densityOfStates`.*temperatureK/);
    expect(() => densityOfStates('Ge', 300, { densityOfStatesSet: 'si-green-1990' })).toThrow(
      RangeError,
    );
    expect(() => densityOfStates('Si', 300, { densityOfStatesSet: 'nope' as 'sze-t15' })).toThrow(
      /densityOfStatesSet/,
    );
    expect(() => densityOfStates('Diamond' as 'Si', 300)).toThrow(RangeError);
  });
});
