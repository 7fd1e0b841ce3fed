import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  linkedSignal,
  viewChild,
} from '@angular/core';
import type { DopingInput } from '@rhotrace/api-types';
import type { FittedOverlay } from './fitted-overlay';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { formatExponent } from '../../../shared/engineering';
import { Plot } from '../../../shared/plot/plot';
import { AnalysisStore } from '../analysis-store';
import { ModelControls } from '../sweep-study/model-controls';
import { flaggedCurveTrace, flaggedMarks } from '../parts/sweep-faults/flagged-traces';
import { type CurveOptions, curveFigure, residualFigure } from '../sweep-study/study-plots';

/**
 * The measured ρ(T) over the model curve, with its residuals: the doping typed above the plot
 * redraws the model (the store asks for the newest parameters only).
 */
@Component({
  selector: 'rt-model-overlay',
  imports: [MatButtonModule, MatButtonToggleModule, MatProgressBarModule, Plot, ModelControls],
  templateUrl: './model-overlay.html',
  styleUrl: '../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModelOverlay {
  protected readonly store = inject(AnalysisStore);
  private readonly plot = viewChild<Plot>('curvePlot');

  /** The last fitted values applied: the controls start from them until others are applied. */
  protected readonly applied = linkedSignal<FittedOverlay | null, DopingInput | null>({
    source: () => this.store.fittedOverlay(),
    computation: (fitted, previous) => fitted?.doping ?? previous?.value ?? null,
  });
  protected readonly material = computed(() => this.store.analysis.value()?.sweep.material ?? '');
  private readonly options = computed<CurveOptions>(() => {
    const d = this.store.doping();
    const modelName = this.store.isMetal()
      ? `bulk ${this.material()} reference (films read higher)`
      : this.store.fittedOverlay()
        ? `model from ${fittedName(this.store.fittedOverlay()?.fitId ?? null)}`
        : d
          ? `model: donors ${formatExponent(d.donorDensity)}, acceptors ${formatExponent(d.acceptorDensity)} cm⁻³`
          : 'model';
    return {
      unit: this.store.unit(),
      rangeK: this.store.rangeK(),
      modelName,
      fits: this.store.drawnFits(),
    };
  });
  private readonly steps = computed(() => this.store.analysis.value()?.steps ?? []);
  protected readonly curveFig = computed(() => {
    const figure = curveFigure(this.steps(), this.store.curveState().curve, this.options());
    const marks = flaggedMarks(this.store.analysis.value());
    const flagged = flaggedCurveTrace(marks, this.store.unit(), this.store.includeFlagged());
    return flagged ? { ...figure, data: [...figure.data, flagged] } : figure;
  });
  protected readonly residualFig = computed(() =>
    residualFigure(this.steps(), this.store.curveState().curve, this.options()),
  );

  protected exportPng(): void {
    void this.plot()?.downloadPng(`sweep-${this.store.sweepId()}-curve`);
  }
}

const fittedName = (id: number | null) => (id === null ? 'the fit previewed' : `fit ${id}`);
