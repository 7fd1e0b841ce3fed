import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { FakeAnalysisApi, analysisOf, answer, mountPart, previewOf } from '../testing/study-fakes';
import { MetalFits } from './metal-fits';

describe('MetalFits', () => {
  it('fits a linear TCR about 20 °C unless told otherwise, and Bloch–Grüneisen', async () => {
    const api = new FakeAnalysisApi();
    api.analysisAnswer = analysisOf('W');
    const { loader, fixture } = await mountPart(MetalFits, api);
    const reference = await loader.getHarness(MatInputHarness);
    // 20 °C = 293.15 K (the Celsius scale's definition, 0 °C = 273.15 K).
    expect(await reference.getValue()).toBe('293.15');
    const tcr = await loader.getHarness(MatButtonHarness.with({ text: 'Fit linear TCR' }));
    await tcr.click();
    expect(api.previews[0]!.body).toEqual({ kind: 'tcr', referenceK: 293.15 });
    expect(await tcr.isDisabled()).toBe(true); // busy until the answer
    answer(api.previews[0], previewOf(api.previews[0]!.body));
    await fixture.whenStable();

    await reference.setValue('300');
    await tcr.click();
    expect(api.previews[1]!.body).toEqual({ kind: 'tcr', referenceK: 300 });
    answer(api.previews[1], previewOf(api.previews[1]!.body));
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Fit Bloch–Grüneisen' }))).click();
    expect(api.previews[2]!.body).toEqual({ kind: 'bloch-gruneisen' });
    expect(api.creates).toHaveLength(0);
  });

  it('takes the TCR reference in the page’s unit and sends it in kelvin', async () => {
    const api = new FakeAnalysisApi();
    api.analysisAnswer = analysisOf('W');
    const { loader, store, fixture } = await mountPart(MetalFits, api);
    store.setUnit('C');
    await fixture.whenStable();
    const reference = await loader.getHarness(MatInputHarness);
    // 20 °C, the reference of the introductory tables' alpha values.
    expect(await reference.getValue()).toBe('20');
    await reference.setValue('25');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Fit linear TCR' }))).click();
    expect(api.previews[0]!.body).toEqual({ kind: 'tcr', referenceK: 298.15 });
    store.setUnit('K');
  });
});
