import type { PointFinding, PointFlag, SweepAnalysisResponse } from '@rhotrace/api-types';
import { PALETTE_LIGHT } from '../../../../shared/plot/palette';
import { type TemperatureUnit, UNIT_SYMBOL, toUnit } from '../../../../shared/temperature-unit';

/** Words for each doubtful flag (the list of doubtful points and the plots' hover). */
export const FLAG_WORDS: Partial<Record<PointFlag, string>> = {
  jump: 'Jump',
  'temperature-reversal': 'Against the ramp',
  outlier: 'Outlier',
  'polarity-asymmetry': 'Polarity asymmetry',
  'self-heating': 'Self-heating',
  unsettled: 'Not settled',
  'contact-fault': 'Contact fault',
};

/** The palette colour no other role of the study plots uses (aubergine; mauve when dark). */
const FLAGGED_COLOUR = PALETTE_LIGHT[3];

/** A flagged reading as the plots draw it: where, and why in words. */
export interface FlaggedMark {
  temperatureK: number;
  resistivityOhmCm: number;
  why: string;
}

/** The studied leg's flagged readings with their reasons (none when the analysis has none). */
export function flaggedMarks(analysis: SweepAnalysisResponse | undefined): FlaggedMark[] {
  const findings = analysis?.findings ?? [];
  return (analysis?.flaggedReadings ?? []).map((r) => ({
    temperatureK: r.temperatureK,
    resistivityOhmCm: r.resistivityOhmCm,
    why: reasonsOf(findings, r.sequence),
  }));
}

function reasonsOf(findings: PointFinding[], sequence: number): string {
  const own = findings.filter((f) => f.sequence === sequence);
  const row = own[0]?.row;
  const reasons = own.map((f) => `${FLAG_WORDS[f.flag] ?? f.flag}: ${f.reason}`).join('<br>');
  return `Point ${sequence}${row === undefined ? '' : ` (row ${row})`}<br>${reasons}`;
}

/** The legend words: whether the fits leave the flagged readings out (the default). */
function legendName(includedInFits: boolean): string {
  return includedInFits ? 'flagged (fitted on request)' : 'flagged (left out of fits)';
}

/** A markers trace of its own: a crossed marker in its own colour, the reasons on hover. */
function trace(marks: FlaggedMark[], x: number[], y: number[], includedInFits: boolean) {
  return {
    type: 'scatter',
    mode: 'markers',
    name: legendName(includedInFits),
    x,
    y,
    text: marks.map((m) => m.why),
    marker: {
      color: FLAGGED_COLOUR,
      symbol: 'x-thin-open',
      size: 11,
      line: { color: FLAGGED_COLOUR, width: 2 },
    },
    hovertemplate: '%{text}<extra>flagged</extra>',
  };
}

/** The flagged readings on the ρ(T) plot; null when there are none. */
export function flaggedCurveTrace(
  marks: FlaggedMark[],
  unit: TemperatureUnit,
  includedInFits: boolean,
): Record<string, unknown> | null {
  if (marks.length === 0) return null;
  const x = marks.map((m) => toUnit(m.temperatureK, unit));
  const out = trace(
    marks,
    x,
    marks.map((m) => m.resistivityOhmCm),
    includedInFits,
  );
  out.hovertemplate = `%{x:.2f} ${UNIT_SYMBOL[unit]}: %{y:.4g} Ω·cm<br>%{text}<extra>flagged</extra>`;
  return out;
}

/** The flagged readings on the Arrhenius plot (ln ρ or ln σ against 1000/T); null when none. */
export function flaggedArrheniusTrace(
  marks: FlaggedMark[],
  quantity: 'resistivity' | 'conductivity',
  includedInFits: boolean,
): Record<string, unknown> | null {
  if (marks.length === 0) return null;
  const sign = quantity === 'resistivity' ? 1 : -1;
  return trace(
    marks,
    marks.map((m) => 1000 / m.temperatureK),
    marks.map((m) => sign * Math.log(m.resistivityOhmCm)),
    includedInFits,
  );
}
