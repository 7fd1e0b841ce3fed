/**
 * Hall-voltage headers: the four field and current reversals (`V(+B,+I)`, `V_H B+ I-`, `V_pn`)
 * and a single voltage already corrected for offsets (`V_H`, `Hall`). Read on the whole header,
 * since the signs and the `_H` would otherwise be taken for units.
 */
import type { ColumnMeaning } from '@rhotrace/api-types';

const SIGN = { '+': 'p', '-': 'n' } as const;

/** Field and current signs written before the letter (`+B -I`), then after it (`B+ I-`). */
function reversalOf(header: string): ColumnMeaning | null {
  const h = header.replace(/[−–]/g, '-');
  const prefix = [/([+-])\s*b(?![a-z])/i.exec(h), /([+-])\s*i(?![a-z])/i.exec(h)];
  const suffix = [/(?<![a-z])b\s*([+-])/i.exec(h), /(?<![a-z])i\s*([+-])/i.exec(h)];
  const found = prefix[0] && prefix[1] ? prefix : suffix[0] && suffix[1] ? suffix : null;
  if (found) {
    const b = SIGN[found[0]![1] as '+' | '-'];
    const i = SIGN[found[1]![1] as '+' | '-'];
    return `hall-voltage-${b}${i}`;
  }
  const short = /^[vu][ _]?h?[ _]?(pp|pn|np|nn)(?![a-z])/i.exec(h.trim());
  return short ? (`hall-voltage-${short[1]!.toLowerCase()}` as ColumnMeaning) : null;
}

/**
 * The Hall meaning a header names, or null. A header with both a field sign and a current sign
 * is one of the four reversals; `V_H`, `VH`, `U_H`, `V_Hall`, `Hall voltage` or `Hall` alone is
 * the corrected Hall voltage.
 */
export function hallMeaningOf(header: string): ColumnMeaning | null {
  const own = /^hall-voltage(-(pp|pn|np|nn))?$/.exec(header);
  if (own) return own[0] as ColumnMeaning;
  const reversal = reversalOf(header);
  if (reversal) return reversal;
  const name = header.replace(/\s*[([{].*$/, '').trim();
  if (/^[vu][ _-]?h(all)?(?![a-z])|^hall([ _-]?(voltage|v))?$/i.test(name)) return 'hall-voltage';
  return null;
}
