import type { PlannerResponse } from '@rhotrace/api-types';

/** Header of the plan CSV a station loads: one row per step, SI units named in each column. */
export const PLAN_CSV_COLUMNS = [
  'step',
  'temperature_K',
  'current_A',
  'expected_voltage_V',
  'expected_power_W',
  'expected_resistivity_ohm_cm',
  'expected_sheet_resistance_ohm_sq',
  'regime',
  'current_limited_by',
] as const;

/**
 * The plan as CSV for a station: a header line, then one line per step in the order to visit,
 * at full precision (the station rounds to what its source can set). Numbers and fixed words
 * only, so no field needs quoting.
 */
export function planCsv(plan: Pick<PlannerResponse, 'steps'>): string {
  const lines = [
    PLAN_CSV_COLUMNS.join(','),
    ...plan.steps.map((s, i) =>
      [
        i + 1,
        s.temperatureK,
        s.currentA,
        s.voltageV,
        s.powerW,
        s.expectedResistivityOhmCm,
        s.expectedSheetResistanceOhmSq,
        s.regime ?? '',
        s.limitedBy,
      ].join(','),
    ),
  ];
  return `${lines.join('\r\n')}\r\n`;
}
