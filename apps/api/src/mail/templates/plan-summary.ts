/**
 * The measurement plan as it appears in the assignment e-mail: a short summary, the current
 * ranges and the step table, in text and in HTML.
 */
import type { PlannerResponse } from '@rhotrace/api-types';
import { escapeHtml } from './escape-html';

/** A value in engineering notation with an SI prefix, three significant figures: 4.53e-4 A → 453 µA. */
export function engineering(value: number, unit: string): string {
  if (value === 0 || !Number.isFinite(value)) return `${value} ${unit}`;
  const prefixes: Array<[number, string]> = [
    [1e-12, 'p'],
    [1e-9, 'n'],
    [1e-6, 'µ'],
    [1e-3, 'm'],
    [1, ''],
    [1e3, 'k'],
    [1e6, 'M'],
  ];
  let [scale, prefix] = prefixes[0]!;
  for (const [s, p] of prefixes) if (Math.abs(value) >= s * (1 - 5e-4)) [scale, prefix] = [s, p];
  return `${Number((value / scale).toPrecision(3))} ${prefix}${unit}`;
}

const hours = (s: number) => `${(s / 3600).toFixed(1)} h`;

function headline(plan: PlannerResponse): string {
  const first = plan.steps[0]!;
  const last = plan.steps[plan.steps.length - 1]!;
  return (
    `${plan.steps.length} steps from ${first.temperatureK.toFixed(1)} K to ` +
    `${last.temperatureK.toFixed(1)} K on ${plan.basis.stationName}, about ` +
    `${hours(plan.estimatedDurationS)} (dwell ${plan.basis.dwellS} s, ramp ` +
    `${plan.basis.rampKPerMin} K/min)`
  );
}

const rangeLine = (r: PlannerResponse['currentRanges'][number]) =>
  `${engineering(r.currentA, 'A')} from ${r.fromK.toFixed(1)} K to ${r.toK.toFixed(1)} K ` +
  `(${r.stepCount} steps, set by ${r.limitedBy})`;

/** Text lines of the plan for the e-mail's plain part. */
export function planText(plan: PlannerResponse): string[] {
  return [
    'Measurement plan:',
    `  ${headline(plan)}`,
    '  Probe current:',
    ...plan.currentRanges.map((r) => `  - ${rangeLine(r)}`),
    '  Steps (T, expected voltage, current):',
    ...plan.steps.map(
      (s) =>
        `  ${s.temperatureK.toFixed(2).padStart(8)} K  ${engineering(s.voltageV, 'V').padStart(9)}` +
        `  ${engineering(s.currentA, 'A')}`,
    ),
    ...plan.warnings.map((w) => `  Note: ${w}`),
  ];
}

/** HTML of the plan for the e-mail's HTML part (all values escaped). */
export function planHtml(plan: PlannerResponse): string[] {
  const cell = (v: string) => `<td style="padding: 0 0.6em">${escapeHtml(v)}</td>`;
  return [
    '<h2 style="font-size: 1.1em">Measurement plan</h2>',
    `<p>${escapeHtml(headline(plan))}</p>`,
    '<ul>',
    ...plan.currentRanges.map((r) => `<li>Probe current ${escapeHtml(rangeLine(r))}</li>`),
    '</ul>',
    '<table style="border-collapse: collapse">',
    '<tr><th align="left">T</th><th align="left">Expected voltage</th><th align="left">Current</th></tr>',
    ...plan.steps.map(
      (s) =>
        `<tr>${cell(`${s.temperatureK.toFixed(2)} K`)}${cell(engineering(s.voltageV, 'V'))}` +
        `${cell(engineering(s.currentA, 'A'))}</tr>`,
    ),
    '</table>',
    ...plan.warnings.map((w) => `<p><strong>Note:</strong> ${escapeHtml(w)}</p>`),
  ];
}
