import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { DopingInput } from '@rhotrace/api-types';
import { ModelControls } from './model-controls';

describe('ModelControls', () => {
  it('starts from the given doping and reports every valid edit, null while invalid', async () => {
    TestBed.configureTestingModule({ imports: [ModelControls] });
    const fixture = TestBed.createComponent(ModelControls);
    const seen: Array<DopingInput | null> = [];
    fixture.componentInstance.dopingChange.subscribe((d) => seen.push(d));
    fixture.componentRef.setInput('initial', { donorDensity: 1e15, acceptorDensity: 1e13, donor: 'P', donorLevel: 0.045 });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);

    const donor = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=donorDensity]' }));
    expect(await donor.getValue()).toBe('1000000000000000');
    expect(seen.at(-1)).toEqual({ donorDensity: 1e15, acceptorDensity: 1e13, donor: 'P', donorLevel: 0.045 });

    await donor.setValue('3e16');
    expect(seen.at(-1)).toMatchObject({ donorDensity: 3e16, acceptorDensity: 1e13, donorLevel: 0.045, donor: 'P' });

    const level = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=donorLevel]' }));
    await level.setValue('5');
    await level.blur();
    expect(seen.at(-1)).toBeNull();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Donor level' }));
    expect(await field.getTextErrors()).toEqual(['Use 2 or less.']);
  });
});
