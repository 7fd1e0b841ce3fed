import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { FakeAnalysisApi, analysisOf, mountPart, previewOf, savedOf } from '../testing/study-fakes';
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

  it('draws the model from a fit’s values on request, says so, and goes back to typed values on an edit', async () => {
    const api = new FakeAnalysisApi();
    const { store, fixture, loader } = await mountPart(ModelOverlay, api);
    const note = () =>
      (fixture.nativeElement as HTMLElement).querySelector('[data-testid=overlay-source]')
        ?.textContent ?? '';
    expect(note()).toContain('Drawn with the values entered above.');
    const fit = savedOf(
      previewOf(
        {
          kind: 'model',
          initial: { donorDensity: 1e15, acceptorDensity: 0 },
          free: ['donorDensity'],
        },
        {
          parameters: {
            donorDensity: 2.5e15,
            acceptorDensity: 1e13,
            donorLevel: 0.045,
            acceptorLevel: 0.045,
            mobilityScale: 0.8,
          },
        },
      ),
      12,
    );
    store.useFitted(fit);
    await fixture.whenStable();
    await new Promise((r) => setTimeout(r, 200)); // the curve request is debounced
    expect(note()).toContain('Drawn with fitted values (fit 12)');
    expect(note()).toContain('mobility scale 0.8');
    expect(api.curves.at(-1)).toMatchObject({
      doping: { donorDensity: 2.5e15, acceptorDensity: 1e13 },
      mobilityScale: 0.8,
    });
    const donors = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=donorDensity]' }),
    );
    await donors.setValue('3e15');
    await fixture.whenStable();
    expect(note()).toContain('Drawn with the values entered above.');
    await new Promise((r) => setTimeout(r, 200));
    expect(api.curves.at(-1)).not.toHaveProperty('mobilityScale');
  });
});
