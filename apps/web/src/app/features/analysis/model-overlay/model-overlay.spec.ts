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
});
