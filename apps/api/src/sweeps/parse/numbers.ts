/** Reading numbers written with a point or a comma as the decimal mark. */

export type DecimalMark = '.' | ',';

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/**
 * The number a cell holds, `null` for an empty cell, `undefined` when it is not a number
 * (`n/a`, `OVER`, `1.2.3`). Hexadecimal, `Infinity` and `NaN` are not numbers here.
 */
export function readNumber(cell: string, decimalMark: DecimalMark): number | null | undefined {
  let s = cell.trim();
  if (s === '') return null;
  if (decimalMark === ',') s = s.replace(',', '.');
  if (!NUMBER.test(s)) return undefined;
  const value = Number(s);
  return Number.isFinite(value) ? value : undefined;
}

/** True when the cell reads as a number with either decimal mark. */
export function looksNumeric(cell: string): boolean {
  const s = cell.trim();
  return s !== '' && (NUMBER.test(s) || NUMBER.test(s.replace(',', '.')));
}
