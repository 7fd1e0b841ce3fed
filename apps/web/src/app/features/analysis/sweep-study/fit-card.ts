import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { FitDto } from '@rhotrace/api-types';
import { formatValue } from '../../../shared/format';

/** Words and units for the parameters fits report. */
export const PARAMETER_WORDS: Record<string, string> = {
  activationEnergyEv: 'Activation energy (eV)',
  intercept: 'Intercept (ln)',
  impliedEv: 'Implied level or gap (eV)',
  donorDensity: 'Donor density (cm⁻³)',
  acceptorDensity: 'Acceptor density (cm⁻³)',
  donorLevel: 'Donor ionization energy (eV)',
  acceptorLevel: 'Acceptor ionization energy (eV)',
  mobilityScale: 'Mobility scale',
  referenceResistivityOhmCm: 'ρ at reference (Ω·cm)',
  alphaPerK: 'Temperature coefficient (1/K)',
  residualOhmCm: 'Residual resistivity (Ω·cm)',
  couplingOhmCm: 'Phonon coupling (Ω·cm)',
  debyeK: 'Debye temperature (K)',
};

export const KIND_WORDS: Record<string, string> = {
  arrhenius: 'Arrhenius window',
  model: 'Full model',
  tcr: 'Linear TCR',
  'bloch-gruneisen': 'Bloch–Grüneisen',
};

interface ParameterRow {
  key: string;
  words: string;
  value: string;
  error: string;
  interval: string;
}

/** One fit: its parameters with standard errors and 95 % intervals, goodness, and its reading. */
@Component({
  selector: 'rt-fit-card',
  template: `
    <article class="fit" [attr.aria-label]="title()">
      <header>
        <strong>{{ title() }}</strong>
        @if (!fit().converged) {
          <span class="bad">did not converge</span>
        }
      </header>
      <table class="params">
        <thead>
          <tr>
            <th scope="col">Parameter</th>
            <th scope="col">Value</th>
            <th scope="col">± std. error</th>
            <th scope="col">95 % interval</th>
          </tr>
        </thead>
        <tbody>
          @for (r of rows(); track r.key) {
            <tr>
              <th scope="row">{{ r.words }}</th>
              <td>{{ r.value }}</td>
              <td>{{ r.error }}</td>
              <td>{{ r.interval }}</td>
            </tr>
          }
        </tbody>
      </table>
      <p class="goodness">
        R² {{ rSquared() }} · {{ fit().goodness.count }} points · residual RMS {{ rms() }} ({{
          fit().goodness.residualUnit
        }})
      </p>
      @if (fit().reading) {
        <p class="reading">{{ fit().reading }}</p>
      }
      @if (fit().reason && fit().converged) {
        <p class="rt-muted">{{ fit().reason }}</p>
      }
      <p class="rt-muted small">
        Model {{ fit().modelVersion }} · by {{ fit().createdBy.name ?? 'someone' }} ·
        {{ fit().createdAt.slice(0, 16).replace('T', ' ') }} · engineering estimate
      </p>
    </article>
  `,
  styles: `
    .fit {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      padding: 10px 14px;
      background: var(--mat-sys-surface-container-lowest);
    }
    header {
      display: flex;
      gap: 10px;
      align-items: baseline;
      margin-bottom: 6px;
    }
    .bad {
      color: var(--mat-sys-error);
      font-weight: 600;
    }
    table {
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
      width: 100%;
    }
    th,
    td {
      text-align: left;
      padding: 3px 8px 3px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    thead th {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .reading {
      font: var(--mat-sys-body-large);
      margin: 8px 0 4px;
    }
    .goodness {
      margin: 6px 0 0;
    }
    .small {
      font: var(--mat-sys-body-small);
      margin: 4px 0 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FitCard {
  readonly fit = input.required<FitDto>();

  protected readonly title = computed(() => {
    const f = this.fit();
    const window =
      f.windowMinK !== null && f.windowMaxK !== null
        ? ` ${formatValue(f.windowMinK)}–${formatValue(f.windowMaxK)} K`
        : '';
    return `${KIND_WORDS[f.kind] ?? f.kind}${window} (fit ${f.id})`;
  });
  protected readonly rSquared = computed(() => {
    const r = this.fit().goodness.rSquared;
    return r === null ? '–' : r.toFixed(4);
  });
  protected readonly rms = computed(() => formatValue(this.fit().goodness.residualRms, 3));
  protected readonly rows = computed<ParameterRow[]>(() => {
    const f = this.fit();
    return Object.entries(f.parameters).map(([key, value]) => {
      const se = f.standardErrors[key];
      const ci = f.confidenceIntervals[key];
      return {
        key,
        words: PARAMETER_WORDS[key] ?? key,
        value: formatValue(value, 4),
        error: se === undefined || se === null ? '–' : formatValue(se, 2),
        interval: ci ? `${formatValue(ci[0], 4)} … ${formatValue(ci[1], 4)}` : '–',
      };
    });
  });
}
