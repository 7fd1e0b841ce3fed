import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { SweepSummaryDto } from '@rhotrace/api-types';
import { PlotlyLoader } from '../../../shared/plot/plotly-loader';
import { analysisOf } from '../../analysis/testing/study-fakes';
import { SweepPoints, WHOLE_SWEEP_POINT_LIMIT } from './sweep-points';

const drawn: Array<{ data: Array<Record<string, unknown>> }> = [];
const plotly = {
  react: async (_el: unknown, data: Array<Record<string, unknown>>) => {
    drawn.push({ data });
    return { on: () => undefined };
  },
  purge: () => undefined,
};

async function mount(pointCount: number) {
  drawn.length = 0;
  TestBed.configureTestingModule({
    imports: [SweepPoints],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      { provide: PlotlyLoader, useValue: { load: () => Promise.resolve(plotly) } },
    ],
  });
  const fixture = TestBed.createComponent(SweepPoints);
  const summary = { id: 7, originalName: 'long-log.csv', pointCount } as SweepSummaryDto;
  fixture.componentRef.setInput('summary', summary);
  fixture.detectChanges();
  return { fixture, http: TestBed.inject(HttpTestingController) };
}

const settle = async (fixture: { detectChanges(): void; whenStable(): Promise<unknown> }) => {
  fixture.detectChanges();
  await fixture.whenStable();
  fixture.detectChanges();
};

describe('SweepPoints', () => {
  it('reads a sweep of up to 20,000 points whole: its plot and its first stored points', async () => {
    const { fixture, http } = await mount(3);
    const points = [300, 310, 320].map((t, i) => ({
      sequence: i + 1,
      temperatureK: t,
      currentA: 1e-3,
      voltageV: 0.01,
      resistivityOhmCm: 2 + i,
      flags: [],
    }));
    http.expectOne('/api/sweeps/7').flush({ id: 7, originalName: 'long-log.csv', points });
    http.expectNone('/api/sweeps/7/analysis');
    await settle(fixture);
    const root = fixture.nativeElement as HTMLElement;
    expect(root.querySelectorAll('table[aria-label="Stored points"] tbody tr')).toHaveLength(3);
    expect(root.textContent).toContain('Points of long-log.csv (3)');
  });

  it('plots the step means of a longer sweep and never asks for its points', async () => {
    const { fixture, http } = await mount(WHOLE_SWEEP_POINT_LIMIT + 1);
    http.expectNone('/api/sweeps/7');
    const analysis = analysisOf();
    http.expectOne('/api/sweeps/7/analysis').flush(analysis);
    await settle(fixture);
    await new Promise((r) => setTimeout(r, 50));
    await settle(fixture);
    const root = fixture.nativeElement as HTMLElement;
    expect(root.textContent?.replace(/\s+/g, ' ')).toContain(
      'the plot shows the mean of each of the 4 temperature steps',
    );
    expect(root.querySelector('table[aria-label="Stored points"]')).toBeNull();
    await expect.poll(() => drawn.length).toBeGreaterThan(0);
    expect(drawn.at(-1)!.data[0]).toMatchObject({
      name: 'step mean of ρ',
      x: analysis.steps.map((s) => s.temperatureK),
    });
  });
});
