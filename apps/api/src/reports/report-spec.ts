import { SPEC_VERDICT_MEANINGS, SPEC_VERDICT_WORDS, type SpecCheckDto } from '@rhotrace/api-types';
import { OHM_CM, plain, sig } from './pdf-document';

/** An uncertainty source in words. */
const SOURCE_WORDS: Record<SpecCheckDto['uncertaintyBudget'][number]['source'], string> = {
  repeatability: 'repeatability',
  'temperature-sensor': 'temperature sensor',
  'temperature-correction': 'correction to 23 °C',
  'probe-spacing': 'probe spacing',
  thickness: 'thickness',
};
/** Uncertainties with two significant digits (GUM 7.2.6). */
const sig2 = (v: number) => sig(v, 2);
/** A sentence set inside brackets after other words. */
const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);

/** The printed lines for the 23 °C value: value ± U (k = 2), method, verdict and the budget. */
export function specLines(spec: SpecCheckDto): string[] {
  const limits = `Spec ${plain(spec.specMinOhmCm, 6)} to ${plain(spec.specMaxOhmCm, 6)} ${OHM_CM}`;
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
    ? `; ${SPEC_VERDICT_WORDS[spec.verdict]} (${lowerFirst(SPEC_VERDICT_MEANINGS[spec.verdict]).replace(/\.$/, '')})`
    : '';
  const lines = [`${limits}; at 23 °C ${sig(rho)}${u} ${OHM_CM}, ${how}${verdict}`];
  for (const b of spec.uncertaintyBudget) {
    const source = SOURCE_WORDS[b.source] ?? b.source;
    // A source the records give no tolerance for is not a zero contribution: say so instead.
    lines.push(
      b.standardUncertaintyOhmCm === 0 && /^Not assessed/.test(b.note)
        ? `   ${source}: ${lowerFirst(b.note)}`
        : `   ${source}: ${sig2(b.standardUncertaintyOhmCm)} ${OHM_CM} ` +
            `(${(100 * b.relative).toPrecision(2)} %, ${b.distribution}) – ${b.note}`,
    );
  }
  return lines;
}
