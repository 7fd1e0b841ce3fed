import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MAX_RELATIVE_STANDARD_ERROR } from '@rhotrace/physics';
import { alsoShownText, formatStamp, formatValue } from '../../../shared/format';
import { type TemperatureUnit, formatTemperatureRange } from '../../../shared/temperature-unit';
import {
  COMPENSATION_SOURCE_WORDS,
  COMPENSATION_WORDS,
  KIND_WORDS,
  PARAMETER_WORDS,
  PROPERTY_WORDS,
  REGIME_WORDS,
  SCATTERING_WORDS,
  modelVersionWords,
  wordsFor,
} from '../analysis-labels';
import { type ShownFit, isSaved } from '../fit-queue';

interface ParameterRow {
  key: string;
  words: string;
  value: string;
  error: string;
  interval: string;
  /** Why the value is not to be trusted as it stands, or null. */
  caution: string | null;
}

/** Why a fitted value is not to be trusted as it stands (the API's warnings give the detail). */
function cautionOf(value: number, se: number | null, converged: boolean): string | null {
  if (!converged) return null;
  if (se === null) return 'not determined';
  return se > MAX_RELATIVE_STANDARD_ERROR * Math.abs(value) ? 'poorly determined' : null;
}

/** Sequence numbers listed before "and N more". */
const EXCLUDED_LISTED = 8;

/**
 * One fit, previewed or saved: its parameters with standard errors and 95 % intervals, goodness,
 * what it says about the material and under which assumptions, and its warnings. Fields a fit does
 * not state (older fits) are left out.
 */
@Component({
  selector: 'rt-fit-card',
  templateUrl: './fit-card.html',
  styleUrl: './fit-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FitCard {
  readonly fit = input.required<ShownFit>();
  /** The unit the fit's window is shown in. */
  readonly unit = input<TemperatureUnit>('K');

  protected readonly format = formatValue;
  protected readonly propertyWords = PROPERTY_WORDS;
  protected readonly regimeWords = REGIME_WORDS;
  protected readonly compensationWords = COMPENSATION_WORDS;
  protected readonly sourceWords = COMPENSATION_SOURCE_WORDS;
  protected readonly scatteringWords = SCATTERING_WORDS;

  protected readonly saved = computed(() => isSaved(this.fit()));
  protected readonly title = computed(() => {
    const f = this.fit();
    const window =
      f.windowMinK !== null && f.windowMaxK !== null
        ? ` ${formatTemperatureRange(f.windowMinK, f.windowMaxK, this.unit())}`
        : '';
    return `${wordsFor(KIND_WORDS, f.kind)}${window} (${isSaved(f) ? `fit ${f.id}` : 'preview'})`;
  });
  protected readonly rSquared = computed(() => {
    const r = this.fit().goodness.rSquared;
    return r === null ? '–' : r.toFixed(4);
  });
  protected readonly rms = computed(() => formatValue(this.fit().goodness.residualRms, 3));
  protected readonly interpretation = computed(() => this.fit().interpretation);
  protected readonly warnings = computed(() => this.fit().warnings);
  protected readonly excluded = computed(() => {
    const seq = this.fit().excludedSequences;
    if (seq.length === 0) return null;
    const listed = seq.slice(0, EXCLUDED_LISTED).join(', ');
    const more = seq.length > EXCLUDED_LISTED ? ` and ${seq.length - EXCLUDED_LISTED} more` : '';
    const noun = seq.length === 1 ? 'point' : 'points';
    return `${seq.length} flagged ${noun} left out (readings ${listed}${more}).`;
  });
  protected readonly footer = computed(() => {
    const f = this.fit();
    const who = isSaved(f)
      ? ` · by ${f.createdBy.name ?? 'someone'} · ${formatStamp(f.createdAt)}`
      : ' · not saved: keep it to store it with the sweep';
    return `${modelVersionWords(f.modelVersion)}${who} · engineering estimate`;
  });
  protected readonly rows = computed<ParameterRow[]>(() => {
    const f = this.fit();
    return Object.entries(f.parameters).map(([key, value]) => {
      const fitted = key in f.standardErrors;
      const se = f.standardErrors[key];
      const ci = f.confidenceIntervals[key];
      return {
        key,
        words: wordsFor(PARAMETER_WORDS, key),
        value: formatValue(value, 4) + alsoShownText(key, value),
        error: !fitted
          ? 'held fixed'
          : se === undefined || se === null
            ? '–'
            : formatValue(se, 2) + alsoShownText(key, se, 2),
        interval: ci ? `${formatValue(ci[0], 4)} … ${formatValue(ci[1], 4)}` : '–',
        caution: !fitted ? null : cautionOf(value, se ?? null, f.converged),
      };
    });
  });

  /** A fit to check before trusting: not converged, or any warning from the API. */
  protected readonly doubtful = computed(() => !this.fit().converged || this.warnings().length > 0);

  protected ev(value: number): string {
    return formatValue(value, 3);
  }
}
