import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { HallAnalysis } from '@rhotrace/api-types';
import { SavedFits } from '../../saved-fits/saved-fits';
import { answer, mountPart, previewOf, savedOf } from '../../testing/study-fakes';
import { HallMobilityFit } from '../hall-mobility-fit/hall-mobility-fit';
import { HallFitsStore } from './hall-fits-store';

/** An n-type Hall sweep of six steps, 150–400 K. */
function hallOf(): HallAnalysis {
  return {
    steps: [150, 200, 250, 300, 350, 400].map((temperatureK) => ({
      temperatureK,
      carrierDensityCm3: 1e15,
      carrierDensitySpreadCm3: 1e13,
      hallMobilityCm2PerVs: 1400 * (temperatureK / 300) ** -2.4,
      hallCoefficientCm3PerC: -6250,
      carrierType: 'n' as const,
      count: 4,
    })),
    carrierType: 'n',
    hallFactor: 1,
    carrierDensityAt300KCm3: 1e15,
    hallMobilityAt300KCm2PerVs: 1400,
    freezeOutWindow: null,
  };
}

@Component({
  imports: [HallMobilityFit],
  providers: [HallFitsStore],
  template: `<rt-hall-mobility-fit [hall]="hall" />`,
})
class MobilityHost {
  protected readonly hall = hallOf();
}

describe('Hall fits', () => {
  it('answers a density fit asked before a mobility fit (one does not abort the other)', async () => {
    const { api } = await mountPart(SavedFits);
    const hall = TestBed.runInInjectionContext(() => new HallFitsStore());
    const initial = { donorDensity: 1e15, acceptorDensity: 1e14, donorLevel: 0.045 };
    hall.preview('carrier-density', {
      kind: 'carrier-density',
      material: 'Si',
      initial,
      free: ['donorDensity'],
    });
    hall.preview('hall-mobility', { kind: 'hall-mobility', minK: 150, maxK: 400 });
    answer(api.previews[0], previewOf(api.previews[0]!.body, { windowMinK: 20, windowMaxK: 400 }));
    answer(api.previews[1], previewOf(api.previews[1]!.body));
    expect(hall.slots['carrier-density']()).toMatchObject({
      busy: false,
      fit: { kind: 'carrier-density' },
    });
    expect(hall.slots['hall-mobility']()).toMatchObject({
      busy: false,
      fit: { kind: 'hall-mobility' },
    });
  });

  it('shows the time a Hall fit has taken, cancels it, then keeps a new one', async () => {
    const { api, loader, fixture } = await mountPart(MobilityHost);
    const el = fixture.nativeElement as HTMLElement;
    const from = await loader.getHarness(MatInputHarness.with({ selector: 'input' }));
    expect(await from.getValue()).toBe('150');
    await from.setValue('200');
    const fit = await loader.getHarness(MatButtonHarness.with({ text: 'Fit µ_H(T)' }));
    await fit.click();
    expect(api.previews[0]!.body).toMatchObject({ kind: 'hall-mobility', minK: 200, maxK: 400 });
    expect(el.querySelector('[data-testid=elapsed]')?.textContent).toMatch(
      /Fitting µ_H\(T\): \d+\.\d s/,
    );
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    expect(api.previews[0]!.answer.observed).toBe(false);
    expect(el.textContent).toContain('The fit was cancelled.');

    await fit.click();
    const body = api.previews[1]!.body;
    answer(api.previews[1], previewOf(body, { kind: 'hall-mobility' }));
    await fixture.whenStable();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Keep this fit' }))).click();
    expect(api.creates.map((c) => c.body)).toEqual([body]);
    answer(api.creates[0], savedOf(previewOf(body, { kind: 'hall-mobility' }), 40));
    await fixture.whenStable();
    expect(el.textContent).toContain('Kept as fit 40');
  });
});
