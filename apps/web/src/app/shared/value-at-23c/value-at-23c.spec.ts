import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { ValueAt23C, type ValueAt23CReading } from './value-at-23c';

const reading: ValueAt23CReading = {
  resistivityAt23COhmCm: 14.95,
  method: 'corrected',
  distanceK: 4.9,
  verdict: 'indeterminate',
  uncertaintyOhmCm: 0.12,
  coverageFactor: 2,
  reason: 'The value lies within its expanded uncertainty (k = 2) of a spec limit',
  uncertaintyBudget: [
    {
      source: 'repeatability',
      standardUncertaintyOhmCm: 0.01,
      relative: 0.01 / 14.95,
      distribution: 'normal',
      note: 'Scatter of the readings',
    },
    {
      source: 'temperature-sensor',
      standardUncertaintyOhmCm: 0.05,
      relative: 0.05 / 14.95,
      distribution: 'rectangular',
      note: '±0.42 K (IEC 60751 class B assumed)',
    },
    {
      source: 'thickness',
      standardUncertaintyOhmCm: 0,
      relative: 0,
      distribution: 'rectangular',
      note: 'Not assessed: the lot states no thickness tolerance',
    },
  ],
};

@Component({
  imports: [ValueAt23C],
  template: `<rt-value-at-23c [reading]="reading()" />`,
})
class Host {
  readonly reading = signal<ValueAt23CReading>(reading);
}

describe('ValueAt23C', () => {
  async function setup() {
    const fixture = TestBed.createComponent(Host);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    return { fixture, loader, text: () => fixture.nativeElement.textContent as string };
  }

  it('shows the value ± U with k, how it was reached and the guard-banded verdict', async () => {
    const { text } = await setup();
    expect(text()).toContain('14.95');
    expect(text()).toContain('± 0.12');
    expect(text()).toContain('k = 2');
    expect(text()).toContain('corrected from a step 4.9 K away');
    expect(text()).toContain('too close to call');
  });

  it('folds the budget away and lists each line, unstated ones as not assessed', async () => {
    const { loader } = await setup();
    const panel = await loader.getHarness(MatExpansionPanelHarness);
    expect(await panel.isExpanded()).toBe(false);
    expect(await panel.getTitle()).toBe('Uncertainty budget');
    await panel.expand();
    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    expect(cells['source']?.text).toEqual([
      'Scatter within steps',
      'Thermometer tolerance',
      'Thickness',
    ]);
    expect(cells['u']?.text).toEqual(['0.01', '0.05', 'not assessed']);
    expect(cells['relative']?.text[1]).toBe('0.33');
  });

  it('says why there is no value', async () => {
    const { fixture, loader, text } = await setup();
    fixture.componentInstance.reading.set({
      ...reading,
      resistivityAt23COhmCm: null,
      method: null,
      verdict: null,
      uncertaintyOhmCm: null,
      coverageFactor: null,
      uncertaintyBudget: [],
      reason: 'The sweep does not reach 23 °C',
    });
    await fixture.whenStable();
    expect(text()).toContain('No resistivity at 23 °C: The sweep does not reach 23 °C');
    expect(await loader.getAllHarnesses(MatExpansionPanelHarness)).toHaveLength(0);
  });
});
