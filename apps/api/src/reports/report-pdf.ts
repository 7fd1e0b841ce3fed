import {
  KIND_WORDS,
  METHOD_WORDS,
  PARAMETER_WORDS,
  alsoShownIn,
  isoStampUtc,
  type AnalysisStep,
  type FitDto,
} from '@rhotrace/api-types';
import {
  ACCENT,
  geometryText,
  INK,
  keepSpace,
  MUTED,
  OHM_CM,
  openPdf,
  plain,
  sig,
} from './pdf-document';
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
): number {
  if (steps.length === 0) {
    doc.save().lineWidth(0.6).strokeColor(MUTED).rect(box.x0, box.y0, box.width, box.height);
    doc.stroke().restore();
    doc.fontSize(9).fillColor(MUTED);
    doc.text('No usable points', box.x0, box.y0 + box.height / 2, {
      width: box.width,
      align: 'center',
    });
    return box.y0 + box.height + 30;
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
  return frame.bottom + 6;
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
  // readings saved before resistivity was written Ω·cm in them
  if (f.reading) lines.push(`   ${f.reading.replace(/\bohm cm\b/g, OHM_CM)}`);
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
  for (const c of cautions) {
    const y = doc.y;
    doc.text('•', 50, y);
    doc.text(c, 60, y, { width: 485 });
  }
  doc.moveDown(0.6);
  doc.font('plex-bold').fontSize(9).fillColor(INK).text(disclaimer, 50);
}

/**
 * Prints one line in the page's text column; a line the builders indent (leading spaces) is set
 * as a hanging block, so its wrapped continuation stays under its first word, not the margin.
 */
export function printLine(doc: PDFKit.PDFDocument, text: string): void {
  const indented = /^\s+/.test(text);
  doc.text(text.trimStart(), indented ? 62 : 50, undefined, { width: indented ? 483 : 495 });
}

/** Fits, one block each, starting a page where a block (with the title, the first) would not fit. */
export function fitsSection(doc: PDFKit.PDFDocument, fits: readonly FitDto[], title = 'Fits') {
  const blocks = fits.map(fitLines);
  keepSpace(doc, 24 + (blocks[0]?.length ?? 1) * 11);
  doc.font('plex-bold').fontSize(11).fillColor(INK).text(title, 50);
  doc.font('plex').fontSize(8.5);
  if (fits.length === 0) doc.fillColor(MUTED).text('No saved fits.');
  for (const lines of blocks) {
    keepSpace(doc, lines.length * 11);
    doc.fillColor(INK);
    for (const line of lines) printLine(doc, line);
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
  for (const b of budget) printLine(doc, b);

  doc.moveDown(1.2);
  keepSpace(doc, 260);
  const top = doc.y;
  doc.y = drawPlot(doc, d.steps, { x0: 100, y0: top, width: 420, height: 220 });
  doc.x = 50;
  fitsSection(doc, d.fits);
  if (d.hall) drawHallSection(doc, d.hall, d.fits, d.material);
  closingSection(doc, d.cautions, d.disclaimer);
  doc.end();
  return done;
}

/** The sweep's identity line: when it was stored (to the minute, UTC) and its method in words. */
export function storedLine(
  d: Pick<ReportData, 'sweepId' | 'sweepName' | 'measuredAt' | 'method'>,
): string {
  const method = (METHOD_WORDS as Record<string, string>)[d.method] ?? d.method;
  return `Sweep ${d.sweepId} (${d.sweepName}), stored ${isoStampUtc(d.measuredAt)}, ${method}`;
}

/** A station's thermometer in words. */
const THERMOMETER_WORDS: Record<string, string> = {
  'platinum-rtd': 'platinum resistance thermometer',
  thermocouple: 'thermocouple',
  table: 'sensor read through its calibration table',
};

/** Material, station and geometry in words and units. */
export function sweepFacts(
  d: Pick<ReportData, 'material' | 'dopant' | 'station' | 'geometry'>,
): string[] {
  const station = d.station
    ? `${d.station.name} (probe spacing ${plain(d.station.probeSpacingCm * 10)} mm, ` +
      `${THERMOMETER_WORDS[d.station.thermometer] ?? `${d.station.thermometer} thermometer`})`
    : 'not recorded';
  return [
    `Material ${d.material}${d.dopant ? `, dopant ${d.dopant}` : ''}`,
    `Station ${station}`,
    `Geometry: ${geometryText(d.geometry) || 'not recorded'}`,
  ];
}
