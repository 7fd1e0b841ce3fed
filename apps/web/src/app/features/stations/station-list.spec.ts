import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { StationDto, StationInput } from '@rhotrace/api-types';
import { of, throwError } from 'rxjs';
import { Session } from '../../core/auth/session';
import { ApiError } from '../../core/http/api-error';
import { provideIsoDateAdapter } from '../../shared/iso-date';
import { StationList } from './station-list';
import { StationsApi } from './stations-api';

const BENCH: StationDto = {
  id: 4,
  name: 'Cold bench',
  probeSpacingCm: 0.1,
  tipRadiusCm: null,
  thermometer: 'thermocouple',
  rtdR0Ohm: null,
  minTemperatureK: 77,
  maxTemperatureK: 500,
  calibratedOn: null,
  // every field the API answers with, so editing copes with the real shape
  calibrationDueOn: null,
  calibrationOverdue: false,
  sensor: { kind: 'thermocouple', type: null },
  probeSpacingToleranceCm: null,
  temperatureToleranceK: null,
  notes: null,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
};

/** A StationsApi that records what is sent; `refuse` makes the next update fail with it. */
class FakeStationsApi {
  lists = 0;
  readonly removed: number[] = [];
  readonly updates: Array<{ id: number; body: Partial<StationInput> }> = [];
  refuse: ApiError | null = null;
  stations: StationDto[] = [BENCH];
  list() {
    this.lists += 1;
    return of({ items: this.stations, total: this.stations.length, page: 1, pageSize: 200 });
  }
  remove(id: number) {
    this.removed.push(id);
    return of(null);
  }
  update(id: number, body: Partial<StationInput>) {
    this.updates.push({ id, body });
    return this.refuse ? throwError(() => this.refuse) : of({ ...BENCH, ...body });
  }
}

async function setup(stations?: StationDto[]) {
  const api = new FakeStationsApi();
  if (stations) api.stations = stations;
  TestBed.configureTestingModule({
    imports: [StationList],
    providers: [
      { provide: StationsApi, useValue: api },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      { provide: Session, useValue: { can: () => true } },
      provideIsoDateAdapter(),
    ],
  });
  const fixture = TestBed.createComponent(StationList);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  return { fixture, api, loader, root };
}

describe('StationList', () => {
  it('marks a station whose calibration is past the lab interval', async () => {
    const { fixture } = await setup([
      BENCH,
      {
        ...BENCH,
        id: 5,
        name: 'Old chuck',
        calibratedOn: '2024-03-01',
        calibrationDueOn: '2025-03-01',
        calibrationOverdue: true,
      },
    ]);
    const rows = (fixture.nativeElement as HTMLElement).querySelectorAll('tr');
    const text = [...rows].map((r) => r.textContent?.replace(/\s+/g, ' ') ?? '');
    expect(text.find((t) => t.includes('Old chuck'))).toContain('due since 2025-03-01');
    expect(text.find((t) => t.includes('Cold bench'))).not.toContain('due since');
  });

  it('deletes a station only after the confirmation dialog says so', async () => {
    const { api, loader, root } = await setup();
    const remove = await loader.getHarness(
      MatButtonHarness.with({ selector: '[aria-label="Delete Cold bench"]' }),
    );
    await remove.click();
    let dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Delete station Cold bench?');
    expect(await dialog.getContentText()).toMatch(/change trail/);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Keep it' }))).click();
    expect(api.removed).toEqual([]);

    await remove.click();
    dialog = await root.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Delete the station' }))).click();
    expect(api.removed).toEqual([4]);
    expect(api.lists).toBe(2); // the list is read again
  });

  it('edits in the form above the table and shows the server refusal on its field', async () => {
    const { api, loader, fixture } = await setup();
    api.refuse = new ApiError(400, 'validation', 'The station could not be saved', [
      { field: 'body.name', problem: 'is already used by another station' },
    ]);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Edit Cold bench"]' }))
    ).click();
    const name = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=name]' }),
    );
    expect(await name.getValue()).toBe('Cold bench');
    await name.setValue('Hot bench');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    expect(api.updates).toHaveLength(1);
    expect(api.updates[0]).toMatchObject({
      id: 4,
      body: { name: 'Hot bench', probeSpacingCm: 0.1 },
    });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'The station could not be saved',
    );
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Name' }));
    expect(await field.isControlValid()).toBe(false);

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Save' }))).toHaveLength(0);
    expect(
      await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Register a station' })),
    ).toHaveLength(1);
  });

  async function editBench() {
    const ctx = await setup();
    await (
      await ctx.loader.getHarness(
        MatButtonHarness.with({ selector: '[aria-label="Edit Cold bench"]' }),
      )
    ).click();
    const thermometer = await ctx.loader.getHarness(
      MatSelectHarness.with({ selector: '[formControlName=thermometer]' }),
    );
    return { ...ctx, thermometer };
  }

  it('records a type K thermocouple with its reference junction in °C', async () => {
    const { api, loader } = await editBench();
    const type = await loader.getHarness(
      MatSelectHarness.with({ selector: '[formControlName=type]' }),
    );
    await type.open();
    await type.clickOptions({ text: 'Type K' });
    const junction = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=referenceJunctionC]' }),
    );
    await junction.setValue('23.4');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const sensor = api.updates[0]!.body.sensor;
    expect(api.updates[0]!.body.thermometer).toBe('thermocouple');
    expect(sensor?.kind === 'thermocouple' && sensor.type).toBe('K');
    expect(sensor?.kind === 'thermocouple' && sensor.referenceJunctionK).toBeCloseTo(296.55, 9);
  });

  it('takes a pasted calibration table and names the row that breaks it', async () => {
    const { api, loader, thermometer } = await editBench();
    await thermometer.open();
    await thermometer.clickOptions({ text: 'Calibration table' });
    const table = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=points]' }),
    );
    await table.setValue('1.10\t20\n1.00\t100\n1.05\t300');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    expect(api.updates).toHaveLength(0);
    const field = await loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: 'Calibration table' }),
    );
    expect((await field.getTextErrors()).join(' ')).toMatch(/^Row 3: the reading 1\.05 breaks/);
    await table.setValue('1.10\t20\n1.00\t100\n0.50\t300');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    expect(api.updates[0]!.body).toMatchObject({
      thermometer: 'table',
      rtdR0Ohm: null,
      sensor: { kind: 'table', points: [{ reading: 1.1, temperatureK: 20 }, {}, {}] },
    });
  });

  it('needs R0 for a platinum RTD', async () => {
    const { api, loader, thermometer } = await editBench();
    await thermometer.open();
    await thermometer.clickOptions({ text: 'Platinum RTD' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    expect(api.updates).toHaveLength(0);
    const r0 = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=r0Ohm]' }),
    );
    await r0.setValue('100');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    expect(api.updates[0]!.body).toMatchObject({
      rtdR0Ohm: 100,
      sensor: { kind: 'platinum-rtd', r0Ohm: 100 },
    });
  });

  it('takes probe spacing in mm, tip radius in µm and the calibration day as YYYY-MM-DD', async () => {
    const { api, loader } = await setup();
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Edit Cold bench"]' }))
    ).click();
    const input = (name: string) =>
      loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }));
    // The stored 0.1 cm is 1 mm (1 cm = 10 mm, SI).
    expect(await (await input('probeSpacingCm')).getValue()).toBe('1');
    await (await input('probeSpacingCm')).setValue('1.59');
    await (await input('tipRadiusCm')).setValue('40');
    await (await input('calibratedOn')).setValue('2026-12-05');
    await (await input('calibratedOn')).blur();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    // 1.59 mm is 0.159 cm and 40 µm is 0.004 cm (1 cm = 10 mm = 10⁴ µm, SI).
    expect(api.updates[0]?.body).toMatchObject({
      probeSpacingCm: 0.159,
      tipRadiusCm: 0.004,
      calibratedOn: '2026-12-05',
    });
  });
});
