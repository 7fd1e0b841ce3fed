import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import type { LotSummaryWafer, WaferDto } from '@rhotrace/api-types';
import { filter, of, switchMap } from 'rxjs';
import { Session } from '../../../core/auth/session';
import { ApiError, applyServerErrors } from '../../../core/http/api-error';
import { Confirmer } from '../../../shared/confirm-dialog';
import { Downloader, safeName } from '../../../shared/download';
import { EstimateNote } from '../../../shared/estimate-note';
import { above, fieldError } from '../../../shared/field-error';
import { formatDay } from '../../../shared/format';
import { FormatLengthPipe, FormatValuePipe } from '../../../shared/format-value';
import { HALL_AT_300K_NOTE, HallAt300KLine } from '../../../shared/hall-at-300k';
import { LengthInput } from '../../../shared/length-input';
import { Plot } from '../../../shared/plot/plot';
import { SpecVerdictBadge } from '../../../shared/spec-verdict';
import { methodWords, ValueAt23C } from '../../../shared/value-at-23c/value-at-23c';
import { LotsApi } from '../lots-api';
import { lotChart } from './lot-chart';
import { RecordHistory } from '../../../shared/record-history/record-history';

interface WaferRow {
  wafer: WaferDto;
  summary: LotSummaryWafer | undefined;
}

import { LotMaps } from '../../maps/lot-maps/lot-maps';
import { RowCards } from '../../../shared/row-cards';
/**
 * One lot: facts, spec, wafers with their 23 °C values (± U, verdict, budget), Ppk and the spec
 * chart.
 */
@Component({
  selector: 'rt-lot-detail',
  imports: [
    RowCards,
    RecordHistory,
    MatTableModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    ReactiveFormsModule,
    RouterLink,
    FormatValuePipe,
    FormatLengthPipe,
    LengthInput,
    Plot,
    EstimateNote,
    SpecVerdictBadge,
    ValueAt23C,
    LotMaps,
    HallAt300KLine,
  ],
  templateUrl: './lot-detail.html',
  styleUrl: './lot-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LotDetail {
  private readonly api = inject(LotsApi);
  private readonly router = inject(Router);
  private readonly downloader = inject(Downloader);
  private readonly confirmer = inject(Confirmer);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly waferFormDirective = viewChild(FormGroupDirective);
  protected readonly canEdit = inject(Session).can('records:edit');

  readonly id = input.required<string>();
  protected readonly lotId = computed(() => Number(this.id()));

  protected readonly lot = rxResource({
    params: () => this.lotId(),
    stream: ({ params }) => this.api.get(params),
  });
  protected readonly wafers = rxResource({
    params: () => this.lotId(),
    stream: ({ params }) => this.api.wafers(params),
  });
  protected readonly summary = rxResource({
    params: () => this.lotId(),
    stream: ({ params }) => (Number.isFinite(params) ? this.api.summary(params) : of(undefined)),
  });

  /** The table's columns: the Hall values at 300 K only where a wafer has a Hall sweep. */
  protected readonly columns = computed(() => [
    ...['number', 'state', 'thicknessCm', 'rho', 'verdict', 'budget'],
    ...(this.hasHall() ? ['hall'] : []),
    'ea',
  ]);
  protected readonly hasHall = computed(() =>
    (this.summary.value()?.wafers ?? []).some((w) => !!w.hall),
  );
  protected readonly hallNote = HALL_AT_300K_NOTE;
  protected readonly methodWords = methodWords;
  /** The wafer whose uncertainty budget is unfolded below the table. */
  protected readonly budgetWaferId = signal<number | null>(null);
  protected readonly budgetRow = computed(() => {
    const id = this.budgetWaferId();
    return this.summary.value()?.wafers.find((w) => w.waferId === id) ?? null;
  });
  protected readonly day = formatDay;
  protected readonly error = fieldError;
  protected readonly rows = computed<WaferRow[]>(() => {
    const bySummary = new Map((this.summary.value()?.wafers ?? []).map((w) => [w.waferId, w]));
    return (this.wafers.value()?.items ?? []).map((wafer) => ({
      wafer,
      summary: bySummary.get(wafer.id),
    }));
  });
  protected readonly chart = computed(() => {
    const summary = this.summary.value();
    return summary && summary.wafers.some((w) => w.resistivityAt23COhmCm !== null)
      ? lotChart(summary)
      : null;
  });

  protected readonly adding = signal(false);
  protected readonly addProblem = signal<string | null>(null);
  protected readonly waferForm = this.fb.group({
    number: ['', [Validators.required, Validators.maxLength(32)]],
    thicknessCm: this.fb.control<number | null>(null, above(0)),
    notes: this.fb.control<string | null>(null),
  });

  protected addWafer(): void {
    if (this.waferForm.invalid) {
      this.waferForm.markAllAsTouched();
      return;
    }
    this.addProblem.set(null);
    const raw = this.waferForm.getRawValue();
    this.api.createWafer(this.lotId(), { ...raw, notes: raw.notes || null }).subscribe({
      next: () => {
        this.waferFormDirective()?.resetForm();
        this.adding.set(false);
        this.wafers.reload();
        this.summary.reload();
      },
      error: (err: unknown) => {
        if (err instanceof ApiError) {
          if (err.status === 409)
            this.waferForm.controls.number.setErrors({ server: 'is already used in this lot' });
          applyServerErrors(this.waferForm, err);
          this.addProblem.set(err.message);
        }
      },
    });
  }

  protected toggleBudget(waferId: number): void {
    this.budgetWaferId.update((current) => (current === waferId ? null : waferId));
  }

  protected deleteLot(): void {
    const code = this.lot.value()?.code ?? '';
    this.confirmer
      .ask({
        title: `Delete lot ${code}?`,
        message: 'The lot and its wafers leave the lists; the change trail keeps the record.',
        confirmWords: 'Delete the lot',
      })
      .pipe(
        filter(Boolean),
        switchMap(() => this.api.remove(this.lotId())),
      )
      .subscribe(() => void this.router.navigate(['/lots']));
  }

  protected averageEa(row: WaferRow): string {
    const list = row.summary?.activationEnergies ?? [];
    if (list.length === 0) return '–';
    return list.map((e) => `${e.activationEnergyEv.toFixed(3)} eV`).join(', ');
  }

  /** The lot summary (wafers, 23 °C values, verdicts, statistics) as a CSV file. */
  protected downloadSummaryCsv(code: string): void {
    void this.downloader.save(
      this.api.summaryCsvUrl(this.lotId()),
      `lot-${safeName(code)}-summary.csv`,
    );
  }

  /** The printable lot report: every wafer's 23 °C value, the statistics, chart and fits. */
  protected downloadReport(code: string): void {
    void this.downloader.save(
      this.api.reportPdfUrl(this.lotId()),
      `lot-${safeName(code)}-report.pdf`,
    );
  }
}
