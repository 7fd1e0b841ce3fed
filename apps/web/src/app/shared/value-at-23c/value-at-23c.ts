import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatTableModule } from '@angular/material/table';
import type { SpecCheckDto, UncertaintyContribution, UncertaintySource } from '@rhotrace/api-types';
import { FormatValuePipe } from '../format-value';
import { SpecVerdictBadge } from '../spec-verdict';

/** The fields of a 23 °C value this view reads (the sweep, wafer and lot answers all carry them). */
export type ValueAt23CReading = Pick<
  SpecCheckDto,
  | 'resistivityAt23COhmCm'
  | 'method'
  | 'distanceK'
  | 'verdict'
  | 'uncertaintyOhmCm'
  | 'coverageFactor'
  | 'uncertaintyBudget'
  | 'reason'
>;

/** Budget line names in Rhotrace's words. */
export const SOURCE_WORDS: Readonly<Record<UncertaintySource, string>> = {
  repeatability: 'Scatter within steps',
  'temperature-sensor': 'Thermometer tolerance',
  'temperature-correction': 'Bringing it to 23 °C',
  'probe-spacing': 'Probe spacing',
  thickness: 'Thickness',
};

/** How the value was reached, as a short phrase. */
export function methodWords(reading: Pick<ValueAt23CReading, 'method' | 'distanceK'>): string {
  if (reading.method === 'interpolated') return 'interpolated between the steps either side';
  if (reading.method === 'corrected') {
    return `corrected from a step ${reading.distanceK?.toFixed(1) ?? '?'} K away`;
  }
  return '';
}

/**
 * A 23 °C resistivity with its expanded uncertainty (k = 2), how it was reached, the
 * guard-banded verdict and, folded away, the uncertainty budget line by line.
 */
@Component({
  selector: 'rt-value-at-23c',
  imports: [MatExpansionModule, MatTableModule, FormatValuePipe, SpecVerdictBadge],
  templateUrl: './value-at-23c.html',
  styleUrl: './value-at-23c.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ValueAt23C {
  readonly reading = input.required<ValueAt23CReading>();
  protected readonly columns = ['source', 'u', 'relative', 'distribution', 'note'];
  protected readonly how = computed(() => methodWords(this.reading()));
  protected readonly relativeU = computed(() => {
    const r = this.reading();
    return r.uncertaintyOhmCm !== null && r.resistivityAt23COhmCm
      ? (100 * r.uncertaintyOhmCm) / r.resistivityAt23COhmCm
      : null;
  });

  protected sourceLabel(line: UncertaintyContribution): string {
    return SOURCE_WORDS[line.source];
  }

  protected assessed(line: UncertaintyContribution): boolean {
    return !line.note.startsWith('Not assessed');
  }
}
