import { describe, expect, it } from 'vitest';
import { listMaterials } from '../materials';
import { METALS, metalResistivity } from './metals';

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
