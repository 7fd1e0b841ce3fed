import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { FakeAnalysisApi, mountPart, previewOf, savedOf } from '../testing/study-fakes';
import { SavedFits } from './saved-fits';

describe('SavedFits', () => {
  function withSaved() {
    const api = new FakeAnalysisApi();
    const body = { kind: 'arrhenius', minK: 350, maxK: 400 } as const;
    api.saved = [
      savedOf(previewOf(body, { warnings: ['The window spans two regimes.'], stepCount: 3 }), 5),
      savedOf(previewOf({ kind: 'bloch-gruneisen' }), 6),
    ];
    return api;
  }

  it('deletes a fit only after the dialog is confirmed', async () => {
    const api = withSaved();
    const { loader, root, fixture } = await mountPart(SavedFits, api);
    const remove = await loader.getHarness(
      MatButtonHarness.with({ selector: '[aria-label="Delete fit 5"]' }),
    );
    await remove.click();
    let dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Delete fit 5?');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Keep it' }))).click();
    expect(api.deleted).toEqual([]);

    await remove.click();
    dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Delete the fit' }))).click();
    await fixture.whenStable();
    expect(api.deleted).toEqual([5]);
    expect((fixture.nativeElement as HTMLElement).textContent).not.toContain('#5');
  });

  it('lists kinds, windows and warnings, and shows chosen fits side by side', async () => {
    const { loader, fixture } = await mountPart(SavedFits, withSaved());
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text()).toContain('Arrhenius window #5');
    expect(text()).toContain('(1 warning)');
    expect(text()).toContain('Bloch–Grüneisen #6');
    expect(text()).toContain('350.0–400.0 K');
    expect(text()).toContain('9 (3)'); // 9 readings in 3 dwell steps
    const [, second] = await loader.getAllHarnesses(MatCheckboxHarness);
    await second!.check();
    expect(text()).toContain('Bloch–Grüneisen (fit 6)');
  });
});
