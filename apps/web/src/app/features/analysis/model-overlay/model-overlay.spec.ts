import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { FakeAnalysisApi, analysisOf, mountPart } from '../testing/study-fakes';
import { ModelOverlay } from './model-overlay';

describe('ModelOverlay', () => {
  it('starts a semiconductor from the stated doping and switches the temperature unit', async () => {
    const { loader, store, fixture } = await mountPart(ModelOverlay);
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Starting point: Donors');
    expect(text).toContain('a default guess');
    const celsius = await loader.getHarness(MatButtonToggleHarness.with({ text: '°C' }));
    await celsius.check();
    expect(store.unit()).toBe('C');
  });

  it('draws the bulk reference of a metal film, with no doping to edit', async () => {
    const api = new FakeAnalysisApi();
    api.analysisAnswer = analysisOf('W');
    const { fixture } = await mountPart(ModelOverlay, api);
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Metal film: the bulk reference curve of W');
    expect(text).not.toContain('Starting point');
  });

  it('states where the model is stretched, as the API says it', async () => {
    const { store, fixture } = await mountPart(ModelOverlay);
    store.curveState.set({
      curve: {
        kind: 'semiconductor',
        material: 'Si',
        points: [],
        boundaries: { freezeOutBelowK: null, intrinsicAboveK: null },
        modelVersion: 't',
        warnings: ['the mobility model was fitted over 200-500 K; below that it is extrapolated'],
      },
      problem: null,
      loading: false,
    });
    fixture.detectChanges();
    await fixture.whenStable();
    const list = (fixture.nativeElement as HTMLElement).querySelector(
      '[data-testid="model-warnings"]',
    );
    expect(list?.textContent).toContain('fitted over 200-500 K');
  });
});
