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
import { LotForm } from './lot-form';

async function setup() {
  TestBed.configureTestingModule({
    imports: [LotForm],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([apiInterceptor])),
      provideHttpClientTesting(),
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
    ).setValue('0.05');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();

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
    await tolerance.setValue('0.0025');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Register' }))).click();
    const req = backend.expectOne({ method: 'POST', url: '/api/lots' });
    expect(req.request.body).toMatchObject({ code: 'LV-T-3', thicknessToleranceCm: 0.0025 });
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
