import { HttpEventType, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
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
  it('shows the caution for the material, previews each chosen file and marks problem rows', async () => {
    const { fixture, backend, input } = await setup();
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
    expect(text()).toContain('Ready to store');
    expect(text()).toContain('This file holds no readable table');
    expect(text()).toContain('Line 3, V:');
    const badRows = (fixture.nativeElement as HTMLElement).querySelectorAll('tr.bad');
    expect(badRows).toHaveLength(1);
    expect(badRows[0]!.textContent).toContain('is not a number');
  });

  it('sends the edited mapping, method and station and shows progress then the result', async () => {
    const { fixture, loader, backend, input } = await setup();
    choose(input, [new File(['T,V,I\n80,0.01,1'], 'ramp.csv')]);
    await fixture.whenStable();
    backend.expectOne('/api/wafers/7/sweeps/preview').flush({ ...PREVIEW, problems: [] });
    await fixture.whenStable();

    const method = await loader.getHarness(
      MatSelectHarness.with({ selector: '.settings mat-select' }),
    );
    expect(await method.getValueText()).toBe('Four-point probe (collinear)');
    const [, station] = await loader.getAllHarnesses(
      MatSelectHarness.with({ selector: '.settings mat-select' }),
    );
    await station!.open();
    await station!.clickOptions({ text: 'Cryo bench' });
    // Correct the voltage column's unit from V to mV.
    const unitSelects = await loader.getAllHarnesses(
      MatSelectHarness.with({ selector: '.mapping mat-select' }),
    );
    const voltageUnit = unitSelects[3]!;
    await voltageUnit.open();
    await voltageUnit.clickOptions({ text: 'mV' });

    await (await loader.getHarness(MatButtonHarness.with({ text: /Store 1 file/ }))).click();
    const store = backend.expectOne('/api/wafers/7/sweeps');
    const body = store.request.body as FormData;
    expect(body.get('method')).toBe('four-point');
    expect(body.get('stationId')).toBe('3');
    expect(JSON.parse(String(body.get('columns')))).toEqual([
      { index: 0, meaning: 'temperature', unit: 'K' },
      { index: 1, meaning: 'voltage', unit: 'mV' },
      { index: 2, meaning: 'current', unit: 'mA' },
    ]);
    expect(store.request.reportProgress).toBe(true);

    store.event({ type: HttpEventType.UploadProgress, loaded: 40, total: 100 });
    await fixture.whenStable();
    const bar = await loader.getHarness(
      MatProgressBarHarness.with({ selector: '.file mat-progress-bar' }),
    );
    expect(await bar.getValue()).toBe(40);

    store.flush(
      { id: 55, pointCount: 24, warnings: ['2 points flagged as jumps'] },
      { status: 201, statusText: 'Created' },
    );
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Stored: 24 points');
    expect(text).toContain('2 points flagged as jumps');
  });

  it('a refused store lists the rows the server names', async () => {
    const { fixture, loader, backend, input } = await setup();
    choose(input, [new File(['x'], 'bad.csv')]);
    await fixture.whenStable();
    backend.expectOne('/api/wafers/7/sweeps/preview').flush({ ...PREVIEW, problems: [] });
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
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Refused');
    expect(text).toContain('nothing was stored');
    expect(text).toContain('Line 14, I (mA):');
    expect(text).toContain('current must be above zero');
  });
});
