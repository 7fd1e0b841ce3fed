import { describe, expect, it } from 'vitest';
import { seededNormal, seededRandom } from '../numeric/prng';
import { fitArrhenius } from './arrhenius';
import { arrheniusValue, linearTcrResistivity } from './fitted-curves';
import { fitLinearTcr } from './tcr';

const K_EV = 8.617333262e-5; // CODATA 2018 Boltzmann constant in eV/K (exact in SI 2019)

describe('arrheniusValue', () => {
  it('returns exp(Ea / kT) for a zero intercept (the formula of the docs example)', () => {
    expect(arrheniusValue({ activationEnergyEv: 0.6, intercept: 0 }, {}, 500)).toBeCloseTo(
      Math.exp(0.6 / (K_EV * 500)),
      -2,
    );
  });

  it('passes through the data the fit was made from, for both quantities and a T^m prefactor', () => {
    const n = seededNormal(seededRandom(9));
    // Intrinsic-like silicon slope, Ea ≈ Eg/2 ≈ 0.6 eV (common practice, no source).
    const truth = (t: number) => 2e-3 * t ** 1.5 * Math.exp(0.6 / (K_EV * t));
    const temps = Array.from({ length: 12 }, (_, i) => 450 + 10 * i);
    const points = temps.map((t) => ({ temperatureK: t, value: truth(t) * (1 + 1e-3 * n()) }));
    for (const quantity of ['resistivity', 'conductivity'] as const) {
      const data = points.map((p) => ({
        temperatureK: p.temperatureK,
        value: quantity === 'resistivity' ? p.value : 1 / p.value,
      }));
      const fit = fitArrhenius(data, { quantity, prefactorExponent: -1.5 });
      for (const p of data) {
        const v = arrheniusValue(
          fit.parameters,
          { quantity, prefactorExponent: -1.5 },
          p.temperatureK,
        );
        expect(Math.abs(Math.log(v / p.value))).toBeLessThan(5e-3);
      }
    }
  });

  it('refuses a temperature at or below 0 K', () => {
    expect(() => arrheniusValue({ activationEnergyEv: 0.1, intercept: 1 }, {}, 0)).toThrow(
      /arrheniusValue.*temperatureK/,
    );
  });
});

describe('linearTcrResistivity', () => {
  it('gives the copper line of the introductory tables (1.68e-8 ohm m, 0.0039 /K at 20 °C)', () => {
    // Serway-style table values: rho(120 °C) = 1.68e-6 (1 + 0.0039 * 100) ohm cm.
    const rho = linearTcrResistivity(
      { referenceResistivityOhmCm: 1.68e-6, alphaPerK: 0.0039 },
      293.15,
      393.15,
    );
    expect(rho / 2.3352e-6).toBeCloseTo(1, 6);
  });

  it('reproduces the line fitLinearTcr fitted', () => {
    const pts = [250, 275, 300, 325, 350].map((t) => ({
      temperatureK: t,
      resistivityOhmCm: 5e-6 * (1 + 0.0045 * (t - 293.15)),
    }));
    const fit = fitLinearTcr(pts, 300);
    for (const p of pts) {
      expect(
        linearTcrResistivity(fit.parameters, 300, p.temperatureK) / p.resistivityOhmCm,
      ).toBeCloseTo(1, 9);
    }
  });
});
