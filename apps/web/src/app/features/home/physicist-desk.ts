import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { RouterLink } from '@angular/router';
import type { RecentFitDto } from '@rhotrace/api-types';
import { formatDay, parameterValueText } from '../../shared/format';
import { KIND_WORDS, PARAMETER_WORDS } from '../analysis/analysis-labels';
import { HomeApi } from './home-api';

/** A physicist's desk: the latest fits and the sweeps waiting to be studied. */
@Component({
  selector: 'rt-physicist-desk',
  imports: [RouterLink, MatProgressBarModule, MatSlideToggleModule],
  template: `
    <div class="rt-row">
      <h2 class="rt-section-title">Recent fits</h2>
      <span class="rt-spacer"></span>
      <mat-slide-toggle [checked]="mine()" (change)="mine.set($event.checked)"
        >Only my fits</mat-slide-toggle
      >
    </div>
    @if (fits.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading fits" />
    }
    @if ((fits.value() ?? []).length === 0 && !fits.isLoading()) {
      <p class="rt-muted">No fit saved yet.</p>
    }
    <ul class="cards" aria-label="Recent fits">
      @for (f of fits.value() ?? []; track f.id) {
        <li class="card">
          <a class="title" [routerLink]="['/sweeps', f.sweepId]"
            >{{ kind(f) }} · Lot {{ f.lotCode }} · Wafer {{ f.waferNumber }}</a
          >
          <span
            >{{ headline(f) }}
            @if (!f.converged) {
              <span class="rt-fail"> (did not converge)</span>
            }
          </span>
          @if (f.reading) {
            <span class="rt-muted">{{ f.reading }}</span>
          }
          <span class="rt-muted"
            >{{ f.sweepName }} · {{ day(f.createdAt) }} by {{ f.createdBy.name ?? 'someone' }}</span
          >
        </li>
      }
    </ul>
    <h2 class="rt-section-title">Sweeps to study</h2>
    @if (sweeps.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading sweeps" />
    }
    <ul class="cards" aria-label="Recent sweeps">
      @for (s of sweeps.value() ?? []; track s.id) {
        <li class="card">
          <a class="title" [routerLink]="['/sweeps', s.id]">{{ s.originalName }}</a>
          <span
            >Lot {{ s.lotCode }} · Wafer {{ s.waferNumber }} · {{ s.pointCount }} points ·
            {{ day(s.createdAt) }}</span
          >
        </li>
      }
    </ul>
    <a routerLink="/search" [queryParams]="{ kind: 'sweeps' }">Every sweep</a>
  `,
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhysicistDesk {
  private readonly api = inject(HomeApi);
  protected readonly day = formatDay;
  /** Only the signed-in physicist's own fits. */
  protected readonly mine = signal(false);
  protected readonly fits = rxResource({
    params: () => this.mine(),
    stream: ({ params }) => this.api.recentFits(8, params),
  });
  protected readonly sweeps = rxResource({ stream: () => this.api.recentSweeps(6) });

  protected kind(fit: RecentFitDto): string {
    return KIND_WORDS[fit.kind] ?? fit.kind;
  }

  protected headline(fit: RecentFitDto): string {
    const h = fit.headline;
    if (!h) return '';
    return `${PARAMETER_WORDS[h.parameter] ?? h.parameter}: ${parameterValueText(h.parameter, h.value, h.standardError || null)}`;
  }
}
