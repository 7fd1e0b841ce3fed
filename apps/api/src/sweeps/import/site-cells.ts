/** A row's map-site cells: coordinates, a site number and a label (files of wafer maps). */
import type { ResolvedColumn } from '../parse';
import type { RowSite } from './import-types';

/** Longest site label kept (the column's width). */
const SITE_LABEL_LENGTH = 64;

/** The site columns of a file, each null when not mapped. */
export type SiteColumns = Record<'x' | 'y' | 'number' | 'label', ResolvedColumn | null>;

/**
 * The row's site: coordinates when the file has site-x and site-y (they win over a site
 * number), else a whole site number; null for a file without sites. `cell` reads a required
 * number (null after noting its own problem). Missing cells are problems, since a map reading
 * without its place cannot be shown; a site number that is not whole is returned as a problem.
 */
export function readSiteCells(
  cells: string[],
  columns: SiteColumns,
  cell: (c: ResolvedColumn) => number | null,
): RowSite | null | { problem: string } {
  const { x, y, number, label: labelColumn } = columns;
  if (!(x && y) && !number) return null;
  const labelText = labelColumn ? (cells[labelColumn.index] ?? '').trim() : '';
  const label = labelText ? labelText.slice(0, SITE_LABEL_LENGTH) : null;
  if (x && y) {
    const xMm = cell(x);
    const yMm = cell(y);
    return xMm === null || yMm === null ? null : { kind: 'xy', xMm, yMm, label };
  }
  const n = cell(number!);
  if (n === null) return null;
  if (!Number.isInteger(n) || n < 1)
    return { problem: `the site number must be a whole number from 1 (${n})` };
  return { kind: 'number', number: n, label };
}
