import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { LotDto } from '@rhotrace/api-types';
import { LotList } from './lot-list';

const lot = (id: number, code: string): Partial<LotDto> => ({
  id,
  code,
  material: 'Si',
  dopant: 'B',
  dopantType: 'p',
  specMinOhmCm: 8,
  specMaxOhmCm: 12,
  waferCount: 3,
  receivedOn: '2026-10-06',
  supplier: 'Invented Crystals',
});

describe('LotList', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [LotList],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
  });

  it('shows the lots the API pages out and asks again when sorted or filtered', async () => {
    const fixture = TestBed.createComponent(LotList);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const backend = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
    const first = backend.expectOne((r) => r.url === '/api/lots');
    expect(first.request.params.get('sort')).toBe('-receivedOn');
    first.flush({ items: [lot(1, 'LV-A'), lot(2, 'LV-B')], total: 2, page: 1, pageSize: 25 });
    await fixture.whenStable();

    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getCellTextByColumnName();
    expect(rows['code']?.text).toEqual(['LV-A', 'LV-B']);
    expect(rows['spec']?.text).toEqual(['8 – 12', '8 – 12']);

    const sort = await loader.getHarness(MatSortHarness);
    const [codeHeader] = await sort.getSortHeaders({ label: 'Lot' });
    await codeHeader!.click();
    await fixture.whenStable();
    const sorted = backend.expectOne((r) => r.url === '/api/lots');
    expect(sorted.request.params.get('sort')).toBe('code');
    sorted.flush({ items: [lot(1, 'LV-A')], total: 1, page: 1, pageSize: 25 });

    const material = await loader.getHarness(
      MatSelectHarness.with({ selector: '.filters mat-select' }),
    );
    await material.open();
    await material.clickOptions({ text: 'GaAs' });
    await fixture.whenStable();
    const filtered = backend.expectOne((r) => r.url === '/api/lots');
    expect(filtered.request.params.get('material')).toBe('GaAs');
    expect(filtered.request.params.get('page')).toBe('1');
    filtered.flush({ items: [], total: 0, page: 1, pageSize: 25 });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain(
      'No lot matches these filters.',
    );
    backend.verify();
  });
});
