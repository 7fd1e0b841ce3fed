import type { DopantDensityResponse, SemiconductorMaterialDto } from '@rhotrace/api-types';
import { COMPENSATION_FRACTION, FALLBACK_DENSITY_CM3, startingDoping } from './initial-doping';

const silicon = {
  id: 'Si',
  donors: [
    { name: 'P', levelEv: 0.045, isDefault: true },
    { name: 'As', levelEv: 0.054, isDefault: false },
  ],
  acceptors: [
    { name: 'B', levelEv: 0.045, isDefault: true },
    { name: 'In', levelEv: 0.16, isDefault: false },
  ],
} as unknown as SemiconductorMaterialDto;

const measured = (density: number | null) =>
  ({
    dopantDensityCm3: density,
    source: 'ASTM F723 (phosphorus) from sweep 3',
  }) as DopantDensityResponse;

describe('startingDoping', () => {
  it('n-type: donors from the measured density, acceptors a 1 % compensation, said in words', () => {
    const s = startingDoping({ dopant: 'As', dopantType: 'n' }, silicon, measured(1.554e15));
    expect(s.doping).toEqual({
      donorDensity: 1.554e15,
      acceptorDensity: 1.554e15 * COMPENSATION_FRACTION,
      donor: 'As',
      donorLevel: 0.054,
      acceptor: 'B',
      acceptorLevel: 0.045,
    });
    expect(s.doping.acceptorDensity).not.toBe(s.doping.donorDensity);
    expect(s.basis).toBe('measured');
    expect(s.note).toContain('Donors (As) 1.55e15 cm⁻³');
    expect(s.note).toContain('acceptors (B) 1 % of that');
    expect(s.note).toContain('ASTM F723');
  });

  it('p-type: the reverse, with the lot’s acceptor', () => {
    const s = startingDoping({ dopant: 'In', dopantType: 'p' }, silicon, measured(2e16));
    expect(s.majority).toBe('acceptor');
    expect(s.doping.acceptorDensity).toBe(2e16);
    expect(s.doping.donorDensity).toBe(2e16 * COMPENSATION_FRACTION);
    expect(s.doping.acceptor).toBe('In');
    expect(s.doping.acceptorLevel).toBe(0.16);
    expect(s.doping.donor).toBe('P');
  });

  it('without a measured density: the fallback, or the density scaled to the 23 °C value', () => {
    const fallback = startingDoping({ dopant: 'Ga', dopantType: 'p' }, silicon, measured(null));
    expect(fallback.basis).toBe('fallback');
    expect(fallback.doping.acceptorDensity).toBe(FALLBACK_DENSITY_CM3);
    expect(fallback.doping.acceptor).toBe('B'); // Ga unknown to this catalogue: the default
    expect(fallback.note).toContain('default guess');
    const scaled = startingDoping({ dopant: 'B', dopantType: 'p' }, silicon, null, {
      densityCm3: 3e15,
      basis: 'scaled',
    });
    expect(scaled.basis).toBe('scaled');
    expect(scaled.doping.acceptorDensity).toBe(3e15);
    expect(scaled.note).toContain('scaled so the model meets');
  });
});
