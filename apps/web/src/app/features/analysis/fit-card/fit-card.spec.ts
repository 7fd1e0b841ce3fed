import { TestBed } from '@angular/core/testing';
import type { FitPreviewDto } from '@rhotrace/api-types';
import { previewOf, savedOf } from '../testing/study-fakes';
import { FitCard } from './fit-card';

const BODY = { kind: 'arrhenius', minK: 120, maxK: 200 } as const;

async function render(fit: FitPreviewDto) {
  TestBed.resetTestingModule();
  TestBed.configureTestingModule({ imports: [FitCard] });
  const fixture = TestBed.createComponent(FitCard);
  fixture.componentRef.setInput('fit', fit);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  return { el, text: (el.textContent ?? '').replace(/\s+/g, ' ') };
}

describe('FitCard', () => {
  it('states the reading, its assumptions, the curvature, warnings and points left out', async () => {
    const { el, text } = await render(
      previewOf(BODY, {
        stepCount: 9,
        interpretation: {
          regime: 'freeze-out',
          property: 'dopant-level',
          valueEv: 0.0452,
          standardErrorEv: 0.0011,
          compensation: 'uncompensated',
          compensationSource: 'inferred',
          prefactorExponent: 1.5,
          note: 'Ed = 2 Ea for an uncompensated sample in freeze-out.',
        },
        curvature: { value: 0.31, standardError: 0.05, t: 6.2, significant: true },
        warnings: ['The window spans two regimes.'],
        excludedSequences: [4, 9],
      }),
    );
    expect(text).toContain('Arrhenius window 120.0–200.0 K (preview)');
    expect(text).toContain('9 temperature steps');
    expect(text).toContain('Dopant ionization energy: 0.0452 eV ± 0.0011 eV');
    expect(text).toContain('Assumes the Freeze-out regime, uncompensated (inferred from the data)');
    expect(text).toContain('m = 1.5');
    expect(text).toContain('The window curves');
    expect(el.querySelector('[aria-label=Warnings]')?.textContent).toContain('two regimes');
    expect(text).toContain('2 flagged points left out (readings 4, 9).');
    expect(text).toContain('not saved');
  });

  it('gives a TCR in ppm/K beside 1/K, its standard error too', async () => {
    const { text } = await render(
      previewOf(
        { kind: 'tcr' },
        {
          parameters: { referenceResistivityOhmCm: 1.68e-6, alphaPerK: 0.00393 },
          standardErrors: { referenceResistivityOhmCm: 1e-9, alphaPerK: 2.1e-5 },
        },
      ),
    );
    // 1 ppm/K = 10⁻⁶ 1/K: 0.00393 1/K is 3930 ppm/K, 2.1e-5 1/K is 21 ppm/K.
    expect(text).toContain('0.00393 (3930 ppm/K)');
    expect(text).toContain('2.1 × 10⁻⁵ (21 ppm/K)');
    expect(text.match(/ppm\/K/g)).toHaveLength(2);
  });

  it('leaves out what a fit does not state, and names a saved fit with its author', async () => {
    const { el, text } = await render(savedOf(previewOf(BODY), 17));
    expect(text).toContain('(fit 17)');
    expect(text).toContain('by Ada Physicist');
    // Saved 2026-01-02T03:04:05Z: shown to the minute with the zone stated.
    expect(text).toContain('2026-01-02 03:04 UTC');
    expect(text).not.toContain('temperature steps');
    expect(text).not.toContain('preview, not saved');
    expect(el.querySelector('[aria-label=Interpretation]')).toBeNull();
    expect(el.querySelector('[aria-label=Warnings]')).toBeNull();
    expect(el.querySelector('[data-testid=curvature]')).toBeNull();
    expect(el.querySelector('[data-testid=excluded]')).toBeNull();
  });

  it('calls out a bad fit: a value with a relative standard error above 50 %, and says which parameters were held fixed', async () => {
    // The Bloch–Grüneisen case: a Debye temperature of 257 ± 2300 K.
    const { el, text } = await render(
      previewOf(
        { kind: 'bloch-gruneisen' },
        {
          parameters: { residualOhmCm: 1e-7, couplingOhmCm: 5e-6, debyeK: 257 },
          standardErrors: { residualOhmCm: 1e-9, couplingOhmCm: 1e-8, debyeK: 2300 },
          confidenceIntervals: {},
          modelVersion: 'physics@0.1.0+bloch-gruneisen',
          warnings: [
            'The Debye temperature is poorly determined: relative standard error 895 % (above 50 %).',
          ],
        },
      ),
    );
    expect(el.querySelector('[data-testid=check-fit]')).not.toBeNull();
    expect(text).toContain('257 (poorly determined)');
    expect(text).not.toContain('1.000 × 10⁻⁷ (poorly determined)');
    expect(text).toContain('Model: Bloch–Grüneisen, Rhotrace physics 0.1');
    expect(text).not.toContain('physics@');

    const model = await render(
      previewOf(
        {
          kind: 'model',
          initial: { donorDensity: 0, acceptorDensity: 1e15 },
          free: ['acceptorDensity'],
        },
        {
          parameters: { donorDensity: 0, acceptorDensity: 1.2e15 },
          standardErrors: { acceptorDensity: 1e13 },
          confidenceIntervals: {},
          modelVersion: 'physics@0.1.0+Si:si-scaled-t15',
        },
      ),
    );
    expect(model.text).toMatch(/Donor density \(cm⁻³\) 0 held fixed/);
    expect(model.text).toContain('Model: silicon, Rhotrace physics 0.1');
    expect(model.el.querySelector('[data-testid=check-fit]')).toBeNull();
  });
});
