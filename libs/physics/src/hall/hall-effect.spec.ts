import { describe, expect, it } from 'vitest';
import { ELEMENTARY_CHARGE_C } from '../constants';
import {
  HALL_SCATTERING_FACTORS,
  hallCoefficient,
  hallMobility,
  hallVoltageFromReversals,
  twoCarrierHallCoefficient,
} from './hall-effect';

// Worked from the definitions R_H = V_H t / (I B), n = r_H / (q |R_H|), mu_H = |R_H| / rho
// (van der Pauw 1958, Philips Res. Rep. 13, 1; ASTM F76): V_H = -1.000 mV, I = 1 mA, B = 0.5 T,
// t = 500 um gives R_H = -1e-3 V x 0.05 cm / (1e-3 A x 0.5e-4 V s cm^-2) = -1000 cm^3/C.
const worked = { hallVoltageV: -1e-3, currentA: 1e-3, magneticFieldT: 0.5, thicknessCm: 0.05 };

describe('hallCoefficient', () => {
  it('gives the worked example: R_H = -1000 cm^3/C, n = 6.24e15, n_s = 3.12e14, n-type', () => {
    const r = hallCoefficient(worked);
    expect(r.hallCoefficientCm3PerC).toBeCloseTo(-1000, 9);
    expect(r.sheetHallCoefficientCm2PerC).toBeCloseTo(-20000, 6);
    expect(r.carrierType).toBe('n');
    // 1 / (1.602176634e-19 x 1000) = 6.2415e15 (q exact, SI 2019).
    expect(r.densityCm3 / 6.2415e15).toBeCloseTo(1, 4);
    expect(r.sheetDensityCm2 / 3.1208e14).toBeCloseTo(1, 4);
  });

  it('reads holes from a positive Hall voltage and divides by nothing else', () => {
    const r = hallCoefficient({ ...worked, hallVoltageV: 1e-3 });
    expect(r.carrierType).toBe('p');
    expect(r.hallCoefficientCm3PerC).toBeCloseTo(1000, 9);
  });

  it('scales the density by the Hall factor r_H', () => {
    const r = hallCoefficient({ ...worked, hallFactor: HALL_SCATTERING_FACTORS.acousticPhonon });
    expect(r.densityCm3 / (1.1781 * 6.2415e15)).toBeCloseTo(1, 4);
    expect(r.hallCoefficientCm3PerC).toBeCloseTo(-1000, 9);
  });

  it('refuses a zero field, a missing current or thickness and a non-finite voltage', () => {
    expect(() => hallCoefficient({ ...worked, magneticFieldT: 0 })).toThrow(
      /hallCoefficient.*magneticFieldT above 0/,
    );
    expect(() => hallCoefficient({ ...worked, currentA: 0 })).toThrow(/currentA above 0/);
    expect(() => hallCoefficient({ ...worked, thicknessCm: Number.NaN })).toThrow(/thicknessCm/);
    expect(() => hallCoefficient({ ...worked, hallVoltageV: Infinity })).toThrow(/hallVoltageV/);
    expect(() => hallCoefficient({ ...worked, hallVoltageV: 0 })).toThrow(/other than 0/);
    expect(() => hallCoefficient({ ...worked, hallFactor: -1 })).toThrow(/hallFactor above 0/);
  });
});

describe('hallMobility', () => {
  it('gives 1000 cm^2/(V s) for R_H = -1000 cm^3/C at rho = 1 ohm cm (worked)', () => {
    expect(hallMobility(-1000, 1)).toBeCloseTo(1000, 9);
    expect(hallMobility(500, 0.25)).toBeCloseTo(2000, 9);
  });
  it('refuses a zero coefficient and a non-positive resistivity', () => {
    expect(() => hallMobility(0, 1)).toThrow(/hallMobility.*other than 0/);
    expect(() => hallMobility(-1000, 0)).toThrow(/resistivityOhmCm above 0/);
  });
});

describe('hallVoltageFromReversals', () => {
  it('removes an offset and a thermoelectric voltage (ASTM F76 reversal average)', () => {
    // Built in the test: V_H = -1 mV, misalignment 2 mV x I-sign, thermal +0.2 mV (no sign change).
    const vh = -1e-3;
    const reading = (b: number, i: number) => b * i * vh + 2e-3 * i + 0.2e-3;
    const v = { pp: reading(1, 1), pn: reading(1, -1), np: reading(-1, 1), nn: reading(-1, -1) };
    expect(hallVoltageFromReversals(v)).toBeCloseTo(vh, 15);
  });
  it('names the reading that is not finite', () => {
    expect(() => hallVoltageFromReversals({ pp: 1, pn: 1, np: Number.NaN, nn: 1 })).toThrow(
      /hallVoltageFromReversals.*v\.np/,
    );
  });
});

describe('twoCarrierHallCoefficient', () => {
  it('gives q n R_H = -0.5 for n = p and a mobility ratio of 3 (Look 1989, two-band formula)', () => {
    // (p mu_p^2 - n mu_n^2) / (q (p mu_p + n mu_n)^2) = (1 - 9) / (q n 16) = -0.5 / (q n).
    const n = 1e15;
    const rh = twoCarrierHallCoefficient({
      electronDensityCm3: n,
      holeDensityCm3: n,
      electronMobility: 1500,
      holeMobility: 500,
    });
    expect(ELEMENTARY_CHARGE_C * n * rh).toBeCloseTo(-0.5, 12);
  });
  it('reduces to 1 / (q p) with holes only', () => {
    const rh = twoCarrierHallCoefficient({
      electronDensityCm3: 0,
      holeDensityCm3: 1e16,
      electronMobility: 1,
      holeMobility: 400,
    });
    expect(rh * ELEMENTARY_CHARGE_C * 1e16).toBeCloseTo(1, 12);
  });
  it('refuses no carriers at all', () => {
    expect(() =>
      twoCarrierHallCoefficient({
        electronDensityCm3: 0,
        holeDensityCm3: 0,
        electronMobility: 1,
        holeMobility: 1,
      }),
    ).toThrow(/twoCarrierHallCoefficient/);
  });
});

describe('HALL_SCATTERING_FACTORS', () => {
  it('are 3 pi / 8 and 315 pi / 512 (Blakemore 1962; Look 1989)', () => {
    expect(HALL_SCATTERING_FACTORS.acousticPhonon).toBeCloseTo(1.1781, 4);
    expect(HALL_SCATTERING_FACTORS.ionizedImpurity).toBeCloseTo(1.9328, 4);
    expect(HALL_SCATTERING_FACTORS.degenerate).toBe(1);
  });
});
