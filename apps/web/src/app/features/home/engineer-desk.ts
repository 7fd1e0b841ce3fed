import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { formatDay } from '../../shared/format';
import { FormatValuePipe } from '../../shared/format-value';
import { HomeApi } from './home-api';

/** An engineer's desk: recent uploads and wafers out of spec. */
@Component({
  selector: 'rt-engineer-desk',
  imports: [RouterLink, FormatValuePipe, MatProgressBarModule],
  template: `
    <h2 class="rt-section-title">Out of spec</h2>
    @if (outOfSpec.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Checking specs" />
    }
    @if ((outOfSpec.value() ?? []).length === 0 && !outOfSpec.isLoading()) {
      <p class="rt-muted">Every measured wafer of the recent lots is in spec.</p>
    }
    <ul class="cards" aria-label="Wafers out of spec">
      @for (o of outOfSpec.value() ?? []; track o.wafer.waferId) {
        <li class="card overdue">
          <a class="title" [routerLink]="['/wafers', o.wafer.waferId]"
            >Lot {{ o.lot.code }} · Wafer {{ o.wafer.number }}</a
          >
          <span
            >ρ at 23 °C {{ o.wafer.resistivityAt23COhmCm | value }} Ω·cm; spec
            {{ o.lot.specMinOhmCm | value }}–{{ o.lot.specMaxOhmCm | value }}</span
          >
        </li>
      }
    </ul>
    <h2 class="rt-section-title">Recent uploads</h2>
    @if (recent.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading uploads" />
    }
    @if ((recent.value() ?? []).length === 0 && !recent.isLoading()) {
      <p class="rt-muted">No sweep uploaded yet.</p>
    }
    <ul class="cards" aria-label="Recent uploads">
      @for (s of recent.value() ?? []; track s.id) {
        <li class="card">
          <a class="title" [routerLink]="['/wafers', s.waferId]"
            >Lot {{ s.lotCode }} · Wafer {{ s.waferNumber }}</a
          >
          <span>{{ s.originalName }} · {{ s.pointCount }} points</span>
          <span class="rt-muted"
            >{{ day(s.createdAt) }} by {{ s.uploadedBy.name ?? 'someone' }}</span
          >
          <a [routerLink]="['/sweeps', s.id]">Study this sweep</a>
        </li>
      }
    </ul>
    <a routerLink="/search" [queryParams]="{ kind: 'sweeps' }">Every upload</a>
  `,
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EngineerDesk {
  private readonly api = inject(HomeApi);
  protected readonly day = formatDay;
  protected readonly outOfSpec = rxResource({ stream: () => this.api.outOfSpec() });
  protected readonly recent = rxResource({ stream: () => this.api.recentSweeps() });
}
