import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { FitDto } from '@rhotrace/api-types';
import { formatDay, formatValue } from '../../shared/format';
import { KIND_WORDS, PARAMETER_WORDS } from '../analysis/sweep-study/fit-card';
import { HomeApi } from './home-api';

/** A physicist's desk: the latest fits and the sweeps waiting to be studied. */
@Component({
  selector: 'rt-physicist-desk',
  imports: [RouterLink, MatProgressBarModule],
  template: `
    <h2 class="rt-section-title">Recent fits</h2>
    @if (fits.isLoading()) { <mat-progress-bar mode="indeterminate" aria-label="Loading fits" /> }
    @if ((fits.value() ?? []).length === 0 && !fits.isLoading()) { <p class="rt-muted">No fit saved yet.</p> }
    <ul class="cards" aria-label="Recent fits">
      @for (r of fits.value() ?? []; track r.fit.id) {
        <li class="card">
          <a class="title" [routerLink]="['/sweeps', r.sweep.id]">{{ kind(r.fit) }} · W{{ r.wafer.number }}</a>
          <span>{{ headline(r.fit) }}</span>
          <span class="rt-muted">{{ r.fit.reading }}</span>
          <span class="rt-muted">{{ day(r.fit.createdAt) }} by {{ r.fit.createdBy.name ?? 'someone' }}</span>
        </li>
      }
    </ul>
    <h2 class="rt-section-title">Sweeps to study</h2>
    <ul class="cards" aria-label="Recent sweeps">
      @for (s of sweeps.value() ?? []; track s.sweep.id) {
        <li class="card">
          <a class="title" [routerLink]="['/sweeps', s.sweep.id]">{{ s.sweep.originalName }}</a>
          <span>W{{ s.wafer.number }} · {{ s.sweep.pointCount }} points · {{ day(s.sweep.createdAt) }}</span>
        </li>
      }
    </ul>
  `,
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhysicistDesk {
  private readonly api = inject(HomeApi);
  protected readonly day = formatDay;
  protected readonly fits = rxResource({ stream: () => this.api.recentFits() });
  protected readonly sweeps = rxResource({ stream: () => this.api.recentSweeps(6) });

  protected kind(fit: FitDto): string {
    return KIND_WORDS[fit.kind] ?? fit.kind;
  }

  protected headline(fit: FitDto): string {
    const [key, value] = Object.entries(fit.parameters)[0] ?? [];
    if (key === undefined || value === undefined) return '';
    const se = fit.standardErrors[key];
    return `${PARAMETER_WORDS[key] ?? key}: ${formatValue(value)}${se ? ' ± ' + formatValue(se, 2) : ''}`;
  }
}
