import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, ReplaySubject, catchError, defer, take } from 'rxjs';
import { quietRequest } from './api-error';

/** How long a request started at bootstrap waits to be taken before it is dropped, ms. */
export const OPENING_REQUEST_TTL_MS = 10_000;

/**
 * The first GET of the page the app opens on (a link opened in a new tab, a reload), started
 * while the app is starting: it then runs while the page's code loads instead of after it.
 * The page takes it once, through `take`; one that failed, was taken already or waited too long
 * is not handed out, and the page asks again the usual way (so a failure is reported as always).
 */
@Injectable({ providedIn: 'root' })
export class OpeningRequest {
  private readonly http = inject(HttpClient);
  private pending: { url: string; startedAt: number; answer: ReplaySubject<unknown> } | null = null;

  /** Starts `GET url` now (quietly: a failure is reported by the page's own request). */
  start(url: string): void {
    const answer = new ReplaySubject<unknown>(1);
    this.pending = { url, startedAt: Date.now(), answer };
    this.http.get(url, { context: quietRequest() }).subscribe(answer);
  }

  /** The answer of the request started for `url`, once; otherwise what `otherwise` asks. */
  take<T>(url: string, otherwise: () => Observable<T>): Observable<T> {
    const started = this.pending;
    if (!started || started.url !== url) return otherwise();
    this.pending = null;
    if (Date.now() - started.startedAt > OPENING_REQUEST_TTL_MS) return otherwise();
    return (started.answer as Observable<T>).pipe(
      take(1),
      catchError(() => defer(otherwise)),
    );
  }
}
