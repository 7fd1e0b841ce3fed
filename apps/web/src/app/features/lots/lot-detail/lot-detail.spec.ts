import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { LotSummaryResponse, LotSummaryWafer, WaferDto } from '@rhotrace/api-types';
import { PlotlyLoader } from '../../../shared/plot/plotly-loader';
import { LotDetail } from './lot-detail';

/** Plotly stand-in: the chart is not what these tests read, and the real bundle is large. */
const plotly = { react: async () => ({ on: () => undefined }), purge: () => undefined };
const fakeLoader = { load: () => Promise.resolve(plotly) };

const wafer = (id: number, number: string): Partial<WaferDto> => ({
  id,
  lotId: 1,
  number,
  thicknessCm: 0.05,
  state: 'measured',
  notes: null,
});

const row = (
  id: number,
  number: string,
  value: number | null,
  verdict: LotSummaryWafer['verdict'],
): LotSummaryWafer => ({
  waferId: id,
  number,
  sweepId: value === null ? null : id * 10,
  resistivityAt23COhmCm: value,
  method: value === null ? null : 'interpolated',
  distanceK: value === null ? null : 1,
  pass: verdict === null ? null : verdict === 'pass',
  verdict,
  uncertaintyOhmCm: value === null ? null : 0.2,
  coverageFactor: value === null ? null : 2,
  uncertaintyBudget:
    value === null
      ? []
      : [
          {
            source: 'temperature-sensor',
            standardUncertaintyOhmCm: 0.1,
            relative: 0.1 / value,
            distribution: 'rectangular',
            note: '±0.42 K',
          },
        ],
  reason: value === null ? 'The wafer has no sweep' : null,
  activationEnergies: [],
});

const summary: LotSummaryResponse = {
  lot: { id: 1, code: 'LV-S', material: 'Si', dopant: 'P', specMinOhmCm: 8, specMaxOhmCm: 15 },
  wafers: [
    row(11, '01', 10, 'pass'),
    row(12, '02', 14.9, 'indeterminate'),
    row(13, '03', null, null),
  ],
  statistics: {
    count: 2,
    passCount: 1,
    failCount: 0,
    indeterminateCount: 1,
    meanOhmCm: 12.45,
    stdDevOhmCm: 3.46,
    minOhmCm: 10,
    maxOhmCm: 14.9,
    ppk: null,
    ppkLower95: null,
    ppkReason: 'Ppk needs at least 5 wafers with a value at 23 °C; there are 2',
    note: null,
    cpk: null,
    cpkReason: 'Cpk needs the within-wafer repeatability, which is not measured',
  },
};

describe('LotDetail', () => {
  async function setup(s: LotSummaryResponse) {
    TestBed.configureTestingModule({
      imports: [LotDetail],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: PlotlyLoader, useValue: fakeLoader },
      ],
    });
    const fixture = TestBed.createComponent(LotDetail);
    fixture.componentRef.setInput('id', '1');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const backend = TestBed.inject(HttpTestingController);
    // The requests are pending, so the fixture is not stable until they are answered.
    fixture.detectChanges();
    backend.expectOne('/api/lots/1').flush({ id: 1, code: 'LV-S', material: 'Si' });
    backend
      .expectOne((r) => r.url === '/api/lots/1/wafers')
      .flush({ items: [wafer(11, '01'), wafer(12, '02'), wafer(13, '03')], total: 3 });
    backend.expectOne('/api/lots/1/summary').flush(s);
    // The lot's wafer maps (none here) are asked for once the lot is shown.
    fixture.detectChanges();
    backend
      .match('/api/lots/1/maps')
      .forEach((r) => r.flush({ lotId: 1, scale: null, wafers: [] }));
    await fixture.whenStable();
    return { fixture, loader, text: () => fixture.nativeElement.textContent as string };
  }

  it('shows each wafer value ± U with its verdict, and counts the verdicts', async () => {
    const { loader, text } = await setup(summary);
    const table = await loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Wafers of this lot"]' }),
    );
    const cells = await table.getCellTextByColumnName();
    expect(cells['rho']?.text[0]).toMatch(/^10\s+± 0.2/);
    expect(cells['rho']?.text[0]).toContain('interpolated');
    expect(cells['verdict']?.text).toEqual([
      'meets spec',
      'too close to call',
      'The wafer has no sweep',
    ]);
    expect(text()).toContain('Too close to call');
    expect(text()).toContain('Ppk needs at least 5 wafers');
    expect(text()).toContain('Cpk is not given');
  });

  it('shows the Hall values at 300 K with units and uncertainties where a wafer has them', async () => {
    const { loader: plain } = await setup(summary);
    const before = await plain.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Wafers of this lot"]' }),
    );
    expect(Object.keys(await before.getCellTextByColumnName())).not.toContain('hall');
    TestBed.resetTestingModule();
    const hall = {
      sweepId: 110,
      carrierType: 'n' as const,
      carrierDensityAt300KCm3: 1.0954e15,
      hallMobilityAt300KCm2PerVs: 1412,
      hallFactor: 1.1781,
      carrierDensityAt300KUncertaintyCm3: 1.2247e13,
      hallMobilityAt300KUncertaintyCm2PerVs: null,
    };
    const withHall = {
      ...summary,
      wafers: [{ ...summary.wafers[0]!, hall }, ...summary.wafers.slice(1)],
    };
    const { loader, text } = await setup(withHall);
    const table = await loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Wafers of this lot"]' }),
    );
    const cells = await table.getCellTextByColumnName();
    expect(cells['hall']?.text[0]).toBe(
      'n-type · n = 1.095 × 10¹⁵ ± 1.2 × 10¹³ cm⁻³ · µ_H = 1412 cm²/(V s) (u not known) (r_H = 1.178)',
    );
    expect(cells['hall']?.text[1]).toBe('');
    expect(text()).toContain('one standard uncertainty (k = 1)');
  });

  it('unfolds one wafer budget under the table', async () => {
    const { loader } = await setup(summary);
    const buttons = await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Budget' }));
    expect(buttons).toHaveLength(2);
    await buttons[1]!.click();
    const panel = await loader.getHarness(MatExpansionPanelHarness);
    await panel.expand();
    const budget = await loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Uncertainty budget"]' }),
    );
    expect((await budget.getCellTextByColumnName())['source']?.text).toEqual([
      'Thermometer tolerance',
    ]);
  });

  it('gives Ppk with its lower bound and the small-sample note', async () => {
    const { text } = await setup({
      ...summary,
      statistics: {
        ...summary.statistics,
        ppk: 1.33,
        ppkLower95: 0.786,
        ppkReason: null,
        note: 'Only 10 wafers with a value at 23 °C (fewer than 25): Ppk is uncertain; read its lower bound',
      },
    });
    expect(text()).toContain('1.33');
    expect(text()).toContain('95 % lower bound 0.786');
    expect(text()).toContain('Only 10 wafers');
  });
});
