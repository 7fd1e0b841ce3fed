import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { AnalysisStep, HallAnalysis } from '@rhotrace/api-types';
import { Plot } from '../../../../shared/plot/plot';
import { type HallModels, densityPlot, mobilityPlot, resistivityPlot } from './hall-traces';

/**
 * The three plots of a Hall sweep side by side: rho(T), n against 1000/T and mu_H(T). They are
 * linked through the fit window, shaded on all three in each one's own x.
 */
@Component({
  selector: 'rt-hall-plots',
  imports: [Plot],
  template: `
    <div class="hall-plots">
      <rt-plot
        label="Resistivity against temperature (Hall sweep)"
        [data]="rho().data"
        [layout]="rho().layout"
      />
      <rt-plot
        label="Carrier density against 1000/T"
        [data]="density().data"
        [layout]="density().layout"
        caption="Line: charge neutrality with incomplete ionization for the doping shown."
      />
      <rt-plot
        label="Hall mobility against temperature"
        [data]="mobility().data"
        [layout]="mobility().layout"
        caption="Solid: fitted power law; dashed: the model's drift mobility for that doping."
      />
    </div>
  `,
  styles: `
    .hall-plots {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(320px, 1fr));
      gap: 12px;
      --rt-plot-height: 320px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HallPlots {
  readonly steps = input.required<AnalysisStep[]>();
  readonly hall = input.required<HallAnalysis>();
  readonly models = input.required<HallModels>();
  readonly window = input<{ minK: number; maxK: number } | null>(null);
  /** The flagged readings' trace for the ρ(T) plot (null: none flagged). */
  readonly flagged = input<Record<string, unknown> | null>(null);

  protected readonly rho = computed(() =>
    resistivityPlot(this.steps(), this.window(), this.flagged()),
  );
  protected readonly density = computed(() =>
    densityPlot(this.hall().steps, this.models().density, this.window()),
  );
  protected readonly mobility = computed(() =>
    mobilityPlot(this.hall().steps, this.models(), this.window()),
  );
}
