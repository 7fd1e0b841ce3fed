import { describe, expect, it } from 'vitest';
import { listMaterials } from '../materials';
import {
  METAL_BLOCH_GRUNEISEN,
  METALS,
  metalBlochGruneisen,
  metalResistivity,
  type MetalId,
} from './metals';

describe('METALS and metalResistivity', () => {
  it('holds the cited table values in ohm cm', () => {
    // Introductory physics tables: Cu 1.68e-8 ohm m, Pt 1.06e-7 ohm m; Kittel: Theta(Cu) 343 K.
    expect(METALS.Cu.resistivity20COhmCm).toBeCloseTo(1.68e-6, 15);
    expect(METALS.Pt.resistivity20COhmCm).toBeCloseTo(1.06e-5, 15);
    expect(METALS.Cu.debyeK).toBe(343);
    expect(metalResistivity('Cu', 293.15)).toBeCloseTo(1.68e-6, 15);
  });
  it('rises with temperature for every metal (common practice, no source)', () => {
    for (const id of Object.keys(METALS) as Array<keyof typeof METALS>) {
      expect(metalResistivity(id, 400)).toBeGreaterThan(metalResistivity(id, 300));
    }
  });
});

describe('metal Bloch–Grüneisen constants (issue 13, defect 9)', () => {
  it('follows Matula 1979 for copper from 77 K to 300 K', () => {
    // Matula 1979, J. Phys. Chem. Ref. Data 8, 1147 (from memory): 1.543 µΩ cm at 273.15 K,
    // 1.725 at 300 K, about 0.21 at 77 K. Tolerances: 1 % at 273.15 K and 300 K (the 20 °C
    // table value 1.68 against Matula's 1.676 is itself 0.3 % apart), 15 % at 77 K (memory
    // "about"; the model gives 0.193).
    expect(Math.abs(metalBlochGruneisen('Cu', 273.15) / 1.543e-6 - 1)).toBeLessThan(0.01);
    expect(Math.abs(metalBlochGruneisen('Cu', 300) / 1.725e-6 - 1)).toBeLessThan(0.01);
    expect(Math.abs(metalBlochGruneisen('Cu', 77) / 0.21e-6 - 1)).toBeLessThan(0.15);
    expect(metalBlochGruneisen('Cu', 300)).toBeCloseTo(1.725e-6, 9); // the JSDoc example
    // The linear reference is 19 % off at 100 K (issue 13) and so refused there.
    expect(() => metalResistivity('Cu', 100)).toThrow(/temperatureK/);
  });

  it('reproduces each cited rho(20 °C), and alpha where a residual of 0 or more allows', () => {
    // Introductory physics tables (rho, alpha at 20 °C); Kittel (Theta). Tolerance 1e-9.
    for (const id of Object.keys(METALS) as MetalId[]) {
      const m = METALS[id];
      const c = METAL_BLOCH_GRUNEISEN[id];
      expect(metalBlochGruneisen(id, 293.15) / m.resistivity20COhmCm).toBeCloseTo(1, 9);
      const slope = (metalBlochGruneisen(id, 293.16) - metalBlochGruneisen(id, 293.14)) / 0.02;
      expect(slope / m.resistivity20COhmCm / c.alphaAt20CPerK).toBeCloseTo(1, 5);
      expect(c.residualOhmCm).toBeGreaterThanOrEqual(0);
      expect(c.debyeK).toBe(m.debyeK);
      if (c.matchesAlpha) expect(c.alphaAt20CPerK).toBe(m.alphaPerK);
      else expect(c.alphaAt20CPerK).toBeLessThan(m.alphaPerK);
    }
    // Transition metals rise faster than Bloch–Grüneisen allows (Mott s–d scattering).
    expect(['W', 'Pt', 'Ni'].every((id) => !METAL_BLOCH_GRUNEISEN[id as MetalId].matchesAlpha));
  });

  it('is linear well above Theta and tiny at 20 K', () => {
    // Bloch–Grüneisen limits (Ziman 1960): rho - rho_0 ≈ (A T / (4 Theta)) (1 - x^2 / 18),
    // x = Theta / T, for T >> Theta (Au at 3 Theta, tolerance 0.1 %); T^5 far below Theta.
    const au = METAL_BLOCH_GRUNEISEN.Au;
    const hot = metalBlochGruneisen('Au', 495) - au.residualOhmCm;
    const x = au.debyeK / 495;
    const expected = ((au.couplingOhmCm * 495) / (4 * au.debyeK)) * (1 - (x * x) / 18);
    expect(Math.abs(hot / expected - 1)).toBeLessThan(1e-3);
    expect(metalBlochGruneisen('Cu', 20)).toBeLessThan(0.01 * metalBlochGruneisen('Cu', 293.15));
    expect(() => metalBlochGruneisen('Cu', 10)).toThrow(/`metalBlochGruneisen`.*temperatureK/);
  });
});

describe('listMaterials', () => {
  it('lists every material with dopants, parameter sets, defaults and citations', () => {
    const c = listMaterials();
    expect(c.semiconductors.map((s) => s.id)).toEqual(['Si', 'Ge', 'GaAs', '4H-SiC']);
    const si = c.semiconductors[0]!;
    expect(si.donors.find((d) => d.name === 'P')).toEqual({
      name: 'P',
      levelEv: 0.045,
      isDefault: true,
    });
    expect(si.densityOfStatesSets.filter((s) => s.isDefault).map((s) => s.id)).toEqual([
      'si-scaled-t15',
    ]);
    expect(si.mobilityModels.filter((m) => m.isDefault).map((m) => m.id)).toEqual(['arora-1982']);
    expect(c.metals.length).toBe(6);
    expect(JSON.parse(JSON.stringify(c))).toEqual(c);
  });
});

describe('metalResistivity invalid inputs', () => {
  it('rejects unknown metals and temperatures out of range', () => {
    expect(() => metalResistivity('Fe' as 'Cu', 300)).toThrow(/`metalResistivity`.*metal/);
    expect(() => metalResistivity('Cu', 50)).toThrow(/temperatureK/);
  });
});
