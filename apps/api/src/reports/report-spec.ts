import { SPEC_VERDICT_MEANINGS, SPEC_VERDICT_WORDS, type SpecCheckDto } from '@rhotrace/api-types';

const sig = (v: number) => v.toPrecision(4);
/** Uncertainties with two significant digits (GUM 7.2.6). */
const sig2 = (v: number) => v.toPrecision(2);

/** The printed lines for the 23 °C value: value ± U (k = 2), method, verdict and the budget. */
export function specLines(spec: SpecCheckDto): string[] {
  const limits = `Spec ${spec.specMinOhmCm ?? '–'} to ${spec.specMaxOhmCm ?? '–'} ohm cm`;
  const rho = spec.resistivityAt23COhmCm;
  if (rho === null) return [`${limits}; no value at 23 °C: ${spec.reason ?? 'not available'}`];
  const u =
    spec.uncertaintyOhmCm === null
      ? ''
      : ` ± ${sig2(spec.uncertaintyOhmCm)} (k = ${spec.coverageFactor ?? 2})`;
  const how =
    spec.method === 'interpolated'
      ? 'interpolated between steps'
      : `corrected from a step ${spec.distanceK?.toFixed(2) ?? '?'} K away`;
  const verdict = spec.verdict
    ? `; ${SPEC_VERDICT_WORDS[spec.verdict]} (${SPEC_VERDICT_MEANINGS[spec.verdict]})`
    : '';
  const lines = [`${limits}; at 23 °C ${sig(rho)}${u} ohm cm, ${how}${verdict}`];
  for (const b of spec.uncertaintyBudget) {
    lines.push(
      `   ${b.source}: ${sig2(b.standardUncertaintyOhmCm)} ohm cm ` +
        `(${(100 * b.relative).toFixed(3)} %, ${b.distribution}) – ${b.note}`,
    );
  }
  return lines;
}
