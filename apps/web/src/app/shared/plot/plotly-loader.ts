import { Injectable } from '@angular/core';

type PlotlyModule = typeof import('plotly.js-dist-min');

/** How long to wait for an idle moment before loading anyway, ms. */
const IDLE_TIMEOUT_MS = 4000;

/**
 * Loads plotly once. It is a lazy chunk (too large for the initial bundle): a page that plots
 * asks for it, and `preloadWhenIdle` fetches and evaluates it in the browser's first idle time
 * after sign-in, so the first plot does not wait for it.
 */
@Injectable({ providedIn: 'root' })
export class PlotlyLoader {
  private pending: Promise<PlotlyModule> | null = null;
  private preloadScheduled = false;

  load(): Promise<PlotlyModule> {
    this.pending ??= import('plotly.js-dist-min').then(
      (m) => (m as unknown as { default?: PlotlyModule }).default ?? m,
    );
    return this.pending;
  }

  /**
   * Loads plotly when the browser is next idle (requestIdleCallback, or a timer where it is
   * missing); once per app. A failed preload is forgotten so a page's own load retries.
   */
  preloadWhenIdle(): void {
    if (this.preloadScheduled || this.pending) return;
    this.preloadScheduled = true;
    const run = () => this.preload();
    const idle = globalThis.requestIdleCallback;
    if (typeof idle === 'function') idle(run, { timeout: IDLE_TIMEOUT_MS });
    else globalThis.setTimeout(run, 1000);
  }

  /** Loads plotly now, for a page about to plot; a failure is forgotten (the page retries). */
  preload(): void {
    this.load().catch(() => {
      this.pending = null;
    });
  }
}
