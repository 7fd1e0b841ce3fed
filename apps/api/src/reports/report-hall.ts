/**
 * The Hall part of a sweep report: n against 1000/T and mu_H against T (log scales) with the
 * saved fits' curves, the carrier type, the values at 300 K and the Hall fits' readings.
 */
import type { FitDto, HallAnalysis } from '@rhotrace/api-types';
import { carrierDensities } from '@rhotrace/physics';
import { isSemiconductor } from '../analysis/model.service';

const INK = '#1d2733';
const MUTED = '#5b6773';
const DATA = '#1f6f8b';
const MODEL = '#b5532a';

type Pair = [number, number];

/** A plot with a linear or log x axis and a log y axis: measured dots, optional model line. */
function drawLogPlot(
  doc: PDFKit.PDFDocument,
  box: { x: number; y: number; w: number; h: number },
  data: Pair[],
  model: Pair[],
  labels: { x: string; y: string; xLog: boolean },
): void {
  const { x: x0, y: y0, w, h } = box;
  doc.save().lineWidth(0.6).strokeColor(MUTED).rect(x0, y0, w, h).stroke().restore();
  const tx = (v: number) => (labels.xLog ? Math.log10(v) : v);
  const xs = data.map((p) => tx(p[0]));
  const ys = data.map((p) => Math.log10(p[1]));
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs) > xMin ? Math.max(...xs) : xMin + 1;
  const yMin = Math.floor(Math.min(...ys));
  const yMax = Math.max(Math.ceil(Math.max(...ys)), yMin + 1);
  const px = (v: number) => x0 + ((tx(v) - xMin) / (xMax - xMin)) * w;
  const py = (v: number) => y0 + h - ((Math.log10(v) - yMin) / (yMax - yMin)) * h;
  doc.fontSize(7).fillColor(MUTED);
  const every = Math.max(1, Math.ceil((yMax - yMin) / 6));
  for (let l = yMin; l <= yMax; l += every) {
    doc.text(`1e${l}`, x0 - 34, py(10 ** l) - 4, { width: 30, align: 'right' });
  }
  for (let i = 0; i <= 4; i += 1) {
    const v = xMin + ((xMax - xMin) * i) / 4;
    const shown = labels.xLog ? 10 ** v : v;
    doc.text(shown.toPrecision(3), x0 + (i / 4) * w - 20, y0 + h + 3, {
      width: 40,
      align: 'center',
    });
  }
  doc.text(labels.x, x0, y0 + h + 13, { width: w, align: 'center' });
  doc.text(labels.y, x0, y0 - 11, { width: w, align: 'left' });
  const inside = (p: Pair) => Math.log10(p[1]) >= yMin && Math.log10(p[1]) <= yMax;
  const line = model.filter(inside);
  if (line.length > 1) {
    doc.save().lineWidth(0.9).strokeColor(MODEL);
    line.forEach((p, i) =>
      i === 0 ? doc.moveTo(px(p[0]), py(p[1])) : doc.lineTo(px(p[0]), py(p[1])),
    );
    doc.stroke().restore();
  }
  doc.save().fillColor(DATA);
  for (const p of data) doc.circle(px(p[0]), py(p[1]), 1.5).fill();
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

const sig = (v: number | null) => (v === null ? '–' : v.toPrecision(3));

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
  const type =
    hall.carrierType === 'mixed' ? 'mixed (the sign changes)' : `${hall.carrierType}-type`;
  doc.text(
    `Carrier type ${type}; Hall factor r_H = ${hall.hallFactor.toPrecision(4)}. At 300 K: ` +
      `n = ${sig(hall.carrierDensityAt300KCm3)} cm^-3, mu_H = ${sig(hall.hallMobilityAt300KCm2PerVs)} ` +
      'cm²/(V s). Dots: step means; lines: the latest saved fits.',
    { width: 495 },
  );
  const density = latest(fits, 'carrier-density');
  const mobility = latest(fits, 'hall-mobility');
  const top = doc.y + 20;
  drawLogPlot(
    doc,
    { x: 90, y: top, w: 190, h: 170 },
    hall.steps.map((s) => [1000 / s.temperatureK, s.carrierDensityCm3]),
    densityModel(material, hall.steps, density),
    { x: '1000 / T (1/K)', y: 'carrier density (cm^-3)', xLog: false },
  );
  drawLogPlot(
    doc,
    { x: 340, y: top, w: 190, h: 170 },
    hall.steps.map((s) => [s.temperatureK, s.hallMobilityCm2PerVs]),
    mobilityModel(hall.steps, mobility),
    { x: 'temperature (K, log)', y: 'Hall mobility (cm²/(V s))', xLog: true },
  );
  doc.x = 50;
  doc.y = top + 200;
  doc.font('plex').fontSize(8.5).fillColor(INK);
  for (const f of [density, mobility]) {
    if (f?.interpretation)
      doc.text(`Fit ${f.id} (${f.kind}): ${f.interpretation.note}`, { width: 495 });
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
