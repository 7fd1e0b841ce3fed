import { HttpClient, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { type Observable, firstValueFrom } from 'rxjs';
import { OPENING_REQUEST_TTL_MS, OpeningRequest } from './opening-request';

describe('OpeningRequest', () => {
  let backend: HttpTestingController;
  let opening: OpeningRequest;
  let asked: string[];
  let otherwise: () => Observable<{ from: string }>;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    backend = TestBed.inject(HttpTestingController);
    opening = TestBed.inject(OpeningRequest);
    const http = TestBed.inject(HttpClient);
    asked = [];
    otherwise = () => {
      asked.push('again');
      return http.get<{ from: string }>('/api/sweeps/7/analysis');
    };
  });
  afterEach(() => backend.verify());

  it('hands the early answer to the page once, then the page asks as usual', async () => {
    opening.start('/api/sweeps/7/analysis');
    // Asked at once, before any page wants it.
    backend.expectOne('/api/sweeps/7/analysis').flush({ from: 'start' });
    const first = firstValueFrom(opening.take('/api/sweeps/7/analysis', otherwise));
    await expect(first).resolves.toEqual({ from: 'start' });
    expect(asked).toEqual([]);
    const second = firstValueFrom(opening.take('/api/sweeps/7/analysis', otherwise));
    backend.expectOne('/api/sweeps/7/analysis').flush({ from: 'page' });
    await expect(second).resolves.toEqual({ from: 'page' });
    expect(asked).toEqual(['again']);
  });

  it('waits for an answer still on its way', async () => {
    opening.start('/api/sweeps/7/analysis');
    const taken = firstValueFrom(opening.take('/api/sweeps/7/analysis', otherwise));
    backend.expectOne('/api/sweeps/7/analysis').flush({ from: 'start' });
    await expect(taken).resolves.toEqual({ from: 'start' });
    expect(asked).toEqual([]);
  });

  it('does not hand out a failed answer: the page asks again and sees the failure itself', async () => {
    opening.start('/api/sweeps/7/analysis');
    backend
      .expectOne('/api/sweeps/7/analysis')
      .flush({ error: { code: 'not_found' } }, { status: 404, statusText: 'Not Found' });
    const taken = firstValueFrom(opening.take('/api/sweeps/7/analysis', otherwise));
    backend.expectOne('/api/sweeps/7/analysis').flush({ from: 'page' });
    await expect(taken).resolves.toEqual({ from: 'page' });
    expect(asked).toEqual(['again']);
  });

  it('keeps nothing for another address, nor for long', async () => {
    opening.start('/api/sweeps/8/analysis');
    backend.expectOne('/api/sweeps/8/analysis').flush({ from: 'start' });
    const other = firstValueFrom(opening.take('/api/sweeps/7/analysis', otherwise));
    backend.expectOne('/api/sweeps/7/analysis').flush({ from: 'page' });
    await expect(other).resolves.toEqual({ from: 'page' });

    vi.useFakeTimers({ now: Date.now() });
    try {
      opening.start('/api/sweeps/7/analysis');
      backend.expectOne('/api/sweeps/7/analysis').flush({ from: 'start' });
      vi.advanceTimersByTime(OPENING_REQUEST_TTL_MS + 1);
      const stale = firstValueFrom(opening.take('/api/sweeps/7/analysis', otherwise));
      backend.expectOne('/api/sweeps/7/analysis').flush({ from: 'page' });
      await expect(stale).resolves.toEqual({ from: 'page' });
    } finally {
      vi.useRealTimers();
    }
  });
});
