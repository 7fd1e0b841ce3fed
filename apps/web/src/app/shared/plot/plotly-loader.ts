import { Injectable } from '@angular/core';

type PlotlyModule = typeof import('plotly.js-dist-min');

/** Loads plotly once, on the first page that plots (it is too large for the initial bundle). */
@Injectable({ providedIn: 'root' })
export class PlotlyLoader {
  private pending: Promise<PlotlyModule> | null = null;

  load(): Promise<PlotlyModule> {
    this.pending ??= import('plotly.js-dist-min').then(
      (m) => (m as unknown as { default?: PlotlyModule }).default ?? m,
    );
    return this.pending;
  }
}
