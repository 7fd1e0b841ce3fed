import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import type { FitDto, FitPreviewDto } from '@rhotrace/api-types';
import { formatValue } from '../../../../shared/format';
import { HALL_AT_300K_NOTE, valueWithUncertainty } from '../../../../shared/hall-at-300k';
import { AnalysisStore } from '../../analysis-store';
import { HallDensityFit } from '../hall-density-fit/hall-density-fit';
import { HallMobilityFit } from '../hall-mobility-fit/hall-mobility-fit';
import { HallPlots } from '../hall-plots/hall-plots';
import { HallFitsStore } from './hall-fits-store';
import { type HallDoping, hallModels } from './hall-models';
import { flaggedCurveTrace, flaggedMarks } from '../sweep-faults/flagged-traces';

const CARRIER_WORDS = {
  n: 'n-type (electrons; negative Hall coefficient)',
  p: 'p-type (holes; positive Hall coefficient)',
  mixed: 'mixed: the sign changes within the sweep (both carriers conduct there)',
} as const;

/** The doping a carrier-density fit found, as the model draws it. */
function fittedDoping(fit: FitDto | FitPreviewDto): HallDoping {
  const p = fit.parameters;
  return {
    donorDensity: p['donorDensity'] ?? 0,
    acceptorDensity: p['acceptorDensity'] ?? 0,
    donorLevel: p['donorLevel'],
    acceptorLevel: p['acceptorLevel'],
  };
}

/**
 * The Hall part of the study page (shown for Hall sweeps): the carrier type and the values at
 * 300 K, the three linked plots, and the carrier-density and mobility fits.
 */
@Component({
  selector: 'rt-hall-study',
  imports: [HallPlots, HallDensityFit, HallMobilityFit],
  providers: [HallFitsStore],
  template: `
    @if (view(); as v) {
      <section class="panel" aria-labelledby="hall-title">
        <h2 id="hall-title" class="rt-section-title">Hall effect</h2>
        <p data-testid="carrier-type">
          Carrier type: <strong>{{ carrierWords[v.hall.carrierType] }}</strong> · Hall factor r_H =
          {{ format(v.hall.hallFactor, 4) }} · at 300 K: n = {{ at300K().density }}, µ_H =
          {{ at300K().mobility }}
        </p>
        <p class="rt-muted">{{ hallNote }}</p>
        <rt-hall-plots
          [steps]="v.steps"
          [hall]="v.hall"
          [models]="models()"
          [window]="fits.window()"
          [flagged]="flagged()"
        />
      </section>
      <div class="hall-fits">
        <rt-hall-density-fit [material]="v.material" [hall]="v.hall" />
        <rt-hall-mobility-fit [hall]="v.hall" />
      </div>
    }
  `,
  styleUrl: '../../study-panel.scss',
  styles: `
    .hall-fits {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(420px, 1fr));
      gap: 0 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HallStudy {
  private readonly study = inject(AnalysisStore);
  protected readonly fits = inject(HallFitsStore);
  protected readonly format = formatValue;
  protected readonly carrierWords = CARRIER_WORDS;
  protected readonly hallNote = HALL_AT_300K_NOTE;

  protected readonly view = computed(() => {
    const a = this.study.analysis.value();
    return a?.hall ? { hall: a.hall, steps: a.steps, material: a.sweep.material } : null;
  });

  /** The studied leg's flagged readings on the ρ(T) plot (kelvin, as its axis). */
  protected readonly flagged = computed(() =>
    flaggedCurveTrace(flaggedMarks(this.study.analysis.value()), 'K', this.study.includeFlagged()),
  );

  /** The values at 300 K with their standard uncertainties and units. */
  protected readonly at300K = computed(() => {
    const h = this.view()!.hall;
    return {
      density: valueWithUncertainty(
        h.carrierDensityAt300KCm3,
        h.carrierDensityAt300KUncertaintyCm3,
        'cm⁻³',
      ),
      mobility: valueWithUncertainty(
        h.hallMobilityAt300KCm2PerVs,
        h.hallMobilityAt300KUncertaintyCm2PerVs,
        'cm²/(V s)',
      ),
    };
  });

  private readonly latestSaved = (kind: FitDto['kind']) =>
    [...(this.study.fits.value() ?? [])].reverse().find((f) => f.kind === kind && f.converged);

  protected readonly models = computed(() => {
    const v = this.view()!;
    const densityFit =
      this.fits.slots['carrier-density']().fit ?? this.latestSaved('carrier-density');
    const entered = this.fits.enteredDoping();
    const doping = densityFit?.converged
      ? { values: fittedDoping(densityFit), label: 'Neutrality model, fitted doping' }
      : entered
        ? { values: entered, label: 'Neutrality model, doping entered' }
        : null;
    const mobilityFit = this.fits.slots['hall-mobility']().fit ?? this.latestSaved('hall-mobility');
    const first = v.hall.steps[0]?.temperatureK ?? 0;
    const last = v.hall.steps[v.hall.steps.length - 1]?.temperatureK ?? 0;
    const law =
      mobilityFit?.converged && mobilityFit.parameters['exponent'] !== undefined
        ? {
            exponent: mobilityFit.parameters['exponent'],
            mobilityAt300K: mobilityFit.parameters['mobilityAt300K'] ?? 0,
            minK: mobilityFit.windowMinK ?? first,
            maxK: mobilityFit.windowMaxK ?? last,
          }
        : null;
    return hallModels(v.material, v.hall, doping, law);
  });
}
