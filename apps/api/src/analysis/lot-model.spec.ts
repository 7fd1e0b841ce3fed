import { describe, expect, it } from 'vitest';
import { metalResistivity, resistivity } from '@rhotrace/physics';
import { lotModel } from './lot-model';

describe('the lot model used for a single-step 23 °C correction', () => {
  it('finds the net doping that reproduces the anchor and gives the model at 23 °C', () => {
    // A Si:P wafer of 1e15 cm^-3 measured once at 305 K: the model anchored there must give back
    // the same model's value at 296.15 K (the density is found by bisection to 1e-9 relative).
    const doping = { donorDensity: 1e15, acceptorDensity: 0, donor: 'P' as const };
    const anchor = resistivity('Si', doping, 305);
    const model = lotModel({ material: 'Si', dopant: 'P', dopantType: 'n' }, 305, anchor)!;
    expect(model(305)! / anchor).toBeCloseTo(1, 6);
    expect(model(296.15)! / resistivity('Si', doping, 296.15)).toBeCloseTo(1, 4);
  });

  it('uses the metal reference for a metal film lot', () => {
    const model = lotModel({ material: 'Cu', dopant: null, dopantType: null }, 300, 2e-6)!;
    expect(model(296.15)).toBe(metalResistivity('Cu', 296.15));
  });

  it('has no model without a conduction type or for an anchor no doping can give', () => {
    expect(lotModel({ material: 'Si', dopant: null, dopantType: null }, 300, 5)).toBeNull();
    expect(lotModel({ material: 'Si', dopant: 'P', dopantType: 'n' }, 300, 1e9)).toBeNull();
  });
});
