import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { provideRouter } from '@angular/router';
import type { RecentFitDto, RecentSweepDto } from '@rhotrace/api-types';
import { PhysicistDesk } from './physicist-desk';

const fit = (id: number, by: string): RecentFitDto => ({
  id,
  kind: 'arrhenius',
  sweepId: 3,
  sweepName: 'P021-01_hot_25-425C.csv',
  waferId: 5,
  // as the user typed it: shown the same, never with a prefix of the screen's own
  waferNumber: 'W01',
  lotId: 2,
  lotCode: 'LV-26-P021',
  headline: { parameter: 'activationEnergyEv', value: 0.5729, standardError: 0.0029 },
  windowMinK: 600,
  windowMaxK: 700,
  converged: true,
  reading: 'Intrinsic range.',
  createdBy: { id: 4, name: by },
  createdAt: '2026-12-01T10:00:00.000Z',
});

const sweep: RecentSweepDto = {
  id: 3,
  waferId: 5,
  waferNumber: '01',
  lotId: 2,
  lotCode: 'LV-26-P021',
  material: 'Si',
  method: 'four-point',
  originalName: 'P021-01_hot_25-425C.csv',
  pointCount: 81,
  minTemperatureK: 298,
  maxTemperatureK: 698,
  uploadedBy: { id: 3, name: 'Priya' },
  createdAt: '2026-12-01T09:00:00.000Z',
};

describe('PhysicistDesk', () => {
  it('lists recent fits and sweeps from one request each, and asks for only mine when toggled', async () => {
    TestBed.configureTestingModule({
      imports: [PhysicistDesk],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(PhysicistDesk);
    fixture.detectChanges();
    http
      .expectOne((r) => r.url === '/api/fits/recent' && r.params.get('mine') === 'false')
      .flush({ items: [fit(1, 'Oskar'), fit(2, 'Ada')] });
    http
      .expectOne((r) => r.url === '/api/sweeps/recent' && r.params.get('limit') === '6')
      .flush({ items: [sweep] });
    http.verify();
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Arrhenius window · Lot LV-26-P021 · Wafer W01');
    expect(text).not.toContain('WW01');
    expect(text).toContain('Activation energy (eV): 0.5729 ± 0.0029');
    expect(text).toContain('81 points');

    const toggle = await TestbedHarnessEnvironment.loader(fixture).getHarness(
      MatSlideToggleHarness.with({ label: 'Only my fits' }),
    );
    // The harness waits for the app to settle, which includes the request the toggle starts.
    const toggled = toggle.toggle();
    let mine = http.match((r) => r.url === '/api/fits/recent' && r.params.get('mine') === 'true');
    for (let i = 0; i < 50 && mine.length === 0; i++) {
      await new Promise((resolve) => setTimeout(resolve, 10));
      mine = http.match((r) => r.url === '/api/fits/recent' && r.params.get('mine') === 'true');
    }
    expect(mine).toHaveLength(1);
    mine[0]!.flush({ items: [fit(1, 'Oskar')] });
    await toggled;
    http.verify();
    await fixture.whenStable();
    expect(
      (fixture.nativeElement as HTMLElement).querySelectorAll('[aria-label="Recent fits"] li'),
    ).toHaveLength(1);
  });

  it('links its six recent sweeps to every sweep the reader may see', async () => {
    TestBed.configureTestingModule({
      imports: [PhysicistDesk],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(PhysicistDesk);
    fixture.detectChanges();
    http.expectOne((r) => r.url === '/api/fits/recent').flush({ items: [] });
    http
      .expectOne((r) => r.url === '/api/sweeps/recent')
      .flush({ items: Array.from({ length: 6 }, (_, i) => ({ ...sweep, id: i + 1 })) });
    await fixture.whenStable();
    const links = [...(fixture.nativeElement as HTMLElement).querySelectorAll('a')];
    const every = links.find((a) => a.textContent?.trim() === 'Every sweep');
    expect(every?.getAttribute('href')).toBe('/search?kind=sweeps');
  });
});
