/**
 * A map sweep as CSV: one row per site and temperature step (position, sheet resistance,
 * resistivity, edge factor, whether the edge exclusion left it out, readings averaged), then the
 * uniformity statistics of each step as rows of their own (`statistic`, `value`, `unit`), over
 * the sites not excluded, as `MapStatisticsDto` defines them.
 */
import type { MapStatisticsDto, SweepMapResponse } from '@rhotrace/api-types';
import { toCsv, type CsvCell } from '../analysis/csv';

const HEADER = [
  'temperature_k',
  'site',
  'x_mm',
  'y_mm',
  'sheet_resistance_ohm_sq',
  'resistivity_ohm_cm',
  'edge_factor',
  'excluded',
  'readings',
  'statistic',
  'value',
  'unit',
] as const;

/** The statistics of one step, each with its words and unit. */
function statisticRows(temperatureK: number, s: MapStatisticsDto): CsvCell[][] {
  const stat = (name: string, value: number | null, unit: string): CsvCell[] => [
    temperatureK,
    ...Array<CsvCell>(8).fill(null),
    name,
    value,
    unit,
  ];
  return [
    stat('sites counted', s.count, 'sites'),
    stat('mean', s.meanOhmCm, 'ohm cm'),
    stat('standard deviation (n - 1)', s.stdDevOhmCm, 'ohm cm'),
    stat('standard deviation / mean', s.stdDevPercent, '%'),
    stat('min', s.minOhmCm, 'ohm cm'),
    stat('max', s.maxOhmCm, 'ohm cm'),
    stat('range (max - min) / (max + min)', s.rangePercent, '%'),
    stat('radial slope / mean', s.radialSlopePercentPerMm, '%/mm'),
  ];
}

/** The CSV document of a sweep's maps. */
export function mapCsv(answer: SweepMapResponse): string {
  const rows: CsvCell[][] = [];
  for (const m of answer.maps) {
    for (const site of m.sites) {
      rows.push([
        m.temperatureK,
        site.label,
        site.xMm,
        site.yMm,
        site.sheetResistanceOhmSq,
        site.resistivityOhmCm,
        site.edgeFactor,
        site.excluded,
        site.readingCount,
        null,
        null,
        null,
      ]);
    }
  }
  for (const m of answer.maps) {
    if (m.statistics) rows.push(...statisticRows(m.temperatureK, m.statistics));
  }
  return toCsv(HEADER, rows);
}
