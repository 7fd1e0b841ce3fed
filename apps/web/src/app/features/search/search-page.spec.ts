import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ActivatedRoute, convertToParamMap, provideRouter } from '@angular/router';
import type { SearchResponse } from '@rhotrace/api-types';
import { BehaviorSubject } from 'rxjs';
import { Session } from '../../core/auth/session';
import { SearchPage } from './search-page';

function setup(params: Record<string, string>, can: (c: string) => boolean) {
  const query = new BehaviorSubject(convertToParamMap(params));
  TestBed.configureTestingModule({
    imports: [SearchPage],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideRouter([]),
      { provide: ActivatedRoute, useValue: { queryParamMap: query } },
      { provide: Session, useValue: { can } },
    ],
  });
  const fixture = TestBed.createComponent(SearchPage);
  fixture.detectChanges();
  return { fixture, http: TestBed.inject(HttpTestingController), query };
}

const answer: SearchResponse = {
  q: 'W0',
  groups: [
    {
      kind: 'wafers',
      items: [{ kind: 'wafers', id: 4, title: 'W01', detail: 'lot L-7, measured', waferId: 4 }],
      total: 9,
      page: 1,
      pageSize: 5,
    },
    {
      kind: 'lots',
      items: [{ kind: 'lots', id: 7, title: 'L-7', detail: 'Si, P', waferId: null }],
      total: 1,
      page: 1,
      pageSize: 5,
    },
  ],
};

describe('SearchPage', () => {
  it('lists hits by kind, links each to its page and offers every item of a long group', async () => {
    const { fixture, http } = setup({ q: 'W0' }, () => true);
    http.expectOne((r) => r.url === '/api/search' && r.params.get('q') === 'W0').flush(answer);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const links = [...el.querySelectorAll('a')].map((a) => [
      a.textContent!.trim(),
      a.getAttribute('href'),
    ]);
    expect(links).toContainEqual(['W01', '/wafers/4']);
    expect(links).toContainEqual(['L-7', '/lots/7']);
    expect(links.find(([t]) => t === 'All 9 wafers')![1]).toBe('/?q=W0&kind=wafers');
    expect(el.textContent).toContain('Wafers (9)');
  });

  it('pages through one kind, and does not link lots for a reader without the lots page', async () => {
    const { fixture, http } = setup(
      { q: '', kind: 'lots', page: '2' },
      (c) => c !== 'records:see-all',
    );
    const req = http.expectOne((r) => r.url === '/api/search');
    expect(req.request.params.get('kind')).toBe('lots');
    expect(req.request.params.get('page')).toBe('2');
    req.flush({ q: '', groups: [answer.groups[1]!] });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('h1')!.textContent).toContain('All lots');
    expect([...el.querySelectorAll('a')].map((a) => a.textContent!.trim())).not.toContain('L-7');
    expect(el.querySelector('mat-paginator')).not.toBeNull();
  });
});
