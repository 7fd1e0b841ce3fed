import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { HallAt300K } from '@rhotrace/api-types';
import { formatValue } from './format';

const CARRIER_TYPE_WORDS: Record<HallAt300K['carrierType'], string> = {
  n: 'n-type',
  p: 'p-type',
  mixed: 'mixed conduction',
};

/** What the Hall values at 300 K stand for, said once beside a table or list of them. */
export const HALL_AT_300K_NOTE =
  'Hall values at 300 K are interpolated between the two nearest temperature steps (each ' +
  'within 15 K); ± is one standard uncertainty (k = 1) from the scatter of the readings, not ' +
  'known where a step has one reading. ' +
  'Densities assume the Hall factor r_H shown (n = r_H / (q |R_H|)); the Hall mobility ' +
  '|R_H| / ρ does not depend on it.';

/** `value ± u unit`; without an uncertainty `value unit (u not known)`; a dash without a value. */
export function valueWithUncertainty(
  value: number | null,
  uncertainty: number | null | undefined,
  unit: string,
): string {
  if (value === null) return '–';
  if (uncertainty === null || uncertainty === undefined)
    return `${formatValue(value)} ${unit} (u not known)`;
  return `${formatValue(value)} ± ${formatValue(uncertainty, 2)} ${unit}`;
}

/**
 * A Hall sweep's carrier type, density and Hall mobility at 300 K with their standard
 * uncertainties, and the Hall factor the density assumes (see `HALL_AT_300K_NOTE`).
 */
@Component({
  selector: 'rt-hall-at-300k',
  template: `{{ words() }}`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HallAt300KLine {
  readonly hall = input.required<HallAt300K>();

  protected readonly words = computed(() => {
    const h = this.hall();
    const n = valueWithUncertainty(
      h.carrierDensityAt300KCm3,
      h.carrierDensityAt300KUncertaintyCm3,
      'cm⁻³',
    );
    const mu = valueWithUncertainty(
      h.hallMobilityAt300KCm2PerVs,
      h.hallMobilityAt300KUncertaintyCm2PerVs,
      'cm²/(V s)',
    );
    return `${CARRIER_TYPE_WORDS[h.carrierType]} · n = ${n} · µ_H = ${mu} (r_H = ${formatValue(h.hallFactor, 4)})`;
  });
}
