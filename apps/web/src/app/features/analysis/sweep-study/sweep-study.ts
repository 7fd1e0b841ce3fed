import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { rxResource, takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import {
  type DopingInput,
  type FitDto,
  type FitRequest,
  METAL_FILMS,
  type SuggestedWindow,
} from '@rhotrace/api-types';
import { type Observable, ReplaySubject, catchError, filter, map, of, switchMap } from 'rxjs';
import { ApiError } from '../../../core/http/api-error';
import { Downloader } from '../../../shared/download';
import { EstimateNote } from '../../../shared/estimate-note';
import { formatExponent } from '../../../shared/engineering';
import { formatValue } from '../../../shared/format';
import { Plot, type PlotSelection } from '../../../shared/plot/plot';
import { PlotlyLoader } from '../../../shared/plot/plotly-loader';
import { LotsApi } from '../../lots/lots-api';
import { WafersApi } from '../../wafers/wafers-api';
import { AnalysisApi } from '../analysis-api';
import { FitCard, KIND_WORDS } from './fit-card';
import { type StartingDoping, majorityDensity, startingDoping } from './initial-doping';
import { ModelControls } from './model-controls';
import { type CurveState, modelCurveStream } from './model-curve-stream';
import {
  type CurveOptions,
  type TemperatureUnit,
  arrheniusFigure,
  curveFigure,
  plotRangeK,
  residualFigure,
} from './study-plots';

type FreeParameter = Extract<FitRequest, { kind: 'model' }>['free'][number];

const FREE_WORDS: Record<FreeParameter, string> = {
  donorDensity: 'Donor density',
  acceptorDensity: 'Acceptor density',
  donorLevel: 'Donor level',
  acceptorLevel: 'Acceptor level',
  mobilityScale: 'Mobility scale',
};

const REGIME_WORDS: Record<string, string> = {
  'freeze-out': 'Freeze-out',
  extrinsic: 'Extrinsic',
  intrinsic: 'Intrinsic',
};

/** Studying one sweep: the model overlay, residuals, Arrhenius windows, full-model fits, saved fits. */
@Component({
  selector: 'rt-sweep-study',
  imports: [
    FormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatProgressBarModule,
    RouterLink,
    Plot,
    ModelControls,
    FitCard,
    EstimateNote,
  ],
  templateUrl: './sweep-study.html',
  styleUrl: './sweep-study.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepStudy {
  private readonly api = inject(AnalysisApi);
  private readonly lots = inject(LotsApi);
  private readonly wafers = inject(WafersApi);
  private readonly downloader = inject(Downloader);

  readonly id = input.required<string>();
  protected readonly sweepId = computed(() => Number(this.id()));
  private readonly curvePlot = viewChild<Plot>('curvePlot');
  private readonly arrheniusPlot = viewChild<Plot>('arrheniusPlot');

  protected readonly analysis = rxResource({
    params: () => this.sweepId(),
    stream: ({ params }) => this.api.analysis(params),
  });
  protected readonly materials = rxResource({
    stream: () => this.api.materials().pipe(catchError(() => of(null))),
  });
  protected readonly lot = rxResource({
    params: () => this.analysis.value()?.sweep.lotId,
    stream: ({ params }) => this.lots.get(params),
  });
  protected readonly dopant = rxResource({
    params: () => this.analysis.value()?.sweep.waferId,
    stream: ({ params }) => this.wafers.dopant(params).pipe(catchError(() => of(null))),
  });
  protected readonly fits = rxResource({
    params: () => this.sweepId(),
    stream: ({ params }) => this.api.fits(params),
  });

  protected readonly material = computed(() => {
    const id = this.analysis.value()?.sweep.material;
    return this.materials.value()?.semiconductors.find((m) => m.id === id);
  });
  protected readonly isMetal = computed(() =>
    (METAL_FILMS as readonly string[]).includes(this.analysis.value()?.sweep.material ?? ''),
  );
  /** The temperature range every ρ(T) plot and the model curve cover: the sweep's, plus a margin. */
  protected readonly rangeK = computed(() => {
    const s = this.analysis.value()?.sweep;
    return plotRangeK(s?.minTemperatureK ?? null, s?.maxTemperatureK ?? null);
  });
  /** Where the model starts, and why (semiconductors only). */
  protected readonly start = rxResource({
    params: () => {
      const a = this.analysis.value();
      if (
        !a ||
        this.isMetal() ||
        this.lot.isLoading() ||
        this.dopant.isLoading() ||
        this.materials.isLoading()
      )
        return undefined;
      return { a, lot: this.lot.value(), material: this.material(), dopant: this.dopant.value() };
    },
    stream: ({ params }) => {
      const base = startingDoping(params.lot, params.material, params.dopant);
      const rho23 =
        params.a.spec.resistivityAt23COhmCm ?? params.dopant?.resistivityAt23COhmCm ?? null;
      if (base.basis !== 'fallback' || rho23 === null || rho23 <= 0 || !params.material)
        return of(base);
      return this.scaleToMeasured(base, rho23, (d) =>
        startingDoping(params.lot, params.material, params.dopant, d),
      );
    },
  });
  protected readonly initial = computed<DopingInput | null>(
    () => this.start.value()?.doping ?? null,
  );

  // Model curve, redrawn as parameters are typed (stale requests cancelled).
  private readonly doping$ = new ReplaySubject<DopingInput | null>(1);
  protected readonly curveState = signal<CurveState>({
    curve: null,
    problem: null,
    loading: false,
  });
  protected readonly unit = signal<TemperatureUnit>('K');
  private readonly doping = signal<DopingInput | null>(null);
  private readonly curveOptions = computed<CurveOptions>(() => {
    const d = this.doping();
    const material = this.analysis.value()?.sweep.material ?? '';
    const modelName = this.isMetal()
      ? `bulk ${material} reference (films read higher)`
      : d
        ? `model: donors ${formatExponent(d.donorDensity)}, acceptors ${formatExponent(d.acceptorDensity)} cm⁻³`
        : 'model';
    return { unit: this.unit(), rangeK: this.rangeK(), modelName };
  });
  protected readonly curveFig = computed(() =>
    curveFigure(this.analysis.value()?.steps ?? [], this.curveState().curve, this.curveOptions()),
  );
  protected readonly residualFig = computed(() =>
    residualFigure(
      this.analysis.value()?.steps ?? [],
      this.curveState().curve,
      this.curveOptions(),
    ),
  );

  // Arrhenius window.
  protected readonly quantity = signal<'resistivity' | 'conductivity'>('resistivity');
  protected readonly prefactorExponent = signal(0);
  protected readonly windowMinK = signal<number | null>(null);
  protected readonly windowMaxK = signal<number | null>(null);
  protected readonly windowFit = signal<FitDto | null>(null);
  protected readonly windowProblem = signal<string | null>(null);
  protected readonly fitting = signal(false);
  protected readonly arrheniusFig = computed(() => {
    const min = this.windowMinK();
    const max = this.windowMaxK();
    return arrheniusFigure(
      this.analysis.value()?.arrhenius ?? [],
      this.quantity(),
      min !== null && max !== null ? { minK: min, maxK: max } : null,
      this.windowFit(),
    );
  });

  // Full-model and metal fits.
  protected readonly freeWords = FREE_WORDS;
  protected readonly freeChoices = Object.keys(FREE_WORDS) as FreeParameter[];
  protected readonly free = signal<FreeParameter[]>(['donorDensity', 'mobilityScale']);
  protected readonly modelFit = signal<FitDto | null>(null);
  protected readonly modelProblem = signal<string | null>(null);
  protected readonly referenceK = signal(293.15);
  private lastDoping: DopingInput | null = null;

  // Saved fits chosen for comparison.
  protected readonly compared = signal<number[]>([]);
  protected readonly comparedFits = computed(() =>
    (this.fits.value() ?? []).filter((f) => this.compared().includes(f.id)),
  );

  protected readonly regimeWords = REGIME_WORDS;
  protected readonly kindWords: Record<string, string> = KIND_WORDS;
  protected readonly format = formatValue;

  constructor() {
    // Fetch and evaluate plotly while the sweep's data are on their way, not after.
    void inject(PlotlyLoader).load();
    toObservable(this.analysis.value)
      .pipe(
        filter((a) => a !== undefined),
        switchMap((a) =>
          modelCurveStream(
            this.doping$,
            {
              material: a.sweep.material,
              ...untracked(() => {
                const { fromK, toK } = this.rangeK();
                return { fromK: Number(fromK.toFixed(2)), toK: Number(toK.toFixed(2)) };
              }),
              steps: 400,
            },
            (body) => this.api.modelCurve(body),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((state) => this.curveState.set(state));
    // Metal films have no doping to edit: draw their reference curve once.
    effect(() => {
      if (this.isMetal())
        untracked(() => this.doping$.next({ donorDensity: 0, acceptorDensity: 0 }));
    });
  }

  /**
   * With no measured density, scales the majority density until the model meets the measured
   * 23 °C resistivity (ρ ∝ 1/N in the extrinsic range; two steps absorb the mobility's change).
   */
  private scaleToMeasured(
    base: StartingDoping,
    rho23: number,
    make: (override: { densityCm3: number; basis: 'scaled' }) => StartingDoping,
  ): Observable<StartingDoping> {
    const material = this.analysis.value()?.sweep.material ?? '';
    const modelAt23 = (doping: DopingInput) =>
      this.api
        .modelCurve({ material, doping, fromK: 296.15, toK: 296.65, steps: 2 })
        .pipe(map((c) => c.points[0]?.resistivityOhmCm ?? null));
    const step = (from: StartingDoping, rho: number | null): StartingDoping | null => {
      if (rho === null || !(rho > 0)) return null;
      const scaled = Math.min(1e21, Math.max(1e10, (majorityDensity(from) * rho) / rho23));
      return make({ densityCm3: Number(scaled.toPrecision(3)), basis: 'scaled' });
    };
    return modelAt23(base.doping).pipe(
      switchMap((rho) => {
        const first = step(base, rho);
        if (!first) return of(base);
        return modelAt23(first.doping).pipe(map((rho2) => step(first, rho2) ?? first));
      }),
      catchError(() => of(base)),
    );
  }

  protected onDoping(doping: DopingInput | null): void {
    this.doping.set(doping);
    this.lastDoping = doping;
    this.doping$.next(doping);
  }

  protected onArrheniusSelected(selection: PlotSelection): void {
    if (selection.xMin <= 0) return;
    this.fitWindow(1000 / selection.xMax, 1000 / selection.xMin);
  }

  protected useSuggestion(window: SuggestedWindow): void {
    this.fitWindow(window.minK, window.maxK);
  }

  protected fitTypedWindow(): void {
    const min = this.windowMinK();
    const max = this.windowMaxK();
    if (min === null || max === null) {
      this.windowProblem.set('Give both ends of the window, or drag across the Arrhenius plot.');
      return;
    }
    this.fitWindow(min, max);
  }

  /** Fits ln ρ (or ln σ) over [minK, maxK] and saves the fit. */
  protected fitWindow(minK: number, maxK: number): void {
    const lo = Number(Math.min(minK, maxK).toFixed(2));
    const hi = Number(Math.max(minK, maxK).toFixed(2));
    this.windowMinK.set(lo);
    this.windowMaxK.set(hi);
    this.windowProblem.set(null);
    this.fitting.set(true);
    this.api
      .createFit(this.sweepId(), {
        kind: 'arrhenius',
        minK: lo,
        maxK: hi,
        quantity: this.quantity(),
        prefactorExponent: this.prefactorExponent(),
      })
      .subscribe({
        next: (fit) => {
          this.fitting.set(false);
          this.windowFit.set(fit);
          this.fits.reload();
        },
        error: (err: unknown) => {
          this.fitting.set(false);
          this.windowFit.set(null);
          this.windowProblem.set(
            err instanceof ApiError ? err.message : 'The window could not be fitted.',
          );
        },
      });
  }

  protected discardWindowFit(): void {
    const fit = this.windowFit();
    if (!fit) return;
    this.api.deleteFit(fit.id).subscribe(() => {
      this.windowFit.set(null);
      this.fits.reload();
    });
  }

  protected toggleFree(parameter: FreeParameter, on: boolean): void {
    this.free.update((list) =>
      on ? [...new Set([...list, parameter])] : list.filter((p) => p !== parameter),
    );
  }

  protected runModelFit(): void {
    const doping = this.lastDoping ?? this.initial();
    if (!doping) return;
    this.runFit({ kind: 'model', initial: { ...doping, mobilityScale: 1 }, free: this.free() });
  }

  protected runMetalFit(kind: 'tcr' | 'bloch-gruneisen'): void {
    this.runFit(
      kind === 'tcr' ? { kind: 'tcr', referenceK: this.referenceK() } : { kind: 'bloch-gruneisen' },
    );
  }

  private runFit(body: FitRequest): void {
    this.modelProblem.set(null);
    this.fitting.set(true);
    this.api.createFit(this.sweepId(), body).subscribe({
      next: (fit) => {
        this.fitting.set(false);
        this.modelFit.set(fit);
        this.fits.reload();
      },
      error: (err: unknown) => {
        this.fitting.set(false);
        this.modelProblem.set(err instanceof ApiError ? err.message : 'The fit failed.');
      },
    });
  }

  protected toggleCompared(id: number, on: boolean): void {
    this.compared.update((list) => (on ? [...list, id] : list.filter((x) => x !== id)));
  }

  protected deleteFit(id: number): void {
    this.api.deleteFit(id).subscribe(() => {
      this.compared.update((list) => list.filter((x) => x !== id));
      if (this.windowFit()?.id === id) this.windowFit.set(null);
      if (this.modelFit()?.id === id) this.modelFit.set(null);
      this.fits.reload();
    });
  }

  protected mainValue(fit: FitDto): string {
    const [key, value] = Object.entries(fit.parameters)[0] ?? [];
    if (key === undefined || value === undefined) return '–';
    const se = fit.standardErrors[key];
    return `${formatValue(value)}${se ? ' ± ' + formatValue(se, 2) : ''}`;
  }

  protected exportCurvePng(): void {
    void this.curvePlot()?.downloadPng(`sweep-${this.sweepId()}-curve`);
  }

  protected exportArrheniusPng(): void {
    void this.arrheniusPlot()?.downloadPng(`sweep-${this.sweepId()}-arrhenius`);
  }

  protected downloadFitsCsv(): void {
    void this.downloader.save(
      `/api/sweeps/${this.sweepId()}/fits.csv`,
      `sweep-${this.sweepId()}-fits.csv`,
    );
  }

  protected downloadReport(): void {
    void this.downloader.save(
      `/api/sweeps/${this.sweepId()}/report`,
      `sweep-${this.sweepId()}-report.pdf`,
    );
  }
}
