import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BOLTZMANN_EV_PER_K } from '../constants';
import { intrinsicDensity } from './intrinsic';

const sproulGreen = (t: number): number => 9.15e19 * Math.pow(t / 300, 2) * Math.exp(-6880 / t);
const misiakos = (t: number): number => 5.29e19 * Math.pow(t / 300, 2.54) * Math.exp(-6726 / t);

describe('intrinsicDensity', () => {
  it('is 1.00e10 cm^-3 for silicon at 300 K (three significant figures)', () => {
    // Sproul & Green 1991, J. Appl. Phys. 70, 846: 1.00e10 at 300 K. Tolerance 0.5 %.
    expect(Math.abs(intrinsicDensity('Si', 300) / 1e10 - 1)).toBeLessThan(0.005);
  });

  it('stays within 5 % of Sproul & Green 1991 from 250 K to 500 K', () => {
    // Sproul & Green 1991: n_i = 9.15e19 (T/300)^2 exp(-6880/T). Tolerance 5 %.
    for (let t = 250; t <= 500; t += 5) {
      expect(Math.abs(intrinsicDensity('Si', t) / sproulGreen(t) - 1)).toBeLessThan(0.05);
    }
  });

  it('stays within 10 % of Misiakos & Tsamakis 1993 from 250 K to 500 K', () => {
    // Misiakos & Tsamakis 1993, J. Appl. Phys. 74, 3293: 5.29e19 (T/300)^2.54 exp(-6726/T).
    for (let t = 250; t <= 500; t += 5) {
      expect(Math.abs(intrinsicDensity('Si', t) / misiakos(t) - 1)).toBeLessThan(0.1);
    }
    // Their measured value at 300 K is 9.7e9. Tolerance 5 %.
    expect(Math.abs(intrinsicDensity('Si', 300) / 9.7e9 - 1)).toBeLessThan(0.05);
  });

  it('is within 3 % of Altermatt et al. 2003 at 300 K', () => {
    // Altermatt et al. 2003, J. Appl. Phys. 93, 1598: 9.65e9 cm^-3 (from memory). Tolerance 5 %.
    expect(Math.abs(intrinsicDensity('Si', 300) / 9.65e9 - 1)).toBeLessThan(0.05);
  });

  it('gives the quoted germanium and gallium arsenide values at 300 K', () => {
    // REFERENCES: Ge about 2.0e13 to 2.4e13, GaAs about 1.8e6 to 2.1e6 cm^-3 at 300 K.
    const ge = intrinsicDensity('Ge', 300);
    expect(ge).toBeGreaterThan(2.0e13);
    expect(ge).toBeLessThan(2.4e13);
    const gaas = intrinsicDensity('GaAs', 300);
    expect(gaas).toBeGreaterThan(1.8e6);
    expect(gaas).toBeLessThan(2.1e6);
  });

  it('shows an activation of about 1.21 eV for n_i^2 T^-3 (Morin & Maita)', () => {
    // Morin & Maita 1954, Phys. Rev. 96, 28: about 1.21 eV (linear extrapolation of the gap).
    // Slope of ln(n_i^2 / T^3) against 1/T between 400 K and 600 K. Tolerance 0.03 eV.
    const f = (t: number): number => Math.log(intrinsicDensity('Si', t) ** 2 / t ** 3);
    const slope = (f(600) - f(400)) / (1 / 600 - 1 / 400);
    expect(Math.abs(-slope * BOLTZMANN_EV_PER_K - 1.21)).toBeLessThan(0.03);
  });

  it('gives the Green 1990 set n_i close to 1.08e10 at 300 K', () => {
    // Green 1990 quotes n_i(300 K) = 1.08e10 with his Nc, Nv (from memory). Tolerance 3 %.
    const ni = intrinsicDensity('Si', 300, { densityOfStatesSet: 'si-green-1990' });
    expect(Math.abs(ni / 1.08e10 - 1)).toBeLessThan(0.03);
  });

  it('vanishes towards 0 K and never returns NaN (no carriers in an intrinsic solid at 0 K)', () => {
    // Common practice, no source: at 0 K the conduction band is empty.
    const ni = intrinsicDensity('Si', 1);
    expect(Number.isFinite(ni)).toBe(true);
    expect(ni).toBeGreaterThanOrEqual(0);
    expect(ni).toBeLessThan(1e-100);
  });

  it('rises monotonically with temperature', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('Si', 'Ge', 'GaAs', '4H-SiC' as const),
        fc.double({ min: 30, max: 1400, noNaN: true }),
        (m, t) => intrinsicDensity(m, t + 10) > intrinsicDensity(m, t),
      ),
    );
  });
});

describe('intrinsicDensity invalid inputs', () => {
  it('rejects bad temperatures and materials', () => {
    expect(() => intrinsicDensity('Si', -5)).toThrow(/`intrinsicDensity`.*temperatureK/);
    expect(() => intrinsicDensity('Si', Number.NaN)).toThrow(RangeError);
    expect(() => intrinsicDensity('si' as 'Si', 300)).toThrow(/material/);
    expect(() => intrinsicDensity('Si', null as unknown as number)).toThrow(TypeError);
  });
});
