import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatInputHarness } from '@angular/material/input/testing';
import type { WaferDto } from '@rhotrace/api-types';
import { apiInterceptor } from '../../../core/http/api-interceptor';
import { WaferEditDialog, type WaferEditQuestion } from './wafer-edit-dialog';

const wafer = {
  id: 7,
  lotId: 2,
  lotCode: 'LV-X',
  number: '01',
  thicknessCm: 0.0524,
  state: 'measured',
  notes: null,
} as WaferDto;

function setUp(question: Partial<WaferEditQuestion> = {}) {
  const closed: Array<WaferDto | undefined> = [];
  TestBed.configureTestingModule({
    imports: [WaferEditDialog],
    providers: [
      provideHttpClient(withInterceptors([apiInterceptor])),
      provideHttpClientTesting(),
      {
        provide: MAT_DIALOG_DATA,
        useValue: { wafer, lotCode: 'LV-X', lotThicknessCm: 0.0525, ...question },
      },
      { provide: MatDialogRef, useValue: { close: (w?: WaferDto) => closed.push(w) } },
    ],
  });
  const fixture = TestBed.createComponent(WaferEditDialog);
  fixture.detectChanges();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const input = (name: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }));
  const save = () => {
    (fixture.nativeElement as HTMLElement)
      .querySelector<HTMLButtonElement>('[type=submit]')!
      .click();
    fixture.detectChanges();
  };
  return { fixture, input, save, closed, http: TestBed.inject(HttpTestingController) };
}

describe('WaferEditDialog', () => {
  it('shows the thickness in µm, sends it in cm and closes with the stored wafer', async () => {
    const { input, save, closed, http, fixture } = setUp();
    const thickness = await input('thicknessCm');
    expect(await thickness.getValue()).toBe('524');
    expect(fixture.nativeElement.textContent).toContain('nominal 525 µm');
    await thickness.setValue('480');
    await (await input('notes')).setValue('  edge chip at 3 o’clock  ');
    save();
    const req = http.expectOne('/api/wafers/7');
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({
      number: '01',
      thicknessCm: 0.048,
      notes: 'edge chip at 3 o’clock',
    });
    const stored = { ...wafer, thicknessCm: 0.048, notes: 'edge chip at 3 o’clock' };
    req.flush(stored);
    expect(closed).toEqual([stored]);
  });

  it('sends an emptied thickness as null (the lot nominal applies again)', async () => {
    const { input, save, http } = setUp();
    await (await input('thicknessCm')).setValue('');
    save();
    const req = http.expectOne('/api/wafers/7');
    expect(req.request.body.thicknessCm).toBeNull();
    req.flush(wafer);
  });

  it('keeps the dialog open and names the field when the number is taken in the lot', async () => {
    const { input, save, closed, http, fixture } = setUp();
    await (await input('number')).setValue('02');
    save();
    http.expectOne('/api/wafers/7').flush(
      {
        error: { code: 'conflict', message: 'Wafer 02 already exists in this lot', details: [] },
      },
      { status: 409, statusText: 'Conflict' },
    );
    fixture.detectChanges();
    expect(closed).toEqual([]);
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Wafer 02 already exists in this lot');
    expect(text).toContain('is already used in this lot');
  });

  it('does not send a negative thickness', async () => {
    const { input, save, closed, http, fixture } = setUp();
    await (await input('thicknessCm')).setValue('-5');
    save();
    http.expectNone('/api/wafers/7');
    expect(closed).toEqual([]);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Use a value above 0');
  });
});
