import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { CompareResponse } from '@rhotrace/api-types';
import { type Observable, Subject, of } from 'rxjs';
import { PlotlyLoader } from '../../shared/plot/plotly-loader';
import { Compare } from './compare';
import { CompareApi } from './compare-api';

const answerFor = (ids: number[]): CompareResponse => ({
  temperaturesK: [300, 400],
  curves: ids.map((id) => ({
    sweepId: id,
    waferId: 1,
    waferNumber: '01',
    lotId: 1,
    lotCode: 'L-1',
    material: 'Si',
    minTemperatureK: 300,
    maxTemperatureK: 400,
    resistivityOhmCm: [1, 2],
  })),
});

/** Settles signals, the view and the router, without waiting for requests still open. */
async function settle(fixture: { detectChanges(): void }): Promise<void> {
  TestBed.tick();
  await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
}

/** The overlay page over a stand-in API whose `compare` answers as given, sweeps 4 and 9 asked. */
async function mountCompare(compare: (ids: number[]) => Observable<CompareResponse>) {
  TestBed.configureTestingModule({
    imports: [Compare],
    providers: [
      provideRouter([]),
      { provide: PlotlyLoader, useValue: { load: () => new Promise(() => undefined) } },
      {
        provide: CompareApi,
        useValue: { lots: () => of([]), sweepsOfLots: () => of([]), compare },
      },
    ],
  });
  const fixture = TestBed.createComponent(Compare);
  fixture.componentRef.setInput('sweeps', '4,9');
  await settle(fixture);
  return fixture;
}

describe('Compare (overlay)', () => {
  it('keeps the plot while the next curves load, and carries the sweeps in the address', async () => {
    const calls: Array<{ ids: number[]; answer: Subject<CompareResponse> }> = [];
    const fixture = await mountCompare((ids) => {
      const answer = new Subject<CompareResponse>();
      calls.push({ ids, answer });
      return answer;
    });
    expect(calls[0]?.ids).toEqual([4, 9]);
    calls[0]!.answer.next(answerFor([4, 9]));
    await settle(fixture);
    const el = fixture.nativeElement as HTMLElement;
    const plotBefore = el.querySelector('rt-plot');
    expect(plotBefore).not.toBeNull();
    expect(TestBed.inject(Router).url).toContain('sweeps=4,9');

    // A tick while loading keeps the same plot element (no teardown racing plotly).
    fixture.componentInstance['toggle'](12, true);
    await settle(fixture);
    expect(el.querySelector('rt-plot')).toBe(plotBefore);
    expect(TestBed.inject(Router).url).toContain('sweeps=4,9,12');
  });

  it('lists the Hall sweeps drawn with their values at 300 K, units and uncertainties', async () => {
    const answer = answerFor([4, 9]);
    answer.curves[1]!.hall = {
      sweepId: 9,
      carrierType: 'p',
      carrierDensityAt300KCm3: 2.5e16,
      hallMobilityAt300KCm2PerVs: 310,
      hallFactor: 1,
      carrierDensityAt300KUncertaintyCm3: 4e14,
      hallMobilityAt300KUncertaintyCm2PerVs: 6.2,
    };
    const fixture = await mountCompare(() => of(answer));
    const list = (fixture.nativeElement as HTMLElement).querySelector(
      '[aria-label="Hall sweeps at 300 K"]',
    );
    const items = [...(list?.querySelectorAll('li') ?? [])].map((li) =>
      li.textContent!.replace(/\s+/g, ' ').trim(),
    );
    expect(items).toEqual([
      'L-1 · Wafer 01: p-type · n = 2.500 × 10¹⁶ ± 4.0 × 10¹⁴ cm⁻³ · µ_H = 310 ± 6.2 cm²/(V s) (r_H = 1)',
    ]);
  });
});
