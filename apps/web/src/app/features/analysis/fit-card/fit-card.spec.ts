import { TestBed } from '@angular/core/testing';
import type { FitPreviewDto } from '@rhotrace/api-types';
import { previewOf, savedOf } from '../testing/study-fakes';
import { FitCard } from './fit-card';

const BODY = { kind: 'arrhenius', minK: 120, maxK: 200 } as const;

async function render(fit: FitPreviewDto) {
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

  it('leaves out what a fit does not state, and names a saved fit with its author', async () => {
    const { el, text } = await render(savedOf(previewOf(BODY), 17));
    expect(text).toContain('(fit 17)');
    expect(text).toContain('by Ada Physicist');
    expect(text).not.toContain('temperature steps');
    expect(text).not.toContain('preview, not saved');
    expect(el.querySelector('[aria-label=Interpretation]')).toBeNull();
    expect(el.querySelector('[aria-label=Warnings]')).toBeNull();
    expect(el.querySelector('[data-testid=curvature]')).toBeNull();
    expect(el.querySelector('[data-testid=excluded]')).toBeNull();
  });
});
