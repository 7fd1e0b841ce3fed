/**
 * What only the whole of a Hall sweep shows: whether its carrier type changes sign (mixed
 * conduction near the intrinsic range), and the Hall factor it was computed with, for the
 * parse report.
 */
import type { HallFactorName, HallImportReport, SweepMethod } from '@rhotrace/api-types';
import { HALL_SCATTERING_FACTORS } from '@rhotrace/physics';
import { badRequest } from '../../errors';
import type { ConvertedPoint } from './import-types';
import type { MethodSettings } from './methods';

const NAMED_FACTORS: Readonly<Record<HallFactorName, number>> = {
  'acoustic-phonon': HALL_SCATTERING_FACTORS.acousticPhonon,
  'ionized-impurity': HALL_SCATTERING_FACTORS.ionizedImpurity,
  degenerate: HALL_SCATTERING_FACTORS.degenerate,
};

/** The Hall factor of an upload: a number, a named factor, or 1 (refused for other methods). */
export function hallSettings(
  method: SweepMethod,
  requested: number | HallFactorName | undefined,
): MethodSettings & { hallFactorName: HallFactorName | null } {
  if (requested !== undefined && method !== 'hall') {
    throw badRequest('hallFactor applies to hall sweeps only', [
      { field: 'body.hallFactor', problem: `a ${method} sweep has no Hall factor; leave it out` },
    ]);
  }
  if (typeof requested === 'string') {
    return { hallFactor: NAMED_FACTORS[requested], hallFactorName: requested };
  }
  return {
    hallFactor: requested ?? 1,
    hallFactorName: requested === undefined ? 'degenerate' : null,
  };
}

/** Temperature span of points of one carrier type, K. */
interface Span {
  minK: number;
  maxK: number;
  count: number;
}

/** Watches a Hall sweep's points as they pass to the store. */
export class HallSummary {
  private readonly spans: Partial<Record<'n' | 'p', Span>> = {};

  constructor(
    private readonly settings: ReturnType<typeof hallSettings>,
    private readonly fromReversals: boolean,
  ) {}

  /** Notes the points' carrier types and hands them on unchanged. */
  addAll(points: ConvertedPoint[]): ConvertedPoint[] {
    for (const p of points) {
      const type = p.quantities?.carrierType;
      if (type !== 'n' && type !== 'p') continue;
      const span = (this.spans[type] ??= { minK: p.temperatureK, maxK: p.temperatureK, count: 0 });
      span.minK = Math.min(span.minK, p.temperatureK);
      span.maxK = Math.max(span.maxK, p.temperatureK);
      span.count += 1;
    }
    return points;
  }

  /** The mixed-conduction warning, when the sign changes. */
  get warnings(): string[] {
    const { n, p } = this.spans;
    if (!n || !p) return [];
    const span = (s: Span) => `${s.count} point(s) between ${fmt(s.minK)} and ${fmt(s.maxK)} K`;
    return [
      `The carrier type changes sign within this sweep (n-type: ${span(n)}; p-type: ${span(p)}): ` +
        'both carriers conduct there (mixed conduction, usually near the intrinsic range), so ' +
        'the single-carrier density and Hall mobility are not valid at those points. Every ' +
        'point was kept; fit carrier density and mobility below that range.',
    ];
  }

  /** The parse report's `hall` entry. */
  get report(): HallImportReport {
    return {
      hallFactor: this.settings.hallFactor,
      hallFactorName: this.settings.hallFactorName,
      mixedConduction: Boolean(this.spans.n && this.spans.p),
      hallVoltageFrom: this.fromReversals ? 'reversals' : 'corrected-column',
    };
  }
}

const fmt = (k: number) => (Math.round(k * 10) / 10).toString();
