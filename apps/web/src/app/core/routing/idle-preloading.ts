import { Injectable, inject } from '@angular/core';
import type { Capability } from '@rhotrace/api-types';
import { type PreloadingStrategy, type Route } from '@angular/router';
import { Observable, of, switchMap } from 'rxjs';
import { Session } from '../auth/session';

/** How long to wait for an idle moment before preloading anyway, ms. */
const IDLE_TIMEOUT_MS = 4000;

/**
 * Preloads, in the browser's first idle time, the lazy routes marked
 * `data: { preloadFor: capability }` when the signed-in user has that capability: the code of a
 * page a role opens most (the sweep study) is then fetched before it is opened, and the browser
 * keeps it for a reload or a link opened in a new tab, instead of loading its chunks one level
 * after another when the page is asked for. Other lazy routes load when opened.
 */
@Injectable({ providedIn: 'root' })
export class IdlePreloading implements PreloadingStrategy {
  private readonly session = inject(Session);

  preload(route: Route, load: () => Observable<unknown>): Observable<unknown> {
    const capability = route.data?.['preloadFor'] as Capability | undefined;
    if (!capability || !this.session.can(capability)) return of(null);
    return whenIdle().pipe(switchMap(() => load()));
  }
}

function whenIdle(): Observable<void> {
  return new Observable<void>((subscriber) => {
    const done = () => {
      subscriber.next();
      subscriber.complete();
    };
    const idle = globalThis.requestIdleCallback;
    if (typeof idle === 'function') {
      const handle = idle(done, { timeout: IDLE_TIMEOUT_MS });
      return () => globalThis.cancelIdleCallback?.(handle);
    }
    const timer = globalThis.setTimeout(done, 1000);
    return () => globalThis.clearTimeout(timer);
  });
}
