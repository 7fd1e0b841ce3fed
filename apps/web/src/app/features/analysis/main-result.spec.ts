import { mainResult } from './main-result';
import { previewOf } from './testing/study-fakes';

describe('the main result of a fit', () => {
  it('is the activation energy of an Arrhenius window', () => {
    const f = previewOf(
      { kind: 'arrhenius', minK: 400, maxK: 500 },
      {
        parameters: { activationEnergyEv: 0.5523, intercept: -3, impliedEv: 1.1 },
        standardErrors: { activationEnergyEv: 0.0041, intercept: 0.1 },
      },
    );
    expect(mainResult(f)).toBe('Activation energy (eV): 0.5523 ± 0.0041');
  });

  it('is the temperature coefficient of a metal film, not ρ at the reference', () => {
    const f = previewOf(
      { kind: 'tcr' },
      {
        parameters: { referenceResistivityOhmCm: 1.68e-6, alphaPerK: 0.0039 },
        standardErrors: { referenceResistivityOhmCm: 1e-9, alphaPerK: 2.1e-5 },
      },
    );
    // 1 ppm/K = 10⁻⁶ 1/K: 0.0039 1/K is 3900 ppm/K, 2.1e-5 1/K is 21 ppm/K.
    expect(mainResult(f)).toBe(
      'Temperature coefficient (1/K): 0.0039 ± 2.1 × 10⁻⁵ (3900 ± 21 ppm/K)',
    );
  });

  it('is a parameter the full model freed, never one held fixed', () => {
    const f = previewOf(
      {
        kind: 'model',
        initial: { donorDensity: 1e15, acceptorDensity: 0 },
        free: ['acceptorDensity'],
      },
      {
        // Parameters list every model parameter, fixed ones (the donor density) first.
        parameters: { donorDensity: 1e15, acceptorDensity: 2.5e13, mobilityScale: 1 },
        standardErrors: { acceptorDensity: 3e12 },
        inputs: { kind: 'model', free: ['acceptorDensity'] },
      },
    );
    expect(mainResult(f)).toBe('Acceptor density (cm⁻³): 2.500 × 10¹³ ± 3.0 × 10¹²');
  });

  it('is the Debye temperature of Bloch–Grüneisen, saying when it has no standard error', () => {
    const f = previewOf(
      { kind: 'bloch-gruneisen' },
      {
        parameters: { residualOhmCm: 1e-7, couplingOhmCm: 5e-6, debyeK: 343 },
        standardErrors: { residualOhmCm: 1e-9, couplingOhmCm: 1e-8, debyeK: null },
      },
    );
    expect(mainResult(f)).toBe('Debye temperature (K): 343 (no standard error)');
  });
});
