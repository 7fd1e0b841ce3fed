import { HttpEventType, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { SweepPreviewResponse } from '@rhotrace/api-types';
import { provideRouter } from '@angular/router';
import { apiInterceptor } from '../../../core/http/api-interceptor';
import { SweepUpload } from './sweep-upload';

const PREVIEW: SweepPreviewResponse = {
  delimiter: ',',
  decimalMark: '.',
  metadata: { operator: 'demo' },
  columns: [
    { index: 0, header: 'T (K)', meaning: 'temperature', unit: 'K', confidence: 1 },
    { index: 1, header: 'V', meaning: 'voltage', unit: 'V', confidence: 0.6 },
    { index: 2, header: 'I (mA)', meaning: 'current', unit: 'mA', confidence: 1 },
  ],
  rows: [
    { row: 2, cells: ['80', '0.012', '1'], values: [80, 0.012, 1] },
    { row: 3, cells: ['90', 'x', '1'], values: [90, null, 1] },
  ],
  rowCount: 2,
  problems: [{ row: 3, column: 'V', problem: 'is not a number', field: 'row 3, column V' }],
  suggestedMethod: 'four-point',
  method: 'four-point',
  stationId: null,
  geometry: null,
  blocking: [{ row: 3, column: 'V', problem: '"x" is not a number', field: 'row 3, column V' }],
  warnings: [],
  pointCount: null,
  metadataFindings: [],
  shape: 'a'.repeat(64),
  shapeLabel: '3 comma-separated columns: T (K), V, I (mA)',
  savedSettings: null,
};

/** The same file once nothing blocks it. */
const READY: SweepPreviewResponse = {
  ...PREVIEW,
  problems: [],
  blocking: [],
  pointCount: 2,
  geometry: {
    thicknessCm: 0.05,
    spacingCm: 0.1,
    sources: { thicknessCm: 'wafer', spacingCm: 'station' },
  },
};

async function setup() {
  TestBed.configureTestingModule({
    imports: [SweepUpload],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([apiInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const fixture = TestBed.createComponent(SweepUpload);
  fixture.componentRef.setInput('waferId', 7);
  fixture.componentRef.setInput('material', 'GaAs');
  fixture.componentRef.setInput('stations', [
    { id: 3, name: 'Cryo bench', probeSpacingCm: 0.1 } as never,
  ]);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const backend = TestBed.inject(HttpTestingController);
  const input = (fixture.nativeElement as HTMLElement).querySelector(
    'input[type=file]',
  ) as HTMLInputElement;
  return { fixture, loader, backend, input };
}

function choose(input: HTMLInputElement, files: File[]): void {
  const list = Object.assign([...files], {
    item: (i: number) => files[i] ?? null,
  }) as unknown as FileList;
  Object.defineProperty(input, 'files', { value: list, configurable: true });
  input.dispatchEvent(new Event('change'));
}

describe('SweepUpload', () => {
  it('opens the chooser on a click on the drop zone', async () => {
    const { fixture, input } = await setup();
    let opened = 0;
    input.addEventListener('click', () => opened++);
    const zone = (fixture.nativeElement as HTMLElement).querySelector(
      'ngx-dropzone',
    ) as HTMLElement;
    zone.querySelector('.drop-words')!.dispatchEvent(new MouseEvent('click', { bubbles: true }));
    expect(opened).toBe(1);
  });

  it('previews each file, marks what blocks it and keeps Store disabled', async () => {
    const { fixture, loader, backend, input } = await setup();
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text()).toContain('GaAs is toxic when broken or abraded');

    choose(input, [new File(['a'], 'one.csv'), new File(['b'], 'two.csv')]);
    await fixture.whenStable();
    const previews = backend.match('/api/wafers/7/sweeps/preview');
    expect(previews).toHaveLength(2);
    expect((previews[0]!.request.body as FormData).get('file')).toBeInstanceOf(File);
    previews[0]!.flush(PREVIEW);
    previews[1]!.flush(
      {
        error: { code: 'unprocessable', message: 'This file holds no readable table', details: [] },
      },
      { status: 422, statusText: 'Unprocessable' },
    );
    await fixture.whenStable();
    expect(text()).toContain('Needs attention');
    expect(text()).not.toContain('Ready to store');
    expect(text()).toContain('This file holds no readable table');
    expect(text()).toContain('Line 3, V:');
    const badRows = (fixture.nativeElement as HTMLElement).querySelectorAll('tr.bad');
    expect(badRows).toHaveLength(1);
    expect(badRows[0]!.textContent).toContain('is not a number');
    const store = await loader.getHarness(MatButtonHarness.with({ text: /Store 0 files/ }));
    expect(await store.isDisabled()).toBe(true);
  });

  it('states which temperature conversion the store will use, or why there is none yet', async () => {
    const { fixture, backend, input } = await setup();
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    choose(input, [new File(['a'], 'tc.csv'), new File(['b'], 'rtd.csv')]);
    await fixture.whenStable();
    const [tc, rtd] = backend.match('/api/wafers/7/sweeps/preview');
    const description =
      'type K thermocouple (file), ITS-90 reference function (NIST Monograph 175), cold junction at 23.40 °C (file metadata)';
    tc!.flush({ ...READY, temperature: { kind: 'thermocouple', description } });
    const note = '"T (ohm)" holds ohms: choose a station with a platinum RTD or a table';
    rtd!.flush({ ...PREVIEW, temperature: null, temperatureNote: note });
    await fixture.whenStable();
    expect(text()).toContain(`Temperatures: ${description}.`);
    expect(text()).toContain(`Temperatures cannot be converted yet: ${note}`);
  });

  // many harness steps: a loaded two-core machine needs more than the default 5 s
  it(
    'gives each file its own method, station and mapping, checked again after each change',
    { timeout: 30_000 },
    async () => {
      const { fixture, loader, backend, input } = await setup();
      choose(input, [new File(['T,V,I\n80,0.01,1'], 'ramp.csv'), new File(['x'], 'square.csv')]);
      await fixture.whenStable();
      const [first, second] = backend.match('/api/wafers/7/sweeps/preview');
      first!.flush(READY);
      second!.flush({ ...READY, suggestedMethod: 'van-der-pauw', method: 'van-der-pauw' });
      await fixture.whenStable();

      const methods = await loader.getAllHarnesses(
        MatSelectHarness.with({ selector: '.settings mat-select[required]' }),
      );
      expect(await methods[0]!.getValueText()).toBe('Four-point probe (collinear)');
      expect(await methods[1]!.getValueText()).toBe('Van der Pauw square');
      const [, station] = await loader.getAllHarnesses(
        MatSelectHarness.with({ selector: '.settings mat-select' }),
      );
      await station!.open();
      await station!.clickOptions({ text: 'Cryo bench' });
      const recheck = backend.expectOne('/api/wafers/7/sweeps/preview');
      expect((recheck.request.body as FormData).get('stationId')).toBe('3');
      recheck.flush({ ...READY, stationId: 3 });
      await fixture.whenStable();
      // Correct the first file's voltage unit from V to mV: checked again with the mapping.
      const units = await loader.getAllHarnesses(
        MatSelectHarness.with({ selector: '.unit-field mat-select' }),
      );
      await units[1]!.open();
      await units[1]!.clickOptions({ text: 'mV' });
      const mapped = backend.expectOne('/api/wafers/7/sweeps/preview');
      expect(JSON.parse(String((mapped.request.body as FormData).get('columns')))).toEqual([
        { index: 0, meaning: 'temperature', unit: 'K' },
        { index: 1, meaning: 'voltage', unit: 'mV' },
        { index: 2, meaning: 'current', unit: 'mA' },
      ]);
      mapped.flush({ ...READY, stationId: 3 });
      await fixture.whenStable();

      await (await loader.getHarness(MatButtonHarness.with({ text: /Store 2 files/ }))).click();
      const [ramp, square] = backend.match('/api/wafers/7/sweeps');
      const sent = (r: typeof ramp) => r!.request.body as FormData;
      expect(sent(ramp).get('method')).toBe('four-point');
      expect(sent(ramp).get('stationId')).toBe('3');
      expect(JSON.parse(String(sent(ramp).get('columns')))[1]).toEqual({
        index: 1,
        meaning: 'voltage',
        unit: 'mV',
      });
      expect(sent(square).get('method')).toBe('van-der-pauw');
      expect(sent(square).get('stationId')).toBeNull();
      expect(sent(square).get('columns')).toBeNull();
      expect(ramp!.request.reportProgress).toBe(true);

      ramp!.event({ type: HttpEventType.UploadProgress, loaded: 40, total: 100 });
      await fixture.whenStable();
      const bar = await loader.getHarness(
        MatProgressBarHarness.with({ selector: '.file mat-progress-bar' }),
      );
      expect(await bar.getValue()).toBe(40);
      ramp!.flush(
        { id: 55, pointCount: 24, warnings: ['2 points flagged as jumps'] },
        { status: 201, statusText: 'Created' },
      );
      square!.flush(
        { id: 56, pointCount: 2, warnings: [] },
        { status: 201, statusText: 'Created' },
      );
      await fixture.whenStable();
      const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
      expect(text).toContain('Stored: 24 points');
      expect(text).toContain('2 points flagged as jumps');
    },
  );

  it(
    'after a refusal the file is corrected in place and stored on the next try',
    { timeout: 30_000 },
    async () => {
      const { fixture, loader, backend, input } = await setup();
      choose(input, [new File(['x'], 'bad.csv')]);
      await fixture.whenStable();
      backend.expectOne('/api/wafers/7/sweeps/preview').flush(READY);
      await fixture.whenStable();
      await (await loader.getHarness(MatButtonHarness.with({ text: /Store 1 file/ }))).click();
      backend.expectOne('/api/wafers/7/sweeps').flush(
        {
          error: {
            code: 'validation_failed',
            message: 'The file has rows that cannot be stored; nothing was stored',
            details: [{ field: 'row 14, column I (mA)', problem: 'current must be above zero' }],
          },
        },
        { status: 400, statusText: 'Bad Request' },
      );
      await fixture.whenStable();
      const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
      expect(text()).toContain('Refused');
      expect(text()).toContain('nothing was stored');
      expect(text()).toContain('Line 14, I (mA):');

      const thickness = (fixture.nativeElement as HTMLElement).querySelector(
        '.geo input',
      ) as HTMLInputElement;
      // Typed in µm: 525 µm is 0.0525 cm as the API reads it (1 cm = 10⁴ µm, SI).
      thickness.value = '525';
      thickness.dispatchEvent(new Event('change'));
      const recheck = backend.expectOne('/api/wafers/7/sweeps/preview');
      expect((recheck.request.body as FormData).get('thicknessCm')).toBe('0.0525');
      recheck.flush(READY);
      await fixture.whenStable();
      await (await loader.getHarness(MatButtonHarness.with({ text: /Store 1 file/ }))).click();
      const retry = backend.expectOne('/api/wafers/7/sweeps');
      expect((retry.request.body as FormData).get('thicknessCm')).toBe('0.0525');
    },
  );

  it(
    "asks a file with site columns for the map's pattern and edge exclusion, and sends them",
    { timeout: 30_000 },
    async () => {
      const { fixture, loader, backend, input } = await setup();
      choose(input, [new File(['x'], 'map.csv')]);
      await fixture.whenStable();
      const mapFile: SweepPreviewResponse = {
        ...READY,
        suggestedMethod: 'resistivity',
        method: 'resistivity',
        columns: [
          { index: 0, header: 'site', meaning: 'site', unit: null, confidence: 0.5 },
          { index: 1, header: 'T (K)', meaning: 'temperature', unit: 'K', confidence: 1 },
          { index: 2, header: 'rho', meaning: 'resistivity', unit: 'ohm_cm', confidence: 1 },
        ],
      };
      backend.expectOne('/api/wafers/7/sweeps/preview').flush(mapFile);
      await fixture.whenStable();
      const host = fixture.nativeElement as HTMLElement;
      expect(host.querySelector('[aria-label="Wafer map of map.csv"]')).not.toBeNull();
      // an unsure guess is named in words beside the column
      expect(host.textContent).toContain('detection: low: choose by hand');

      const pattern = await loader.getHarness(
        MatSelectHarness.with({ selector: '[aria-label="Wafer map of map.csv"] mat-select' }),
      );
      await pattern.open();
      await pattern.clickOptions({ text: 'centre-5' });
      const picked = backend.expectOne('/api/wafers/7/sweeps/preview');
      expect((picked.request.body as FormData).get('sitePattern')).toBe('centre-5');
      picked.flush(mapFile);
      await fixture.whenStable();
      const edge = host.querySelector(
        '[aria-label="Wafer map of map.csv"] input',
      ) as HTMLInputElement;
      edge.value = '5';
      edge.dispatchEvent(new Event('change'));
      const edged = backend.expectOne('/api/wafers/7/sweeps/preview');
      expect((edged.request.body as FormData).get('edgeExclusionMm')).toBe('5');
      edged.flush(mapFile);
      await fixture.whenStable();

      await (await loader.getHarness(MatButtonHarness.with({ text: /Store 1 file/ }))).click();
      const stored = backend.expectOne('/api/wafers/7/sweeps').request.body as FormData;
      expect(stored.get('sitePattern')).toBe('centre-5');
      expect(stored.get('edgeExclusionMm')).toBe('5');
    },
  );

  it(
    'asks a Hall file for its Hall factor, states the assumption and sends the choice',
    { timeout: 30_000 },
    async () => {
      const { fixture, loader, backend, input } = await setup();
      choose(input, [new File(['x'], 'hall.csv')]);
      await fixture.whenStable();
      const hallFile: SweepPreviewResponse = { ...READY, suggestedMethod: 'hall', method: 'hall' };
      backend.expectOne('/api/wafers/7/sweeps/preview').flush(hallFile);
      await fixture.whenStable();
      const host = fixture.nativeElement as HTMLElement;
      const group = '[aria-label="Hall factor of hall.csv"]';
      const factor = await loader.getHarness(
        MatSelectHarness.with({ selector: `${group} mat-select` }),
      );
      // None chosen: the API's default, 1 (degenerate).
      expect(await factor.getValueText()).toBe('Degenerate or strong field (1.000)');
      expect(host.textContent).toContain('n = r_H / (q |R_H|)');
      // 3 pi / 8 = 1.178 (Blakemore 1962), from the physics library's constant.
      await factor.open();
      await factor.clickOptions({ text: 'Acoustic phonons, 3π/8 (1.178)' });
      const named = backend.expectOne('/api/wafers/7/sweeps/preview');
      expect((named.request.body as FormData).get('hallFactor')).toBe('acoustic-phonon');
      named.flush(hallFile);
      await fixture.whenStable();

      await factor.open();
      await factor.clickOptions({ text: 'Another value' });
      const typed = host.querySelector(`${group} input`) as HTMLInputElement;
      typed.value = '4';
      typed.dispatchEvent(new Event('change'));
      await fixture.whenStable();
      expect(host.textContent).toContain('r_H must be a number from 0.5 to 3');
      const unset = backend.expectOne('/api/wafers/7/sweeps/preview');
      expect((unset.request.body as FormData).get('hallFactor')).toBeNull();
      unset.flush(hallFile);
      typed.value = '1.25';
      typed.dispatchEvent(new Event('change'));
      backend.expectOne('/api/wafers/7/sweeps/preview').flush(hallFile);
      await fixture.whenStable();

      await (await loader.getHarness(MatButtonHarness.with({ text: /Store 1 file/ }))).click();
      const stored = backend.expectOne('/api/wafers/7/sweeps').request.body as FormData;
      expect(stored.get('method')).toBe('hall');
      expect(stored.get('hallFactor')).toBe('1.25');
    },
  );

  it("shows the header's disagreements and lets the user choose before storing", async () => {
    const { fixture, loader, backend, input } = await setup();
    choose(input, [new File(['x'], 'w03.csv')]);
    await fixture.whenStable();
    backend.expectOne('/api/wafers/7/sweeps/preview').flush({
      ...READY,
      metadataFindings: [
        {
          key: 'sampleName',
          label: 'Sample',
          fileText: 'DEMO-W03',
          recordText: 'wafer W01 of lot DEMO',
          agreement: 'disagrees',
          field: null,
          fileValue: null,
          using: 'record',
          sentence: '',
        },
        {
          key: 'thicknessCm',
          label: 'Thickness',
          fileText: '380 µm',
          recordText: '525 µm on the wafer',
          agreement: 'disagrees',
          field: 'thicknessCm',
          fileValue: 0.038,
          using: 'record',
          sentence: '',
        },
      ],
    });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Thickness 380 µm, but 525 µm on the wafer.');
    const storeButton = () => loader.getHarness(MatButtonHarness.with({ text: /^Store/ }));
    expect(await (await storeButton()).getText()).toBe('Store 0 files');

    const thickness = await loader.getHarness(MatRadioGroupHarness);
    await thickness.checkRadioButton({ label: /the file's 380 µm/ });
    const recheck = backend.expectOne('/api/wafers/7/sweeps/preview');
    expect((recheck.request.body as FormData).get('thicknessCm')).toBe('0.038');
    recheck.flush({ ...READY, metadataFindings: [] });
    await fixture.whenStable();
    expect(await (await storeButton()).getText()).toBe('Store 1 file');
  });

  it('asks for a confirmation when the header names another sample', async () => {
    const { fixture, loader, backend, input } = await setup();
    choose(input, [new File(['x'], 'w03.csv')]);
    await fixture.whenStable();
    const finding = {
      key: 'sampleName',
      label: 'Sample',
      fileText: 'DEMO-W03',
      recordText: 'wafer W01 of lot DEMO',
      agreement: 'disagrees' as const,
      field: null,
      fileValue: null,
      using: 'record' as const,
      sentence: '',
    };
    backend
      .expectOne('/api/wafers/7/sweeps/preview')
      .flush({ ...READY, metadataFindings: [finding] });
    await fixture.whenStable();
    const storeButton = () => loader.getHarness(MatButtonHarness.with({ text: /^Store/ }));
    expect(await (await storeButton()).isDisabled()).toBe(true);
    await (await loader.getHarness(MatCheckboxHarness)).check();
    expect(await (await storeButton()).getText()).toBe('Store 1 file');
    expect(await (await storeButton()).isDisabled()).toBe(false);
  });

  it("words the mapping in Rhotrace's sentences and lets the separator be changed", async () => {
    const { fixture, loader, backend, input } = await setup();
    choose(input, [new File(['x'], 'ramp.csv')]);
    await fixture.whenStable();
    backend.expectOne('/api/wafers/7/sweeps/preview').flush(READY);
    await fixture.whenStable();
    const text = () => (fixture.nativeElement as HTMLElement).textContent?.replace(/\s+/g, ' ');
    expect(text()).toContain(
      '2 readings; values are separated by commas and written with a decimal point (1.5).',
    );
    expect(text()).toContain('Column “T (K)”');
    const holds = await loader.getHarness(
      MatSelectHarness.with({ selector: '.cell-field mat-select' }),
    );
    expect(await holds.getValueText()).toBe('holds temperature');
    await holds.open();
    const options = await holds.getOptions();
    expect(await options.at(-1)!.getText()).toBe('is not used');
    await holds.close();

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Change' }))).click();
    const separator = await loader.getHarness(
      MatSelectHarness.with({ selector: '.layout-choice mat-select' }),
    );
    await separator.open();
    await separator.clickOptions({ text: 'semicolons' });
    const recheck = backend.expectOne('/api/wafers/7/sweeps/preview');
    expect((recheck.request.body as FormData).get('delimiter')).toBe(';');
    expect((recheck.request.body as FormData).get('columns')).toBeNull();
  });

  it('presets a file from the settings saved for its station and shape, and saves new ones', async () => {
    const { fixture, loader, backend, input } = await setup();
    choose(input, [new File(['x'], 'again.csv'), new File(['y'], 'new.csv')]);
    await fixture.whenStable();
    const [again, fresh] = backend.match('/api/wafers/7/sweeps/preview');
    const saved = {
      id: 4,
      stationId: 3,
      stationName: 'Cryo bench',
      shape: 'a'.repeat(64),
      shapeLabel: '3 comma-separated columns: T (K), V, I (mA)',
      method: 'bar' as const,
      columns: [{ index: 1, meaning: 'voltage' as const, unit: 'mV' }],
      geometry: { barLengthCm: 0.5, barWidthCm: 0.1 },
      layout: { decimalMark: ',' as const },
      savedById: 2,
      savedByName: 'Demo Engineer',
      updatedAt: '2026-11-30T10:00:00.000Z',
    };
    again!.flush({ ...READY, stationId: 3, savedSettings: saved });
    fresh!.flush({ ...READY, stationId: 3 });
    await fixture.whenStable();
    const recheck = backend.expectOne('/api/wafers/7/sweeps/preview');
    const sent = recheck.request.body as FormData;
    expect(sent.get('method')).toBe('bar');
    expect(sent.get('barLengthCm')).toBe('0.5');
    expect(sent.get('decimalMark')).toBe(',');
    expect(JSON.parse(String(sent.get('columns')))[1]).toEqual({
      index: 1,
      meaning: 'voltage',
      unit: 'mV',
    });
    recheck.flush({ ...READY, stationId: 3, savedSettings: saved });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent?.replace(/\s+/g, ' ');
    expect(text).toContain(
      'Preset from the settings saved for Cryo bench by Demo Engineer on 2026-11-30',
    );

    // the second file, not preset, is remembered as it was detected
    const remember = await loader.getAllHarnesses(
      MatButtonHarness.with({ text: 'Remember these settings for this station' }),
    );
    await remember[1]!.click();
    const put = backend.expectOne({ method: 'PUT', url: '/api/import-settings' });
    expect(put.request.body).toMatchObject({
      stationId: 3,
      shape: 'a'.repeat(64),
      method: 'four-point',
      columns: [
        { index: 0, meaning: 'temperature', unit: 'K' },
        { index: 1, meaning: 'voltage', unit: 'V' },
        { index: 2, meaning: 'current', unit: 'mA' },
      ],
    });
    put.flush({ ...saved, id: 5, method: 'four-point' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'the next file of this shape from it is preset the same way',
    );
  });
});
