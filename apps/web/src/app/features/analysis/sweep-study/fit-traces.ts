import { seriesColour } from '../../../shared/plot/palette';
import { thinForDisplay } from '../../../shared/plot/decimate';
import { type TemperatureUnit, UNIT_SYMBOL, toUnit } from '../../../shared/temperature-unit';
import type { ShownFit } from '../fit-queue';
import { fitTraceName, fittedCurve, residualsAsResistivity } from '../fitted-curve';

/** Colours of fit traces: after the measured and model colours of the palette. */
const FIRST_FIT_COLOUR = 2;
const DASHES = ['solid', 'dash', 'dot', 'dashdot'] as const;

const style = (i: number) => ({
  color: seriesColour(FIRST_FIT_COLOUR + i),
  dash: DASHES[i % DASHES.length],
});

/** Each fit as its own line on the ρ(T) plot, named with its window (see `fitTraceName`). */
export function fitCurveTraces(fits: readonly ShownFit[], unit: TemperatureUnit): unknown[] {
  const out: unknown[] = [];
  fits.forEach((fit, i) => {
    const curve = fittedCurve(fit);
    if (curve.length < 2) return;
    const name = fitTraceName(fit, unit);
    out.push({
      type: 'scatter',
      mode: 'lines',
      name,
      x: curve.map((p) => toUnit(p.temperatureK, unit)),
      y: curve.map((p) => p.resistivityOhmCm),
      line: { ...style(i), width: 2.5 },
      hovertemplate: `%{x:.1f} ${UNIT_SYMBOL[unit]}: %{y:.4g} Ω·cm<extra>${name}</extra>`,
    });
  });
  return out;
}

/** Each fit's residuals, ln(ρ measured / ρ fitted), as its own marker series. */
export function fitResidualTraces(fits: readonly ShownFit[], unit: TemperatureUnit): unknown[] {
  const out: unknown[] = [];
  fits.forEach((fit, i) => {
    const residuals = thinForDisplay(
      residualsAsResistivity(fit),
      (r) => r.temperatureK,
      (r) => r.residual,
      'residuals',
    ).shown;
    if (residuals.length === 0) return;
    const name = `residuals of ${fitTraceName(fit, unit)}`;
    out.push({
      type: 'scatter',
      mode: 'markers',
      name,
      x: residuals.map((r) => toUnit(r.temperatureK, unit)),
      y: residuals.map((r) => r.residual),
      marker: { color: style(i).color, size: 5, symbol: 'diamond' },
      hovertemplate: `%{x:.1f} ${UNIT_SYMBOL[unit]}: %{y:.3f}<extra>${name}</extra>`,
    });
  });
  return out;
}
