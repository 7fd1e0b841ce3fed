import { SPEC_VERDICT_MEANINGS, SPEC_VERDICT_WORDS, type SpecCheckDto } from '@rhotrace/api-types';

const sig = (v: number) => v.toPrecision(4);
/** An uncertainty source in words. */
const SOURCE_WORDS: Record<SpecCheckDto['uncertaintyBudget'][number]['source'], string> = {
  repeatability: 'repeatability',
  'temperature-sensor': 'temperature sensor',
  'temperature-correction': 'correction to 23 °C',
  'probe-spacing': 'probe spacing',
  thickness: 'thickness',
};
/** Uncertainties with two significant digits (GUM 7.2.6). */
const sig2 = (v: number) => v.toPrecision(2);

/** The printed lines for the 23 °C value: value ± U (k = 2), method, verdict and the budget. */
export function specLines(spec: SpecCheckDto): string[] {
  const limits = `Spec ${spec.specMinOhmCm ?? '–'} to ${spec.specMaxOhmCm ?? '–'} Ω·cm`;
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
  const lines = [`${limits}; at 23 °C ${sig(rho)}${u} Ω·cm, ${how}${verdict}`];
  for (const b of spec.uncertaintyBudget) {
    lines.push(
      `   ${SOURCE_WORDS[b.source] ?? b.source}: ${sig2(b.standardUncertaintyOhmCm)} Ω·cm ` +
        `(${(100 * b.relative).toFixed(3)} %, ${b.distribution}) – ${b.note}`,
    );
  }
  return lines;
}
