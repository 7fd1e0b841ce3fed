import { SPEC_VERDICT_WORDS, type LotSummaryResponse } from '@rhotrace/api-types';
import { ACCENT, INK, keepSpace, MUTED, OHM_CM, openPdf, plain, sig } from './pdf-document';
import { drawAxes } from './pdf-plot';
import type { LotReportData } from './lot-report.service';
import { closingSection, fitsSection } from './report-pdf';
import { hallAt300KWords, hallUncertaintyWords } from './report-hall';

const FAIL = '#a23b2a';
const UNDECIDED = '#8a6d1f';

/** Title used in the document info (ASCII, so it can be read from the file as is). */
export function lotReportTitle(lotCode: string): string {
  return `Rhotrace lot report: lot ${lotCode}`;
}

/** A reason written as a sentence, set inside brackets after other words. */
const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);

/** One table line per wafer: its 23 °C value ± U (k = 2), how it was found, and its verdict. */
export function waferLines(s: LotSummaryResponse): string[] {
  return s.wafers.map((w) => {
    if (w.resistivityAt23COhmCm === null)
      return `${w.number}: no value at 23 °C (${lowerFirst(w.reason ?? 'no sweep')})${hallWords(w.hall)}`;
    const u = w.uncertaintyOhmCm === null ? '' : ` ± ${sig(w.uncertaintyOhmCm, 2)}`;
    const how =
      w.method === 'interpolated' ? 'interpolated' : `corrected from ${sig(w.distanceK, 2)} K away`;
    const verdict = w.verdict ? `, ${SPEC_VERDICT_WORDS[w.verdict]}` : '';
    return `${w.number}: ${sig(w.resistivityAt23COhmCm)}${u} ${OHM_CM} (k = 2, ${how}, sweep ${w.sweepId})${verdict}${hallWords(w.hall)}`;
  });
}

/** A wafer's Hall values at 300 K after its resistivity, with their uncertainty and r_H. */
function hallWords(h: LotSummaryResponse['wafers'][number]['hall']): string {
  if (!h) return '';
  return (
    `; Hall at 300 K (sweep ${h.sweepId}, ${h.carrierType === 'mixed' ? 'sign changes' : `${h.carrierType}-type`}, ` +
    `r_H ${h.hallFactor.toPrecision(3)}): ` +
    `${hallAt300KWords(h)}, ${hallUncertaintyWords(h, '± is the ')}`
  );
}

/** The lot's statistics in words: spread, verdict counts and Ppk with its lower bound. */
export function statisticsLines(s: LotSummaryResponse): string[] {
  const st = s.statistics;
  const spec =
    s.lot.specMinOhmCm === null && s.lot.specMaxOhmCm === null
      ? 'no spec limits recorded'
      : `spec ${plain(s.lot.specMinOhmCm, 6)} to ${plain(s.lot.specMaxOhmCm, 6)} ${OHM_CM}`;
  const lines = [
    `${s.lot.material}${s.lot.dopant ? `, dopant ${s.lot.dopant}` : ''}; ${spec}`,
    `${st.count} of ${s.wafers.length} wafers with a value at 23 °C: mean ${sig(st.meanOhmCm)} ${OHM_CM}, ` +
      `sample standard deviation ${sig(st.stdDevOhmCm, 3)} ${OHM_CM}, range ${sig(st.minOhmCm)} to ${sig(st.maxOhmCm)} ${OHM_CM}`,
    `${st.passCount} meet spec, ${st.failCount} miss it, ${st.indeterminateCount} too close to call ` +
      '(guard band: the expanded uncertainty, k = 2)',
    st.ppk === null
      ? `Ppk not given: ${st.ppkReason ?? 'not available'}`
      : `Ppk ${sig(st.ppk, 3)} (95 % lower bound ${sig(st.ppkLower95, 3)}, Bissell 1990)`,
  ];
  if (st.note) lines.push(st.note);
  if (st.cpkReason) lines.push(`Cpk not given: ${st.cpkReason}.`);
  return lines;
}

/** A wafer's marker, by verdict as on the lot page: dot meets, cross misses, diamond undecided. */
function drawMarker(doc: PDFKit.PDFDocument, x: number, y: number, verdict: string | null): void {
  const r = 2.6;
  if (verdict === 'fail') {
    doc.save().lineWidth(1.2).strokeColor(FAIL);
    doc
      .moveTo(x - r, y - r)
      .lineTo(x + r, y + r)
      .moveTo(x - r, y + r)
      .lineTo(x + r, y - r);
    doc.stroke().restore();
  } else if (verdict === 'indeterminate') {
    doc.save().fillColor(UNDECIDED);
    doc
      .polygon([x, y - r - 0.6], [x + r, y], [x, y + r + 0.6], [x - r, y])
      .fill()
      .restore();
  } else {
    doc.save().fillColor(ACCENT).circle(x, y, 2.2).fill().restore();
  }
}

/** Draws the lot chart from `top` and answers the page y below its axis titles. */
function drawLotChart(doc: PDFKit.PDFDocument, s: LotSummaryResponse, top: number): number {
  const rows = s.wafers.filter((w) => w.resistivityAt23COhmCm !== null);
  const lows = rows.map((w) => w.resistivityAt23COhmCm! - (w.uncertaintyOhmCm ?? 0));
  const highs = rows.map((w) => w.resistivityAt23COhmCm! + (w.uncertaintyOhmCm ?? 0));
  const limits = [s.lot.specMinOhmCm, s.lot.specMaxOhmCm].filter((v): v is number => v !== null);
  const yMin = Math.min(...lows, ...limits);
  const yMax = Math.max(...highs, ...limits);
  const pad = (yMax - yMin) * 0.08 || Math.abs(yMax) * 0.05 || 1;
  const frame = drawAxes(
    doc,
    { x0: 100, y0: top, width: 420, height: 180 },
    {
      xTicks: s.wafers
        .map((w, i) => ({ value: i + 1, label: w.number }))
        .concat({ value: 0, label: '' }, { value: s.wafers.length + 1, label: '' }),
      xTitle: 'Wafer',
      yMin: yMin - pad,
      yMax: yMax + pad,
      yLog: false,
      yTitle: 'ρ at 23 °C',
      yUnit: OHM_CM,
    },
  );
  for (const limit of limits) {
    doc.save().lineWidth(0.8).dash(4, { space: 3 }).strokeColor(FAIL);
    doc
      .moveTo(frame.x0, frame.py(limit))
      .lineTo(frame.x0 + frame.width, frame.py(limit))
      .stroke();
    doc.undash().restore();
  }
  s.wafers.forEach((w, i) => {
    if (w.resistivityAt23COhmCm === null) return;
    const colour = w.verdict === 'fail' ? FAIL : w.verdict === 'indeterminate' ? UNDECIDED : ACCENT;
    const x = frame.px(i + 1);
    const u = w.uncertaintyOhmCm ?? 0;
    doc.save().lineWidth(0.8).strokeColor(colour);
    doc
      .moveTo(x, frame.py(w.resistivityAt23COhmCm - u))
      .lineTo(x, frame.py(w.resistivityAt23COhmCm + u))
      .stroke();
    doc.restore();
    drawMarker(doc, x, frame.py(w.resistivityAt23COhmCm), w.verdict);
  });
  return frame.bottom;
}

/** Renders a lot's report: every wafer's 23 °C value, the statistics, the chart and the fits. */
export function renderLotReportPdf(
  d: LotReportData,
  options: { compress?: boolean } = {},
): Promise<Buffer> {
  const s = d.summary;
  const { doc, done } = openPdf(
    {
      Title: lotReportTitle(s.lot.code),
      Subject: `Lot ${s.lot.code}: resistivity at 23 °C of each wafer`,
      Keywords: `lot ${s.lot.code}; ${s.lot.material}`,
    },
    options,
  );
  doc.font('plex-bold').fontSize(16).fillColor(INK).text(`Lot ${s.lot.code}`);
  doc
    .font('plex')
    .fontSize(9)
    .fillColor(MUTED)
    .text(`Printed ${d.printedAt.slice(0, 10)}`);
  doc.moveDown(0.6).fontSize(10).fillColor(INK);
  for (const line of statisticsLines(s)) doc.text(line, 50, undefined, { width: 495 });

  doc.moveDown(0.8);
  if (s.statistics.count > 0) {
    // room for the plot, upright wafer names of up to about 20 characters and the caption
    keepSpace(doc, 300);
    const below = drawLotChart(doc, s, doc.y);
    doc.x = 50;
    doc.y = below;
    doc.fontSize(7.5).fillColor(MUTED);
    doc.text(
      'Bars: value ± U (k = 2). Dashed lines: spec limits. Dots meet the spec, crosses miss ' +
        'it, diamonds are too close to call.',
      100,
      undefined,
      { width: 420 },
    );
  }
  doc.moveDown(0.6);
  doc.font('plex-bold').fontSize(11).fillColor(INK).text('Wafers', 50);
  doc.font('plex').fontSize(9);
  for (const line of waferLines(s)) {
    keepSpace(doc, 12);
    doc.text(line, 50, undefined, { width: 495 });
  }
  for (const group of d.fits) {
    doc.moveDown(0.6);
    keepSpace(doc, 60);
    fitsSection(doc, group.fits, `Fits of wafer ${group.waferNumber}`);
  }
  closingSection(doc, d.cautions, d.disclaimer);
  doc.end();
  return done;
}
