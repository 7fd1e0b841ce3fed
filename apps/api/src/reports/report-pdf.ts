import {
  KIND_WORDS,
  PARAMETER_WORDS,
  alsoShownIn,
  isoStampUtc,
  type AnalysisStep,
  type FitDto,
} from '@rhotrace/api-types';
import { ACCENT, geometryText, INK, keepSpace, MUTED, OHM_CM, openPdf, sig } from './pdf-document';
import { drawAxes, roundXTicks } from './pdf-plot';
import type { ReportData } from './report.service';
import { drawHallSection } from './report-hall';
import { specLines } from './report-spec';

/** Title used in the document info (ASCII, so it can be read from the file as is). */
export function reportTitle(d: Pick<ReportData, 'waferNumber' | 'lotCode' | 'sweepId'>): string {
  return `Rhotrace sweep report: wafer ${d.waferNumber}, lot ${d.lotCode}, sweep ${d.sweepId}`;
}

function drawPlot(
  doc: PDFKit.PDFDocument,
  steps: readonly AnalysisStep[],
  box: { x0: number; y0: number; width: number; height: number },
): void {
  if (steps.length === 0) {
    doc.save().lineWidth(0.6).strokeColor(MUTED).rect(box.x0, box.y0, box.width, box.height);
    doc.stroke().restore();
    doc.fontSize(9).fillColor(MUTED);
    doc.text('No usable points', box.x0, box.y0 + box.height / 2, {
      width: box.width,
      align: 'center',
    });
    return;
  }
  const ts = steps.map((s) => s.temperatureK);
  const rhos = steps.map((s) => s.resistivityOhmCm);
  const frame = drawAxes(doc, box, {
    xTicks: roundXTicks(Math.min(...ts), Math.max(...ts)),
    xTitle: 'Temperature (K)',
    yMin: Math.min(...rhos),
    yMax: Math.max(...rhos),
    yLog: true,
    yTitle: `Resistivity (${OHM_CM}, log scale)`,
  });
  doc.save().lineWidth(1).strokeColor(ACCENT);
  steps.forEach((s, i) => {
    const x = frame.px(s.temperatureK);
    const y = frame.py(s.resistivityOhmCm);
    if (i === 0) doc.moveTo(x, y);
    else doc.lineTo(x, y);
  });
  doc.stroke().restore();
  if (steps.length <= 400) {
    doc.save().fillColor(ACCENT);
    for (const s of steps) doc.circle(frame.px(s.temperatureK), frame.py(s.resistivityOhmCm), 1.4);
    doc.fill().restore();
  }
}

/** The printed lines of one saved fit: parameters in words with their intervals, goodness. */
export function fitLines(f: FitDto): string[] {
  const window =
    f.windowMinK !== null ? `, ${sig(f.windowMinK)}–${sig(f.windowMaxK)} K` : ', whole sweep';
  const lines = [
    `Fit ${f.id}: ${KIND_WORDS[f.kind] ?? f.kind}${window}${f.converged ? '' : ', did not converge'}`,
  ];
  for (const [name, value] of Object.entries(f.parameters)) {
    const se = f.standardErrors[name];
    const ci = f.confidenceIntervals[name];
    const hasSe = se !== undefined && se !== null;
    const also = alsoShownIn(name, value);
    lines.push(
      `   ${PARAMETER_WORDS[name] ?? name} = ${sig(value)}` +
        `${hasSe ? ` ± ${sig(se, 2)}` : ''}` +
        (also
          ? ` (${sig(also.value)}${hasSe ? ` ± ${sig(alsoShownIn(name, se)?.value, 2)}` : ''} ${also.unit})`
          : '') +
        `${ci ? `   (95 %: ${sig(ci[0])} to ${sig(ci[1])})` : ''}`,
    );
  }
  const g = f.goodness;
  lines.push(
    `   R² ${sig(g.rSquared)}, ${g.count} readings, residual RMS ${sig(g.residualRms, 3)} ${g.residualUnit}`,
  );
  if (f.reading) lines.push(`   ${f.reading}`);
  if (!f.converged && f.reason) lines.push(`   ${f.reason}`);
  for (const w of f.warnings ?? []) lines.push(`   Warning: ${w}`);
  lines.push(
    `   by ${f.createdBy.name ?? `user ${f.createdBy.id}`} on ${isoStampUtc(f.createdAt)}`,
  );
  return lines;
}

/** Cautions and the disclaimer, closing every printed report. */
export function closingSection(doc: PDFKit.PDFDocument, cautions: string[], disclaimer: string) {
  keepSpace(doc, 90);
  doc.moveDown(0.8);
  doc.font('plex-bold').fontSize(11).fillColor(INK).text('Cautions', 50);
  doc.font('plex').fontSize(8.5);
  for (const c of cautions) doc.text(`• ${c}`, { width: 495 });
  doc.moveDown(0.6);
  doc.font('plex-bold').fontSize(9).fillColor(INK).text(disclaimer);
}

/** Fits, one block each, starting a page where a block would not fit. */
export function fitsSection(doc: PDFKit.PDFDocument, fits: readonly FitDto[], title = 'Fits') {
  doc.font('plex-bold').fontSize(11).fillColor(INK).text(title, 50);
  doc.font('plex').fontSize(8.5);
  if (fits.length === 0) doc.fillColor(MUTED).text('No saved fits.');
  for (const f of fits) {
    const lines = fitLines(f);
    keepSpace(doc, lines.length * 11);
    doc.fillColor(INK);
    for (const line of lines) doc.text(line, 50, undefined, { width: 495 });
    doc.moveDown(0.3);
  }
}

/** Renders the sweep report as a PDF (A4, IBM Plex Sans, vector plot). */
export function renderReportPdf(
  d: ReportData,
  options: { compress?: boolean } = {},
): Promise<Buffer> {
  const { doc, done } = openPdf(
    {
      Title: reportTitle(d),
      Subject: `Wafer ${d.waferNumber} resistivity against temperature`,
      Keywords: `wafer ${d.waferNumber}; lot ${d.lotCode}; ${d.material}`,
    },
    options,
  );
  doc
    .font('plex-bold')
    .fontSize(16)
    .fillColor(INK)
    .text(`Wafer ${d.waferNumber} · lot ${d.lotCode}`);
  doc.font('plex').fontSize(9).fillColor(MUTED);
  doc.text(storedLine(d));
  doc.moveDown(0.6).fillColor(INK).fontSize(10);
  for (const line of sweepFacts(d)) doc.text(line);
  const [value, ...budget] = specLines(d.spec);
  doc.text(value ?? '');
  doc.fontSize(8).fillColor(MUTED);
  for (const b of budget) doc.text(b, { width: 495 });

  doc.moveDown(0.8);
  keepSpace(doc, 260);
  const top = doc.y;
  drawPlot(doc, d.steps, { x0: 100, y0: top, width: 420, height: 220 });
  doc.x = 50;
  doc.y = top + 250;
  fitsSection(doc, d.fits);
  if (d.hall) drawHallSection(doc, d.hall, d.fits, d.material);
  closingSection(doc, d.cautions, d.disclaimer);
  doc.end();
  return done;
}

/** The sweep's identity line: when it was stored (to the minute, UTC) and how it was measured. */
export function storedLine(
  d: Pick<ReportData, 'sweepId' | 'sweepName' | 'measuredAt' | 'method'>,
): string {
  return `Sweep ${d.sweepId} (${d.sweepName}), stored ${isoStampUtc(d.measuredAt)}, method ${d.method}`;
}

/** Material, station and geometry in words and units. */
export function sweepFacts(d: ReportData): string[] {
  const station = d.station
    ? `${d.station.name} (probe spacing ${sig(d.station.probeSpacingCm * 10)} mm, ` +
      `${d.station.thermometer === 'platinum-rtd' ? 'platinum resistance' : d.station.thermometer} thermometer)`
    : 'not recorded';
  return [
    `Material ${d.material}${d.dopant ? `, dopant ${d.dopant}` : ''}`,
    `Station ${station}`,
    `Geometry: ${geometryText(d.geometry) || 'not recorded'}`,
  ];
}
