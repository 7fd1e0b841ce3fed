import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import type { LegDto, PointFlag } from '@rhotrace/api-types';
import { formatValue } from '../../../../shared/format';
import { AnalysisStore } from '../../analysis-store';
import { FLAG_WORDS } from './flagged-traces';

/**
 * The sweep's ramp legs (pick one to study, or all), the thermal lag an up and a down leg show,
 * and the points the import found doubtful, each with its reason.
 */
@Component({
  selector: 'rt-sweep-faults',
  imports: [MatButtonToggleModule],
  templateUrl: './sweep-faults.html',
  styleUrl: '../../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepFaults {
  protected readonly store = inject(AnalysisStore);
  protected readonly analysis = computed(() => this.store.analysis.value());
  protected readonly legs = computed(() => this.analysis()?.legs ?? []);
  protected readonly findings = computed(() => this.analysis()?.findings ?? []);
  /**
   * The findings of what the plots show: every leg's, or with one leg studied, those of its
   * readings (the API's `flaggedReadings` are the studied leg's).
   */
  protected readonly shownFindings = computed(() => {
    const a = this.analysis();
    if (a?.leg === null || a?.leg === undefined) return this.findings();
    const inLeg = new Set((a.flaggedReadings ?? []).map((r) => r.sequence));
    return this.findings().filter((f) => inLeg.has(f.sequence));
  });
  /** Points with findings in the legs not shown. */
  protected readonly elsewhere = computed(() => {
    const shown = new Set(this.shownFindings().map((f) => f.sequence));
    return new Set(
      this.findings()
        .map((f) => f.sequence)
        .filter((q) => !shown.has(q)),
    ).size;
  });
  protected readonly importWarnings = computed(() => this.analysis()?.importWarnings ?? []);
  /** The leg shown: the API's choice (null: all legs). */
  protected readonly chosen = computed(() => {
    const leg = this.analysis()?.leg;
    return leg === null || leg === undefined ? 'all' : leg;
  });
  protected readonly lag = computed(() => {
    const l = this.analysis()?.thermalLag;
    return l ? `${formatValue(l.lagK, 3)} ± ${formatValue(l.standardErrorK, 2)} K` : null;
  });

  protected legWords(l: LegDto): string {
    const arrow = l.direction === 'up' ? '↑' : l.direction === 'down' ? '↓' : '→';
    return `Leg ${l.index} ${arrow} ${formatValue(l.minK, 4)}–${formatValue(l.maxK, 4)} K, ${l.stepCount} steps`;
  }

  protected flagWord(flag: PointFlag): string {
    return FLAG_WORDS[flag] ?? flag;
  }

  protected pick(value: number | 'all'): void {
    this.store.leg.set(value);
  }
}
