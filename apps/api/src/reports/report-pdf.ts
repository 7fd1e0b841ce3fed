import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import type { AnalysisStep, FitDto } from '@rhotrace/api-types';
import type { ReportData } from './report.service';
import { drawHallSection } from './report-hall';
import { specLines } from './report-spec';

const require = createRequire(import.meta.url);
/** IBM Plex Sans static TTFs from the installed font package (no machine paths). */
const FONTS = {
  regular:
    require.resolve('@expo-google-fonts/ibm-plex-sans/400Regular/IBMPlexSans_400Regular.ttf'),
  bold: require.resolve('@expo-google-fonts/ibm-plex-sans/600SemiBold/IBMPlexSans_600SemiBold.ttf'),
};

const INK = '#1d2733';
const MUTED = '#5b6773';
const ACCENT = '#1f6f8b';

/** Formats a number to `digits` significant figures (exponent form for very large/small). */
function sig(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  const a = Math.abs(value);
  return a !== 0 && (a < 1e-3 || a >= 1e5)
    ? value.toExponential(digits - 1)
    : value.toPrecision(digits);
}

/** Title used in the document info (ASCII, so it can be read from the file as is). */
export function reportTitle(d: Pick<ReportData, 'waferNumber' | 'lotCode' | 'sweepId'>): string {
  return `Rhotrace sweep report: wafer ${d.waferNumber}, lot ${d.lotCode}, sweep ${d.sweepId}`;
}

function drawPlot(
  doc: PDFKit.PDFDocument,
  steps: readonly AnalysisStep[],
  x0: number,
  y0: number,
  w: number,
  h: number,
): void {
  doc.save().lineWidth(0.6).strokeColor(MUTED).rect(x0, y0, w, h).stroke().restore();
  if (steps.length === 0) {
    doc
      .fontSize(9)
      .fillColor(MUTED)
      .text('No usable points', x0, y0 + h / 2, { width: w, align: 'center' });
    return;
  }
  const ts = steps.map((s) => s.temperatureK);
  const logs = steps.map((s) => Math.log10(s.resistivityOhmCm));
  let tMin = Math.min(...ts);
  let tMax = Math.max(...ts);
  if (tMax === tMin) {
    tMin -= 1;
    tMax += 1;
  }
  let lMin = Math.floor(Math.min(...logs));
  let lMax = Math.ceil(Math.max(...logs));
  if (lMax === lMin) {
    lMin -= 1;
    lMax += 1;
  }
  const px = (t: number) => x0 + ((t - tMin) / (tMax - tMin)) * w;
  const py = (l: number) => y0 + h - ((l - lMin) / (lMax - lMin)) * h;

  doc.fontSize(7).fillColor(MUTED);
  const decadeStep = Math.max(1, Math.ceil((lMax - lMin) / 8));
  for (let l = lMin; l <= lMax; l += decadeStep) {
    doc
      .save()
      .lineWidth(0.3)
      .strokeColor('#d5dbe1')
      .moveTo(x0, py(l))
      .lineTo(x0 + w, py(l))
      .stroke()
      .restore();
    doc.text(`1e${l}`, x0 - 34, py(l) - 4, { width: 30, align: 'right' });
  }
  for (let i = 0; i <= 5; i += 1) {
    const t = tMin + ((tMax - tMin) * i) / 5;
    doc
      .save()
      .lineWidth(0.3)
      .strokeColor('#d5dbe1')
      .moveTo(px(t), y0)
      .lineTo(px(t), y0 + h)
      .stroke()
      .restore();
    doc.text(t.toFixed(0), px(t) - 20, y0 + h + 3, { width: 40, align: 'center' });
  }
  doc.text('temperature (K)', x0, y0 + h + 14, { width: w, align: 'center' });
  doc.save().rotate(-90, { origin: [x0 - 42, y0 + h / 2] });
  doc.text('resistivity (ohm cm, log scale)', x0 - 42 - h / 2, y0 + h / 2 - 4, {
    width: h,
    align: 'center',
  });
  doc.restore();

  doc.save().lineWidth(1).strokeColor(ACCENT);
  steps.forEach((s, i) => {
    const x = px(s.temperatureK);
    const y = py(Math.log10(s.resistivityOhmCm));
    if (i === 0) doc.moveTo(x, y);
    else doc.lineTo(x, y);
  });
  doc.stroke().restore();
  if (steps.length <= 400) {
    doc.save().fillColor(ACCENT);
    for (const s of steps)
      doc.circle(px(s.temperatureK), py(Math.log10(s.resistivityOhmCm)), 1.4).fill();
    doc.restore();
  }
}

function fitLines(f: FitDto): string[] {
  const head =
    `Fit ${f.id} (${f.kind})${f.windowMinK !== null ? `, ${sig(f.windowMinK)}–${sig(f.windowMaxK)} K` : ''}` +
    `${f.converged ? '' : ', did not converge'}`;
  const lines = [head];
  for (const [name, value] of Object.entries(f.parameters)) {
    const se = f.standardErrors[name];
    const ci = f.confidenceIntervals[name];
    lines.push(
      `   ${name} = ${sig(value)}${se !== undefined && se !== null ? ` ± ${sig(se, 2)}` : ''}` +
        `${ci ? `   (95 %: ${sig(ci[0])} to ${sig(ci[1])})` : ''}`,
    );
  }
  const g = f.goodness;
  lines.push(
    `   R² ${sig(g.rSquared)}, ${g.count} points, residual RMS ${sig(g.residualRms, 3)} ${g.residualUnit}`,
  );
  if (f.reading) lines.push(`   ${f.reading}`);
  if (!f.converged && f.reason) lines.push(`   ${f.reason}`);
  lines.push(
    `   model ${f.modelVersion}, by ${f.createdBy.name ?? f.createdBy.id} on ${f.createdAt.slice(0, 10)}`,
  );
  return lines;
}

/** Renders the sweep report as a PDF (A4, IBM Plex Sans, vector plot). */
export function renderReportPdf(
  d: ReportData,
  options: { compress?: boolean } = {},
): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 50,
    compress: options.compress ?? true,
    info: {
      Title: reportTitle(d),
      Author: 'Rhotrace',
      Subject: `Wafer ${d.waferNumber} resistivity against temperature`,
      Keywords: `wafer ${d.waferNumber}; lot ${d.lotCode}; ${d.material}`,
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.registerFont('plex', FONTS.regular);
  doc.registerFont('plex-bold', FONTS.bold);

  doc
    .font('plex-bold')
    .fontSize(16)
    .fillColor(INK)
    .text(`Wafer ${d.waferNumber} · lot ${d.lotCode}`);
  doc
    .font('plex')
    .fontSize(9)
    .fillColor(MUTED)
    .text(
      `Sweep ${d.sweepId} (${d.sweepName}), stored ${d.measuredAt.slice(0, 10)}, method ${d.method}`,
    );
  doc.moveDown(0.6).fillColor(INK).fontSize(10);
  const geometry = Object.entries(d.geometry)
    .filter(([, v]) => typeof v === 'number' || typeof v === 'string')
    .map(([k, v]) => `${k} ${typeof v === 'number' ? sig(v) : v}`)
    .join(', ');
  const facts = [
    `Material ${d.material}${d.dopant ? `, dopant ${d.dopant}` : ''}`,
    `Station ${d.station ? `${d.station.name} (probe spacing ${sig(d.station.probeSpacingCm)} cm, ${d.station.thermometer})` : 'not recorded'}`,
    `Geometry ${geometry || 'not recorded'}`,
  ];
  for (const f of facts) doc.text(f);
  const [value, ...budget] = specLines(d.spec);
  doc.text(value ?? '');
  doc.fontSize(8).fillColor(MUTED);
  for (const b of budget) doc.text(b, { width: 495 });
  doc.fontSize(10).fillColor(INK);

  doc.moveDown(0.8);
  const top = doc.y;
  drawPlot(doc, d.steps, 100, top, 420, 220);
  doc.x = 50;
  doc.y = top + 250;

  doc.font('plex-bold').fontSize(11).fillColor(INK).text('Fits', 50);
  doc.font('plex').fontSize(8.5);
  if (d.fits.length === 0) doc.fillColor(MUTED).text('No saved fits.');
  for (const f of d.fits) {
    doc.fillColor(INK);
    for (const line of fitLines(f)) doc.text(line, { width: 495 });
    doc.moveDown(0.3);
  }

  if (d.hall) drawHallSection(doc, d.hall, d.fits, d.material);
  doc.moveDown(0.8);
  doc.font('plex-bold').fontSize(11).fillColor(INK).text('Cautions');
  doc.font('plex').fontSize(8.5);
  for (const c of d.cautions) doc.text(`• ${c}`, { width: 495 });
  doc.moveDown(0.6);
  doc.font('plex-bold').fontSize(9).fillColor(INK).text(d.disclaimer);
  doc.end();
  return done;
}
