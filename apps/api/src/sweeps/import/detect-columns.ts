/**
 * Stage 2, detect columns: the parser's guesses with the user's mapping applied, checked against
 * what the measurement method needs.
 */
import type { SweepColumn, SweepColumnOverride, SweepMethod } from '@rhotrace/api-types';
import { validationFailed } from '../../errors';
import { applyColumnOverrides, type ParsedSweepFile, type ResolvedColumn } from '../parse';
import { POINT_METHODS } from './methods';

/** Meanings that carry no unit. */
const UNITLESS = new Set(['other', 'index', 'polarity', 'site', 'site-label']);

/**
 * The columns to import with: the guesses with `overrides` applied. Throws a 400 naming each
 * invalid override, or each column the method needs that is missing or has no known unit.
 */
export function detectColumns(
  parsed: ParsedSweepFile,
  overrides: SweepColumnOverride[],
  method: SweepMethod,
): ResolvedColumn[] {
  const mapped = applyColumnOverrides(parsed.columns, overrides);
  if (mapped.problems.length) {
    throw validationFailed('The column mapping is not valid', mapped.problems);
  }
  requireColumns(method, mapped.columns, parsed.recognised.currentA);
  return mapped.columns;
}

/** Checks the mapping has what the method needs; throws a 400 naming what is missing. */
export function requireColumns(
  method: SweepMethod,
  columns: ResolvedColumn[],
  constantCurrentA: number | undefined,
): void {
  const entry = POINT_METHODS[method];
  const has = new Set(columns.map((c) => c.meaning));
  const problems: Array<{ field: string; problem: string }> = [];
  for (const alternatives of entry.requiredColumns) {
    if (!alternatives.some((m) => has.has(m))) {
      problems.push({
        field: 'columns',
        problem: `a ${method} sweep needs a ${alternatives.join(' or ')} column; none was found or mapped`,
      });
    }
  }
  const voltagesOnly = has.has('voltage') && !has.has('resistance');
  if (entry.readsVoltageOverCurrent && voltagesOnly) {
    if (!has.has('current') && constantCurrentA === undefined) {
      problems.push({
        field: 'columns',
        problem:
          'voltages need a current: map a current column or state the current in the file header',
      });
    }
  }
  if (has.has('site-x') !== has.has('site-y')) {
    problems.push({
      field: 'columns',
      problem: 'a map needs both site coordinates: map a site-x and a site-y column (mm)',
    });
  }
  for (const problem of entry.columnProblems?.(has, constantCurrentA) ?? []) {
    problems.push({ field: 'columns', problem });
  }
  for (const c of columns) {
    if (!UNITLESS.has(c.meaning) && !c.unitInfo) {
      problems.push({
        field: `columns.${c.index}.unit`,
        problem: `the unit of "${c.header}" is not known`,
      });
    }
  }
  if (problems.length) throw validationFailed('The columns do not fit the method', problems);
}

/** The columns as the API shows them (without the resolved unit). */
export function publicColumns(columns: ResolvedColumn[]): SweepColumn[] {
  return columns.map(({ index, header, meaning, unit, confidence }) => ({
    index,
    header,
    meaning,
    unit,
    confidence,
  }));
}
