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
});
