import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router, provideRouter } from '@angular/router';
import { apiInterceptor } from '../../../core/http/api-interceptor';
import { provideIsoDateAdapter } from '../../../shared/iso-date';
import { LotForm } from './lot-form';

async function setup() {
  TestBed.configureTestingModule({
    imports: [LotForm],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([apiInterceptor])),
      provideHttpClientTesting(),
      provideIsoDateAdapter(),
    ],
  });
  const fixture = TestBed.createComponent(LotForm);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  await fixture.whenStable();
  return { fixture, loader, backend: TestBed.inject(HttpTestingController) };
}

const field = (loader: Awaited<ReturnType<typeof setup>>['loader'], label: string) =>
  loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));

describe('LotForm', () => {
  it('refuses to send a lot without a code and says so by the field', async () => {
    const { loader, backend } = await setup();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    const code = await field(loader, 'Lot code');
    expect(await code.getTextErrors()).toEqual(['This is needed.']);
    backend.expectNone('/api/lots');
  });

  it('flags an inverted spec range before sending', async () => {
    const { loader, backend, fixture } = await setup();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=code]' }))
    ).setValue('LV-T-1');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=specMinOhmCm]' }))
    ).setValue('12');
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=specMaxOhmCm]' }))
    ).setValue('8');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'The lower spec limit is above the upper one.',
    );
    backend.expectNone('/api/lots');
  });

  it('sends the lot and shows server problems against their fields', async () => {
    const { loader, backend, fixture } = await setup();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=code]' }))
    ).setValue('LV-T-2');
    const material = await loader.getHarness(
      MatSelectHarness.with({ selector: '[formControlName=material]' }),
    );
    await material.open();
    await material.clickOptions({ text: 'GaAs' });
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=thicknessCm]' }))
    ).setValue('500');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();

    // 500 µm typed is 0.05 cm stored (1 cm = 10⁴ µm, SI).
    const req = backend.expectOne({ method: 'POST', url: '/api/lots' });
    expect(req.request.body).toMatchObject({
      code: 'LV-T-2',
      material: 'GaAs',
      thicknessCm: 0.05,
      dopant: null,
    });
    req.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need a look',
          details: [{ field: 'body.thicknessCm', problem: 'must be at most 0.02' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const thickness = await field(loader, 'Nominal thickness');
    expect(await thickness.getTextErrors()).toEqual(['The server says this must be at most 0.02.']);
  });

  it('sends the thickness tolerance the uncertainty budget reads', async () => {
    const { loader, backend } = await setup();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=code]' }))
    ).setValue('LV-T-3');
    const tolerance = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=thicknessToleranceCm]' }),
    );
    await tolerance.setValue('-0.001');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    backend.expectNone('/api/lots');
    expect(await (await field(loader, 'Thickness tolerance ±')).getTextErrors()).toEqual([
      'Use 0 or more.',
    ]);
    await tolerance.setValue('2000');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    backend.expectNone('/api/lots');
    expect(await (await field(loader, 'Thickness tolerance ±')).getTextErrors()).toEqual([
      'Use 1000 µm or less.',
    ]);
    await tolerance.setValue('25');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    // 25 µm is 0.0025 cm (1 cm = 10⁴ µm, SI).
    const req = backend.expectOne({ method: 'POST', url: '/api/lots' });
    expect(req.request.body).toMatchObject({ code: 'LV-T-3', thicknessToleranceCm: 0.0025 });
  });

  it('takes lengths in the units a lab writes and shows a stored lot back in them', async () => {
    TestBed.configureTestingModule({
      imports: [LotForm],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        provideIsoDateAdapter(),
      ],
    });
    const fixture = TestBed.createComponent(LotForm);
    fixture.componentRef.setInput('id', '7');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/lots/7')
      .flush({ id: 7, code: 'LV-7', material: 'Si', diameterCm: 15, thicknessCm: 0.0525 });
    await fixture.whenStable();
    const value = async (name: string) =>
      (
        await loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }))
      ).getValue();
    // 15 cm is 150 mm, 0.0525 cm is 525 µm (SI prefixes), with the unit beside each field.
    expect(await value('diameterCm')).toBe('150');
    expect(await value('thicknessCm')).toBe('525');
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('µm');
    expect(text).toContain('mm');
  });

  it('takes the received day as YYYY-MM-DD and refuses a day written another way', async () => {
    const { loader, backend, fixture } = await setup();
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=code]' }))
    ).setValue('LV-T-4');
    const received = await loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName=receivedOn]' }),
    );
    await received.setValue('12/05/2026');
    await received.blur();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    backend.expectNone('/api/lots');
    expect(await (await field(loader, 'Received on')).getTextErrors()).toEqual([
      'Write the date as YYYY-MM-DD, e.g. 2026-12-05 ("12/05/2026" is not).',
    ]);
    await received.setValue('2026-12-05');
    await received.blur();
    await fixture.whenStable();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    const req = backend.expectOne({ method: 'POST', url: '/api/lots' });
    expect(req.request.body).toMatchObject({ code: 'LV-T-4', receivedOn: '2026-12-05' });
    // The field shows the day back in the same form once read.
    expect(await received.getValue()).toBe('2026-12-05');
  });

  it('goes to the new lot when the server accepts it', async () => {
    const { loader, backend } = await setup();
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=code]' }))
    ).setValue('LV-T-3');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    backend
      .expectOne('/api/lots')
      .flush({ id: 41, code: 'LV-T-3' }, { status: 201, statusText: 'Created' });
    expect(navigate).toHaveBeenCalledWith(['/lots', 41]);
  });
});
