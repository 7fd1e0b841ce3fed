/**
 * The uncertainty budget of a 23 °C resistivity (JCGM 100:2008): within-step scatter,
 * thermometer tolerance, the temperature correction, probe spacing and thickness tolerances.
 * Each tolerance given as +/- a is the half-width of a rectangular distribution, u = a / sqrt(3)
 * (GUM 4.3.7); contributions are combined as uncorrelated (GUM 5.1.2) and expanded with k = 2.
 */
import {
  LENGTH_UNIT_OF,
  cmToLength,
  type SweepGeometry,
  type Thermometer,
  type UncertaintyContribution,
  type ValueUncertainty,
} from '@rhotrace/api-types';
import {
  combinedStandardUncertainty,
  COVERAGE_FACTOR,
  fourPointProbe,
  iec60751Tolerance,
  rectangularStandardUncertainty,
  ZERO_CELSIUS_K,
} from '@rhotrace/physics';
import type { ValueAt23C } from './value-at-23c';

/** What the budget reads besides the value: how the sweep was converted and its records. */
export interface BudgetContext {
  /** The sweep's measurement method (`SweepMethod`). */
  method: string;
  geometry: SweepGeometry | null;
  station: {
    name: string;
    thermometer: Thermometer;
    probeSpacingToleranceCm: number | null;
    temperatureToleranceK: number | null;
  } | null;
  /** Thickness of the wafer (or its lot) when the geometry does not carry one, cm. */
  thicknessCm: number | null;
  thicknessToleranceCm: number | null;
}

/**
 * Thermocouple tolerance assumed when a station states none: IEC 60584-1 class 2 for types K,
 * N and J, +/- max(2.5 °C, 0.0075 |t|) (from memory).
 */
function thermocoupleTolerance(temperatureC: number): number {
  return Math.max(2.5, 0.0075 * Math.abs(temperatureC));
}

/** The thermometer's tolerance (half-width, K) at the steps used, and where it comes from. */
function sensorTolerance(ctx: BudgetContext, temperaturesK: readonly number[]) {
  const worstC = Math.max(...temperaturesK.map((t) => Math.abs(t - ZERO_CELSIUS_K)));
  const s = ctx.station;
  if (s?.temperatureToleranceK != null) {
    return { halfWidthK: s.temperatureToleranceK, from: `stated for station ${s.name}` };
  }
  if (s?.thermometer === 'thermocouple') {
    return {
      halfWidthK: thermocoupleTolerance(worstC),
      from: `thermocouple of station ${s.name}, IEC 60584-1 class 2 assumed`,
    };
  }
  return {
    halfWidthK: iec60751Tolerance(worstC, 'B'),
    from: s
      ? `platinum RTD of station ${s.name}, IEC 60751 class B assumed`
      : 'no station recorded; a platinum RTD of IEC 60751 class B assumed',
  };
}

/** d ln(rho) / d ln(x) of the four-point conversion for spacing or thickness (central difference). */
function fourPointSensitivity(geometry: SweepGeometry, which: 'spacingCm' | 'thicknessCm') {
  const s = geometry.spacingCm;
  const t = geometry.thicknessCm;
  if (s === undefined || t === undefined) return null;
  const h = 1e-4;
  const at = (scale: number) =>
    fourPointProbe({
      voltageV: 1,
      currentA: 1,
      spacingCm: which === 'spacingCm' ? s * scale : s,
      thicknessCm: which === 'thicknessCm' ? t * scale : t,
      ...(geometry.diameterCm !== undefined ? { diameterCm: geometry.diameterCm } : {}),
    }).resistivityOhmCm;
  try {
    return (Math.log(at(1 + h)) - Math.log(at(1 - h))) / (2 * h);
  } catch (error) {
    // At the edge of the conversion's range (a diameter of just 3 spacings) step inwards only.
    if (!(error instanceof RangeError)) throw error;
    const inward = which === 'spacingCm' ? 1 - h : 1 + h;
    return (Math.log(at(inward)) - Math.log(at(1))) / (inward - 1);
  }
}

const line = (
  source: UncertaintyContribution['source'],
  relative: number,
  valueOhmCm: number,
  distribution: UncertaintyContribution['distribution'],
  note: string,
): UncertaintyContribution => ({
  source,
  standardUncertaintyOhmCm: relative * valueOhmCm,
  relative,
  distribution,
  note,
});

const fmt = (x: number) => x.toPrecision(3);

/** A stored length (cm) in the unit its field is read in: 0.0025 cm of thickness is "25.0 µm". */
const lengthText = (lengthCm: number, field: string) => {
  const unit = LENGTH_UNIT_OF[field] ?? 'cm';
  return `${fmt(cmToLength(lengthCm, unit))} ${unit}`;
};

/** The probe spacing line: four-point only, zero elsewhere because the method does not use it. */
function spacingLine(value: number, ctx: BudgetContext): UncertaintyContribution | null {
  if (ctx.method !== 'four-point' || !ctx.geometry?.spacingCm) return null;
  const tol = ctx.station?.probeSpacingToleranceCm ?? null;
  if (tol === null) {
    return line(
      'probe-spacing',
      0,
      value,
      'rectangular',
      'Not assessed: no probe spacing tolerance is stated for the station',
    );
  }
  const c = fourPointSensitivity(ctx.geometry, 'spacingCm') ?? 0;
  const u = rectangularStandardUncertainty(tol) / ctx.geometry.spacingCm;
  return line(
    'probe-spacing',
    Math.abs(c) * u,
    value,
    'rectangular',
    `±${lengthText(tol, 'spacingCm')} on ${lengthText(ctx.geometry.spacingCm, 'spacingCm')}; ` +
      `sensitivity ${c.toFixed(3)} ` +
      '(d ln ρ / d ln s of the four-point conversion with this geometry)',
  );
}

/** The thickness line, with the conversion's sensitivity to thickness. */
function thicknessLine(value: number, ctx: BudgetContext): UncertaintyContribution {
  const t = ctx.geometry?.thicknessCm ?? ctx.thicknessCm;
  const tol = ctx.thicknessToleranceCm;
  if (tol === null) {
    return line(
      'thickness',
      0,
      value,
      'rectangular',
      'Not assessed: the lot states no thickness tolerance',
    );
  }
  if (!t) {
    return line('thickness', 0, value, 'rectangular', 'Not assessed: no thickness is recorded');
  }
  const c =
    ctx.method === 'four-point' && ctx.geometry
      ? (fourPointSensitivity(ctx.geometry, 'thicknessCm') ?? 1)
      : 1;
  const why =
    ctx.method === 'four-point'
      ? 'd ln ρ / d ln t of the four-point conversion with this geometry'
      : ctx.method === 'resistivity'
        ? 'the file gives resistivity; taken as proportional to thickness'
        : 'resistivity is proportional to thickness';
  return line(
    'thickness',
    Math.abs(c) * (rectangularStandardUncertainty(tol) / t),
    value,
    'rectangular',
    `±${lengthText(tol, 'thicknessCm')} on ${lengthText(t, 'thicknessCm')}; ` +
      `sensitivity ${c.toFixed(3)} (${why})`,
  );
}

/** The budget and expanded uncertainty (k = 2) of a 23 °C value; empty without a value. */
export function uncertaintyBudget(v: ValueAt23C, ctx: BudgetContext): ValueUncertainty {
  const value = v.resistivityOhmCm;
  if (value === null)
    return { uncertaintyOhmCm: null, coverageFactor: null, uncertaintyBudget: [] };
  const budget: UncertaintyContribution[] = [];
  budget.push(
    v.repeatability
      ? line('repeatability', v.repeatability.relative, value, 'normal', v.repeatability.note)
      : line('repeatability', 0, value, 'normal', 'Not assessed: every step has a single reading'),
  );
  const sensor = sensorTolerance(ctx, v.usedTemperaturesK);
  const slope = v.logSlopePerK ?? 0;
  budget.push(
    line(
      'temperature-sensor',
      Math.abs(slope) * rectangularStandardUncertainty(sensor.halfWidthK),
      value,
      'rectangular',
      `±${sensor.halfWidthK.toFixed(2)} K (${sensor.from}) times the slope ` +
        `${(100 * slope).toFixed(2)} %/K`,
    ),
  );
  budget.push(
    v.correction
      ? line(
          'temperature-correction',
          v.correction.relative,
          value,
          v.correction.distribution,
          v.correction.note,
        )
      : line(
          'temperature-correction',
          0,
          value,
          'rectangular',
          'Not assessed: no third step near 23 °C to bound the interpolation',
        ),
  );
  const spacing = spacingLine(value, ctx);
  if (spacing) budget.push(spacing);
  budget.push(thicknessLine(value, ctx));
  const uc = combinedStandardUncertainty(budget.map((b) => b.standardUncertaintyOhmCm));
  return {
    uncertaintyOhmCm: COVERAGE_FACTOR * uc,
    coverageFactor: COVERAGE_FACTOR,
    uncertaintyBudget: budget,
  };
}
