import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { FALLBACK_DENSITY_CM3 } from '../sweep-study/initial-doping';
import { answer, mountPart, previewOf, savedOf } from '../testing/study-fakes';
import { ModelFit } from './model-fit';

describe('ModelFit', () => {
  it('previews a fit of the ticked parameters from the starting doping; Keep saves it', async () => {
    const { api, loader, fixture } = await mountPart(ModelFit);
    const mobility = await loader.getHarness(MatCheckboxHarness.with({ label: 'Mobility scale' }));
    const acceptors = await loader.getHarness(
      MatCheckboxHarness.with({ label: 'Acceptor density' }),
    );
    expect(await mobility.isChecked()).toBe(true);
    await mobility.uncheck();
    await acceptors.check();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Fit the model' }))).click();
    const body = api.previews[0]!.body;
    expect(body).toMatchObject({ kind: 'model', free: ['donorDensity', 'acceptorDensity'] });
    // n-type lot without a measured density: the fallback majority density, mobility scale 1.
    expect(body).toMatchObject({
      initial: { donorDensity: FALLBACK_DENSITY_CM3, mobilityScale: 1 },
    });
    expect(api.creates).toHaveLength(0);

    answer(api.previews[0], previewOf(body, { parameters: { donorDensity: 2e15 } }));
    await fixture.whenStable();
    const keep = await loader.getHarness(MatButtonHarness.with({ text: 'Keep this fit' }));
    await keep.click();
    expect(api.creates.map((c) => c.body)).toEqual([body]);
    answer(api.creates[0], savedOf(previewOf(body), 12));
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Kept as fit 12');
  });

  it('cannot fit with no parameter free', async () => {
    const { loader } = await mountPart(ModelFit);
    for (const label of ['Donor density', 'Mobility scale']) {
      await (await loader.getHarness(MatCheckboxHarness.with({ label }))).uncheck();
    }
    const fit = await loader.getHarness(MatButtonHarness.with({ text: 'Fit the model' }));
    expect(await fit.isDisabled()).toBe(true);
  });

  it('shows the time a fit has taken and cancels it, aborting the request', async () => {
    const { api, loader, fixture } = await mountPart(ModelFit);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Fit the model' }))).click();
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('[data-testid=elapsed]')?.textContent).toMatch(
      /Fitting the model: \d+\.\d s/,
    );
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    expect(api.previews[0]!.answer.observed).toBe(false);
    expect(el.textContent).toContain('The fit was cancelled.');
    expect(el.querySelector('[data-testid=elapsed]')).toBeNull();
    const fit = await loader.getHarness(MatButtonHarness.with({ text: 'Fit the model' }));
    expect(await fit.isDisabled()).toBe(false);
  });

  it('cancels a save: the request is aborted and the preview stays, unsaved', async () => {
    const { api, loader, fixture, store } = await mountPart(ModelFit);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Fit the model' }))).click();
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    await fixture.whenStable();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Keep this fit' }))).click();
    expect(store.saving()).toBe(true);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    expect(api.creates[0]!.answer.observed).toBe(false);
    expect(store.saving()).toBe(false);
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Saving was cancelled: nothing was stored.');
    expect(text).toContain('preview, not saved');
  });
});
