import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import type { AuditEventDto } from '@rhotrace/api-types';
import { RecordHistory } from './record-history';

const event = (id: number, changes: AuditEventDto['changes']): AuditEventDto => ({
  id,
  actorId: 4,
  actorEmail: 'eve@lab.example',
  action: 'update',
  entity: 'wafer',
  entityId: '14',
  before: { waferId: 14 },
  after: { waferId: 14 },
  requestId: null,
  recordName: 'wafer W03 of lot L-7',
  changes,
  createdAt: '2026-12-05T06:40:00.000Z',
});

describe('RecordHistory', () => {
  it('reads the history when opened and shows each change in words, a page at a time', async () => {
    TestBed.configureTestingModule({
      imports: [RecordHistory],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    const fixture = TestBed.createComponent(RecordHistory);
    fixture.componentRef.setInput('record', 'wafers');
    fixture.componentRef.setInput('recordId', 14);
    await fixture.whenStable();
    const http = TestBed.inject(HttpTestingController);
    http.expectNone('/api/wafers/14/history'); // nothing read while closed

    // Opened by a click on its header (a harness would wait for the request it starts).
    const header = (fixture.nativeElement as HTMLElement).querySelector<HTMLElement>(
      'mat-expansion-panel-header',
    )!;
    header.click();
    fixture.detectChanges();
    http
      .expectOne((r) => r.url === '/api/wafers/14/history' && r.params.get('page') === '1')
      .flush({
        items: [
          event(9, [
            { field: 'thicknessCm', label: 'Thickness', before: '525 µm', after: '380 µm' },
          ]),
        ],
        total: 21,
        page: 1,
        pageSize: 20,
      });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('eve@lab.example changed wafer W03 of lot L-7');
    expect(text).toContain('Thickness: 525 µm → 380 µm');
    expect(text).toContain('2026-12-05 06:40 UTC');
    expect(text).not.toContain('waferId');
    expect(text).toContain('1–1 of 21');

    const older = [...(fixture.nativeElement as HTMLElement).querySelectorAll('button')].find((b) =>
      b.textContent?.includes('Older changes'),
    )!;
    older.click();
    fixture.detectChanges();
    http
      .expectOne((r) => r.url === '/api/wafers/14/history' && r.params.get('page') === '2')
      .flush({ items: [event(1, [])], total: 21, page: 2, pageSize: 20 });
    http.verify();
  });
});
