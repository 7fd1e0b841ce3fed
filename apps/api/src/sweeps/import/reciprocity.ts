/**
 * Van der Pauw reciprocity: a file may give each configuration's reading twice, the second with
 * current and voltage contacts swapped (R_AB,CD and R_CD,AB). By the reciprocity theorem the two
 * are equal on any sample (van der Pauw, Philips Res. Rep. 13, 1, 1958), so the point takes their
 * mean, as ASTM F76 averages its readings, and a pair further apart than `RECIPROCITY_LIMIT`
 * flags the point `contact-fault`.
 */
import { reciprocityDifference } from '@rhotrace/physics';
import type { PointInput } from './methods';

/** Reciprocal readings further apart than this (relative to their mean) are a contact fault. */
export const RECIPROCITY_LIMIT = 0.02;

/** One configuration's reading and its reciprocal, as the reason names them. */
const CONFIGURATIONS = [
  { key: 'resistanceOhm', reciprocal: 'resistanceReciprocalOhm', names: 'R_AB,CD and R_CD,AB' },
  { key: 'resistanceBOhm', reciprocal: 'resistanceBReciprocalOhm', names: 'R_BC,DA and R_DA,BC' },
] as const;

/**
 * The point's input with each reciprocal pair averaged, and why it is a contact fault (null when
 * every pair agrees within `RECIPROCITY_LIMIT`, or the file has no reciprocal readings).
 */
export function withReciprocals(input: PointInput): { input: PointInput; fault: string | null } {
  const out: PointInput = { ...input };
  const faults: string[] = [];
  for (const c of CONFIGURATIONS) {
    const reading = input[c.key];
    const reciprocal = input[c.reciprocal];
    if (!reading || !reciprocal) continue;
    out[c.key] = (reading + reciprocal) / 2;
    const difference = reciprocityDifference(reading, reciprocal);
    if (difference > RECIPROCITY_LIMIT) {
      faults.push(`${c.names} differ by ${(difference * 100).toFixed(1)} %`);
    }
  }
  const fault = faults.length
    ? `reciprocal readings ${faults.join('; ')} (more than ${RECIPROCITY_LIMIT * 100} %; they must be equal by reciprocity: a non-ohmic or misplaced contact)`
    : null;
  return { input: out, fault };
}
