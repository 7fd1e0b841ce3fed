import { By } from '@angular/platform-browser';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Plot } from '../../../shared/plot/plot';
import {
  FakeAnalysisApi,
  analysisOf,
  answer,
  mountPart,
  previewOf,
  savedOf,
} from '../testing/study-fakes';
import { ArrheniusWindow } from './arrhenius-window';

async function mount() {
  const part = await mountPart(ArrheniusWindow);
  const plot = part.fixture.debugElement.query(By.directive(Plot)).componentInstance as Plot;
  /** A drag across 1000/T from xMin to xMax, as the plot reports it. */
  const drag = async (xMin: number, xMax: number) => {
    plot.selected.emit({ xMin, xMax });
    await part.fixture.whenStable();
  };
  const text = () => (part.fixture.nativeElement as HTMLElement).textContent ?? '';
  return { ...part, drag, text };
}

describe('ArrheniusWindow', () => {
  it('previews the dragged window without saving it; Keep saves that request once', async () => {
    const { api, loader, drag, text, fixture } = await mount();
    await drag(2.5, 1000 / 350);
    expect(api.previews.map((p) => p.body)).toEqual([
      { kind: 'arrhenius', minK: 350, maxK: 400, quantity: 'resistivity', prefactorExponent: 0 },
    ]);
    expect(api.creates).toHaveLength(0);
    // The typed bounds follow the drag.
    const from = await loader.getHarness(MatInputHarness.with({ selector: '[name=from]' }));
    expect(await from.getValue()).toBe('350');

    answer(api.previews[0], previewOf(api.previews[0]!.body));
    await fixture.whenStable();
    expect(text()).toContain('Arrhenius window 350.0–400.0 K (preview)');
    expect(text()).toContain('preview, not saved');

    const keep = await loader.getHarness(MatButtonHarness.with({ text: 'Keep this fit' }));
    await keep.click();
    expect(await keep.isDisabled()).toBe(true); // a second click cannot save twice
    expect(api.creates.map((c) => c.body)).toEqual([api.previews[0]!.body]);
    answer(api.creates[0], savedOf(previewOf(api.previews[0]!.body), 41));
    await fixture.whenStable();
    expect(text()).toContain('(fit 41)');
    expect(text()).toContain('Kept as fit 41');
  });

  it('makes a second drag wait for the first, and shows only the newest answer', async () => {
    const { api, drag, text, fixture } = await mount();
    await drag(2.5, 1000 / 350);
    await drag(2.4, 2.6);
    expect(api.previews).toHaveLength(1); // the second drag waits
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    await fixture.whenStable();
    expect(text()).not.toContain('350.0–400.0 K (preview)'); // overtaken: not shown
    expect(api.previews).toHaveLength(2);
    expect(api.previews[1]!.body).toMatchObject({ minK: 384.62, maxK: 416.67 });
    answer(api.previews[1], previewOf(api.previews[1]!.body));
    await fixture.whenStable();
    expect(text()).toContain('384.6–416.7 K (preview)');
  });

  it('sends the stated compensation, and nothing when it is to be inferred', async () => {
    const { api, loader, drag, fixture } = await mount();
    await drag(2.5, 1000 / 350);
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    await fixture.whenStable();
    const compensation = await loader.getHarness(
      MatSelectHarness.with({ selector: '[name=compensation]' }),
    );
    await compensation.open();
    await compensation.clickOptions({ text: 'Compensated' });
    expect(api.previews[1]!.body).toMatchObject({ compensated: true });
    answer(api.previews[1], previewOf(api.previews[1]!.body));
    await compensation.open();
    await compensation.clickOptions({ text: 'Infer from the data' });
    answer(api.previews[2], previewOf(api.previews[2]!.body));
    expect(api.previews[2]!.body).not.toHaveProperty('compensated');
  });

  it('asks again with flagged readings included when that is ticked, and leaves it out otherwise', async () => {
    const { api, store, drag, fixture } = await mount();
    await drag(2.5, 1000 / 350);
    expect(api.previews[0]!.body).not.toHaveProperty('includeFlagged');
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    store.setIncludeFlagged(true);
    await fixture.whenStable();
    expect(api.previews[1]!.body).toMatchObject({ minK: 350, maxK: 400, includeFlagged: true });
  });

  it('fits ln σ once the plot shows it, over the window already chosen', async () => {
    const { api, loader, drag, fixture } = await mount();
    await drag(2.5, 1000 / 350);
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    await fixture.whenStable();
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'ln σ' }))).check();
    expect(api.previews[1]!.body).toMatchObject({
      minK: 350,
      maxK: 400,
      quantity: 'conductivity',
    });
  });

  it('shades and types the window the API fitted when it clips one reaching past the data', async () => {
    const { api, loader, drag, fixture } = await mount();
    await drag(2.5, 1000 / 280);
    const body = api.previews[0]!.body;
    answer(api.previews[0], previewOf(body, { windowMinK: 300, windowMaxK: 400 }));
    await fixture.whenStable();
    const from = await loader.getHarness(MatInputHarness.with({ selector: '[name=from]' }));
    expect(await from.getValue()).toBe('300');
    expect(api.previews).toHaveLength(1); // showing the clipped window asks for nothing more
  });

  it('previews typed bounds and explains a missing one', async () => {
    const { api, loader, text, fixture } = await mount();
    const preview = await loader.getHarness(MatButtonHarness.with({ text: 'Preview this window' }));
    const to = await loader.getHarness(MatInputHarness.with({ selector: '[name=to]' }));
    await to.setValue('420');
    await preview.click();
    expect(text()).toContain('Give both ends of the window');
    expect(api.previews).toHaveLength(0);
    const from = await loader.getHarness(MatInputHarness.with({ selector: '[name=from]' }));
    await from.setValue('330');
    await preview.click();
    await fixture.whenStable();
    expect(api.previews[0]!.body).toMatchObject({ minK: 330, maxK: 420 });
  });

  it('shows the caution that comes with a suggested window', async () => {
    const api = new FakeAnalysisApi();
    api.analysisAnswer = {
      ...analysisOf(),
      suggestedWindows: [
        {
          regime: 'intrinsic',
          minK: 350,
          maxK: 450,
          pointCount: 9,
          warnings: ['only 4 steps: too few for a trustworthy slope'],
        },
      ],
    };
    const { fixture } = await mountPart(ArrheniusWindow, api);
    const note = (fixture.nativeElement as HTMLElement).querySelector(
      '[data-testid="window-warning"]',
    );
    expect(note?.textContent).toContain('only 4 steps');
  });

  it('shows and takes every temperature in the unit chosen for the page', async () => {
    const { api, loader, store, text, fixture } = await mount();
    store.setUnit('C');
    await fixture.whenStable();
    // 0 °C = 273.15 K by the definition of the Celsius scale (SI Brochure, 9th ed., 2.3.1).
    expect(text()).toContain('Intrinsic 76.9–176.9 °C (9 readings)');
    await (await loader.getHarness(MatButtonHarness.with({ text: /^Intrinsic/ }))).click();
    const from = await loader.getHarness(MatInputHarness.with({ selector: '[name=from]' }));
    const to = await loader.getHarness(MatInputHarness.with({ selector: '[name=to]' }));
    expect(await from.getValue()).toBe('76.85');
    expect(text()).toContain('°C');
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    await fixture.whenStable();
    expect(text()).toContain('Arrhenius window 76.9–176.9 °C (preview)');
    await from.setValue('100');
    await to.setValue('150');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Preview this window' }))).click();
    expect(api.previews[1]!.body).toMatchObject({ minK: 373.15, maxK: 423.15 });
    store.setUnit('K');
    await fixture.whenStable();
    expect(await from.getValue()).toBe('373.15');
  });
});
