/**
 * The Hall part of a sweep report: n against 1000/T and μH against T (log scales) with the
 * saved fits' curves, the carrier type, the values at 300 K and the Hall fits' readings.
 */
import { KIND_WORDS, type FitDto, type HallAnalysis, type HallAt300K } from '@rhotrace/api-types';
import { carrierDensities } from '@rhotrace/physics';
import { isSemiconductor } from '../analysis/model.service';
import { logRoundTicks } from './pdf-axes';
import { INK, MUTED, sig } from './pdf-document';
import { drawAxes, roundXTicks } from './pdf-plot';

const DATA = '#1f6f8b';
const MODEL = '#b5532a';

type Pair = [number, number];

/**
 * A plot with a linear or log x axis and a log y axis on the report's shared axes (round ticks,
 * whole decades): measured dots and an optional model line, kept inside the frame.
 */
function drawLogPlot(
  doc: PDFKit.PDFDocument,
  box: { x: number; y: number; w: number; h: number },
  measured: Pair[],
  model: Pair[],
  labels: { x: string; y: string; xLog: boolean },
): void {
  const usable = (p: Pair) =>
    Number.isFinite(p[0]) && p[1] > 0 && Number.isFinite(p[1]) && (!labels.xLog || p[0] > 0);
  const data = measured.filter(usable);
  const frameBox = { x0: box.x, y0: box.y, width: box.w, height: box.h };
  if (data.length === 0) {
    doc.save().lineWidth(0.6).strokeColor(MUTED).rect(box.x, box.y, box.w, box.h).stroke();
    doc.restore().fontSize(8).fillColor(MUTED);
    doc.text('No usable points', box.x, box.y + box.h / 2, { width: box.w, align: 'center' });
    return;
  }
  const xs = data.map((p) => p[0]);
  const ys = data.map((p) => p[1]);
  const [xMin, xMax] = [Math.min(...xs), Math.max(...xs)];
  const tx = (v: number) => (labels.xLog ? Math.log10(v) : v);
  const xTicks = labels.xLog
    ? logRoundTicks(xMin, xMax).map((v) => ({ value: Math.log10(v), label: String(v) }))
    : roundXTicks(xMin, xMax);
  const frame = drawAxes(doc, frameBox, {
    xTicks,
    xTitle: labels.x,
    yMin: Math.min(...ys),
    yMax: Math.max(...ys),
    yLog: true,
    yTitle: labels.y,
  });
  const at = (p: Pair): Pair => [frame.px(tx(p[0])), frame.py(p[1])];
  const inside = (p: Pair) => {
    const [x, y] = at(p);
    return (
      x >= box.x - 0.5 && x <= box.x + box.w + 0.5 && y >= box.y - 0.5 && y <= box.y + box.h + 0.5
    );
  };
  const line = model.filter((p) => usable(p) && inside(p));
  if (line.length > 1) {
    doc.save().lineWidth(0.9).strokeColor(MODEL);
    line.map(at).forEach(([x, y], i) => (i === 0 ? doc.moveTo(x, y) : doc.lineTo(x, y)));
    doc.stroke().restore();
  }
  doc.save().fillColor(DATA);
  for (const p of data) doc.circle(...at(p), 1.5).fill();
  doc.restore();
}

const latest = (fits: readonly FitDto[], kind: FitDto['kind']) =>
  [...fits].reverse().find((f) => f.kind === kind && f.converged);

/** n(T) of the latest converged carrier-density fit on the steps' temperatures (1000/T, n). */
function densityModel(
  material: string,
  steps: HallAnalysis['steps'],
  fit: FitDto | undefined,
): Pair[] {
  if (!fit || !isSemiconductor(material)) return [];
  const p = fit.parameters;
  const nType = (p['donorDensity'] ?? 0) >= (p['acceptorDensity'] ?? 0);
  return steps.map((s) => {
    const c = carrierDensities(
      material,
      {
        donorDensity: p['donorDensity'] ?? 0,
        acceptorDensity: p['acceptorDensity'] ?? 0,
        donorLevel: p['donorLevel'],
        acceptorLevel: p['acceptorLevel'],
      },
      s.temperatureK,
      { ionizationModel: 'constant-level' },
    );
    return [1000 / s.temperatureK, nType ? c.electrons : c.holes];
  });
}

/** mu_300 (T/300)^exponent of the latest converged hall-mobility fit over its window. */
function mobilityModel(steps: HallAnalysis['steps'], fit: FitDto | undefined): Pair[] {
  if (!fit) return [];
  const a = fit.parameters['exponent']!;
  const mu = fit.parameters['mobilityAt300K']!;
  const lo = fit.windowMinK ?? steps[0]!.temperatureK;
  const hi = fit.windowMaxK ?? steps[steps.length - 1]!.temperatureK;
  return steps
    .filter((s) => s.temperatureK >= lo && s.temperatureK <= hi)
    .map((s) => [s.temperatureK, mu * (s.temperatureK / 300) ** a]);
}

/** The values at 300 K in words, each ± its standard uncertainty where the readings give one. */
export function hallAt300KWords(
  h: Pick<
    HallAt300K,
    | 'carrierDensityAt300KCm3'
    | 'hallMobilityAt300KCm2PerVs'
    | 'carrierDensityAt300KUncertaintyCm3'
    | 'hallMobilityAt300KUncertaintyCm2PerVs'
  >,
): string {
  const withU = (value: number | null, u: number | null | undefined) =>
    `${sig(value, 3)}${u == null ? '' : ` ± ${sig(u, 2)}`}`;
  return (
    `carrier density ${withU(h.carrierDensityAt300KCm3, h.carrierDensityAt300KUncertaintyCm3)} ` +
    `per cm³, Hall mobility ` +
    `${withU(h.hallMobilityAt300KCm2PerVs, h.hallMobilityAt300KUncertaintyCm2PerVs)} cm²/(V·s)`
  );
}

/** What the ± of `hallAt300KWords` is (after `lead`), or why there is none. */
export function hallUncertaintyWords(
  h: Pick<HallAt300K, 'carrierDensityAt300KUncertaintyCm3'>,
  lead = '± ',
) {
  return h.carrierDensityAt300KUncertaintyCm3 == null
    ? 'one reading a step: no scatter to give an uncertainty'
    : `${lead}standard uncertainty, k = 1, from the readings’ scatter; the Hall factor is assumed, not in it`;
}

/**
 * The Hall section's opening sentence: carrier type, the assumed Hall factor and the values at
 * 300 K, each with its standard uncertainty where the readings give one.
 */
export function hallSummaryLine(hall: HallAnalysis): string {
  const type =
    hall.carrierType === 'mixed' ? 'mixed (the sign changes)' : `${hall.carrierType}-type`;
  return (
    `Carrier type ${type}; Hall scattering factor ${hall.hallFactor.toPrecision(4)}. At 300 K: ` +
    `${hallAt300KWords(hall)} (${hallUncertaintyWords(hall)}). Dots: step means; lines: the ` +
    'latest saved fits.'
  );
}

/** Draws the Hall section on a new page. */
export function drawHallSection(
  doc: PDFKit.PDFDocument,
  hall: HallAnalysis,
  fits: readonly FitDto[],
  material: string,
): void {
  doc.addPage();
  doc.font('plex-bold').fontSize(11).fillColor(INK).text('Hall effect', 50);
  doc.font('plex').fontSize(9).fillColor(INK);
  doc.text(hallSummaryLine(hall), 50, undefined, { width: 495 });
  const density = latest(fits, 'carrier-density');
  const mobility = latest(fits, 'hall-mobility');
  const top = doc.y + 16;
  drawLogPlot(
    doc,
    { x: 100, y: top, w: 170, h: 170 },
    hall.steps.map((s) => [1000 / s.temperatureK, s.carrierDensityCm3]),
    densityModel(material, hall.steps, density),
    { x: '1000 / T (1/K)', y: 'Carrier density (per cm³)', xLog: false },
  );
  drawLogPlot(
    doc,
    { x: 355, y: top, w: 170, h: 170 },
    hall.steps.map((s) => [s.temperatureK, s.hallMobilityCm2PerVs]),
    mobilityModel(hall.steps, mobility),
    { x: 'Temperature (K, log scale)', y: 'Hall mobility (cm²/(V·s))', xLog: true },
  );
  doc.x = 50;
  doc.y = top + 215;
  doc.font('plex').fontSize(8.5).fillColor(INK);
  for (const f of [density, mobility]) {
    if (f?.interpretation)
      doc.text(`Fit ${f.id}, ${KIND_WORDS[f.kind]}: ${f.interpretation.note}`, 50, undefined, {
        width: 495,
      });
  }
  if (hall.freezeOutWindow) {
    doc.text(
      `Freeze-out window suggested for the level: ${hall.freezeOutWindow.minK.toFixed(0)}–` +
        `${hall.freezeOutWindow.maxK.toFixed(0)} K.`,
      { width: 495 },
    );
  }
  doc.moveDown(0.6);
}
