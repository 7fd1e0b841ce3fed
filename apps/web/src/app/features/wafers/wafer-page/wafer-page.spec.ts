import { provideHttpClient } from '@angular/common/http';
import {
  HttpTestingController,
  provideHttpClientTesting,
  type TestRequest,
} from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { DopantDensityResponse } from '@rhotrace/api-types';
import { PlotlyLoader } from '../../../shared/plot/plotly-loader';
import { WaferPage } from './wafer-page';

const plotly = { react: async () => ({ on: () => undefined }), purge: () => undefined };

const dopant: DopantDensityResponse = {
  waferId: 7,
  resistivityAt23COhmCm: 9.87,
  dopant: 'B',
  dopantDensityCm3: 1.36e15,
  source: 'ASTM F723 (boron) from sweep 3, interpolated at 23 °C (nearest step 1.15 K away)',
  sweepId: 3,
  method: 'interpolated',
  distanceK: 1.15,
  inSpec: true,
  verdict: 'pass',
  specMinOhmCm: 8,
  specMaxOhmCm: 12,
  uncertaintyOhmCm: 0.54,
  coverageFactor: 2,
  uncertaintyBudget: [
    {
      source: 'thickness',
      standardUncertaintyOhmCm: 0.266,
      relative: 0.0269,
      distribution: 'rectangular',
      note: '±0.00250 cm on 0.0524 cm',
    },
  ],
  reason: null,
};

/** Answers each request the page makes by its URL. */
function answer(req: TestRequest): void {
  const url = req.request.url;
  if (url === '/api/wafers/7') {
    req.flush({
      id: 7,
      lotId: 2,
      lotCode: 'LV-X',
      number: '01',
      thicknessCm: 0.0524,
      state: 'measured',
      notes: null,
    });
  } else if (url === '/api/lots/2') {
    req.flush({
      id: 2,
      code: 'LV-X',
      material: 'Si',
      dopant: 'B',
      dopantType: 'p',
      specMinOhmCm: 8,
      specMaxOhmCm: 12,
    });
  } else if (url === '/api/wafers/7/sweeps') {
    req.flush({
      items: [
        { id: 3, originalName: 'w01.csv', method: 'four-point', pointCount: 1, flaggedPoints: 2 },
      ],
      total: 1,
    });
  } else if (url === '/api/sweeps/3') {
    req.flush({ id: 3, originalName: 'w01.csv', points: [] });
  } else if (url === '/api/wafers/7/dopant') {
    req.flush(dopant);
  } else {
    req.flush({ items: [], total: 0 });
  }
}

/**
 * Renders a wafer's page, handing each request (in waves: the lot after the wafer, the dopant
 * after the sweeps) to `respond`.
 */
async function renderWafer(id: string, respond: (req: TestRequest) => void) {
  TestBed.configureTestingModule({
    imports: [WaferPage],
    providers: [
      provideRouter([]),
      provideHttpClient(),
      provideHttpClientTesting(),
      { provide: PlotlyLoader, useValue: { load: () => Promise.resolve(plotly) } },
    ],
  });
  const fixture = TestBed.createComponent(WaferPage);
  fixture.componentRef.setInput('id', id);
  const backend = TestBed.inject(HttpTestingController);
  for (let wave = 0; wave < 6; wave += 1) {
    fixture.detectChanges();
    await new Promise((resolve) => setTimeout(resolve));
    for (const req of backend.match(() => true)) respond(req);
  }
  await fixture.whenStable();
  return fixture;
}

/** Wafer 7's page, its dopant request answered with `dopantAnswer`. */
const renderWafer7 = (dopantAnswer: object = dopant) =>
  renderWafer('7', (req) =>
    req.request.url === '/api/wafers/7/dopant' ? req.flush(dopantAnswer) : answer(req),
  );

describe('WaferPage', () => {
  it('shows the 23 °C value ± U, its verdict and the folded budget', async () => {
    const fixture = await renderWafer7();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const text = fixture.nativeElement.textContent as string;
    expect(text).toContain('9.87');
    expect(text).toContain('± 0.54');
    expect(text).toContain('meets spec');
    expect(text).toContain('interpolated between the steps either side');
    // the sweep list counts each sweep's flagged points
    expect(text).toMatch(/w01\.csv[\s\S]*\(2 flagged\)/);
    const panel = await loader.getHarness(MatExpansionPanelHarness);
    await panel.expand();
    const budget = await loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Uncertainty budget"]' }),
    );
    expect((await budget.getCellTextByColumnName())['source']?.text).toEqual(['Thickness']);
    expect(text).toMatch(/Dopant density\s*1\.36/);
  });

  it('states no dopant density where there is none (a metal film)', async () => {
    const fixture = await renderWafer7({ ...dopant, dopant: null, dopantDensityCm3: null });
    const text = fixture.nativeElement.textContent as string;
    expect(text).toContain('9.87');
    expect(text).not.toContain('Dopant density');
  });

  it('shows one "not available" page for a wafer hidden from the user, and asks for nothing else', async () => {
    const asked: string[] = [];
    const fixture = await renderWafer('13', (req) => {
      asked.push(req.request.url);
      if (req.request.url === '/api/wafers/13') {
        req.flush(
          { error: { code: 'not_found', message: 'Wafer 13 was not found' } },
          { status: 404, statusText: 'Not Found' },
        );
      } else answer(req);
    });
    const text = (fixture.nativeElement.textContent as string).replace(/\s+/g, ' ');
    expect(text).toContain('Not available to you');
    expect(text).toContain('Back to your bench');
    expect(text).not.toContain('Assignments');
    expect(asked.filter((u) => u.startsWith('/api/wafers/13/'))).toEqual([]);
  });
});
