/** The Hall columns a row reader reads besides the van der Pauw ones. */
import type { ColumnMeaning } from '@rhotrace/api-types';

/** The columns of a Hall sweep besides the van der Pauw ones. */
export type HallMeaning = Extract<ColumnMeaning, 'magnetic-field' | `hall-voltage${string}`>;

export type HallReadingKey = 'magneticFieldT' | 'hallVoltageV' | 'hallReversalsV';

/** The Hall columns of a file and whether the method makes each one's cells required. */
export function hallColumns<T>(of: (m: HallMeaning) => T): Record<HallMeaning, T> {
  return {
    'magnetic-field': of('magnetic-field'),
    'hall-voltage': of('hall-voltage'),
    'hall-voltage-pp': of('hall-voltage-pp'),
    'hall-voltage-pn': of('hall-voltage-pn'),
    'hall-voltage-np': of('hall-voltage-np'),
    'hall-voltage-nn': of('hall-voltage-nn'),
  };
}
