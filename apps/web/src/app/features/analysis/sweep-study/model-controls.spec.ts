import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { DopingInput } from '@rhotrace/api-types';
import { ModelControls } from './model-controls';

describe('ModelControls', () => {
  it('shows long densities in exponent notation and gives the model the value shown', async () => {
    TestBed.configureTestingModule({ imports: [ModelControls] });
    const fixture = TestBed.createComponent(ModelControls);
    const seen: Array<DopingInput | null> = [];
    fixture.componentInstance.dopingChange.subscribe((d) => seen.push(d));
    fixture.componentRef.setInput('initial', {
      donorDensity: 1553997171186115,
      acceptorDensity: 1.553997171186115e13,
    });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const donor = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=donorDensity]' }),
    );
    const acceptor = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=acceptorDensity]' }),
    );
    expect(await donor.getValue()).toBe('1.55e15');
    expect(await acceptor.getValue()).toBe('1.55e13');
    expect(seen.at(-1)).toMatchObject({ donorDensity: 1.55e15, acceptorDensity: 1.55e13 });
  });

  it('starts from the given doping and reports every valid edit, null while invalid', async () => {
    TestBed.configureTestingModule({ imports: [ModelControls] });
    const fixture = TestBed.createComponent(ModelControls);
    const seen: Array<DopingInput | null> = [];
    fixture.componentInstance.dopingChange.subscribe((d) => seen.push(d));
    fixture.componentRef.setInput('initial', {
      donorDensity: 1e15,
      acceptorDensity: 1e13,
      donor: 'P',
      donorLevel: 0.045,
    });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);

    const donor = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=donorDensity]' }),
    );
    expect(await donor.getValue()).toBe('1e15');
    const acceptor = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=acceptorDensity]' }),
    );
    expect(await acceptor.getValue()).toBe('1e13');
    expect(seen.at(-1)).toEqual({
      donorDensity: 1e15,
      acceptorDensity: 1e13,
      donor: 'P',
      donorLevel: 0.045,
    });

    await donor.setValue('3e16');
    expect(seen.at(-1)).toMatchObject({
      donorDensity: 3e16,
      acceptorDensity: 1e13,
      donorLevel: 0.045,
      donor: 'P',
    });
    await donor.setValue('2.5×10^16');
    expect(seen.at(-1)).toMatchObject({ donorDensity: 2.5e16 });
    await donor.setValue('lots');
    await donor.blur();
    expect(seen.at(-1)).toBeNull();
    const donorField = await loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: /^Donor density/ }),
    );
    expect(await donorField.getTextErrors()).toEqual(['Type a number, e.g. 1.5e15.']);
    expect(await donorField.getLabel()).toBe('Donor density (P)');
    await donor.setValue('3e16');

    const level = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=donorLevel]' }),
    );
    await level.setValue('5');
    await level.blur();
    expect(seen.at(-1)).toBeNull();
    const field = await loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: 'Donor level' }),
    );
    expect(await field.getTextErrors()).toEqual(['Use 2 or less.']);
  });
});
