import { axisPrefix, decadeLabel, decadeTicks, niceTicks, tickLabel } from './pdf-axes';
import { GRID, MUTED } from './pdf-document';

/** A plot's box on the page and its scales. */
export interface PlotFrame {
  x0: number;
  y0: number;
  width: number;
  height: number;
  /** Page x of a data x value. */
  px: (x: number) => number;
  /** Page y of a data y value. */
  py: (y: number) => number;
  /** Page y just below the x axis's title, where the caption may start. */
  bottom: number;
}

/** Axis choices: x ticks are given (numbers or names), y is linear or log with round ticks. */
export interface PlotAxes {
  xTicks: Array<{ value: number; label: string }>;
  xTitle: string;
  yMin: number;
  yMax: number;
  yLog: boolean;
  yTitle: string;
  /** A linear y axis's unit: labels are scaled by an SI prefix written into the title. */
  yUnit?: string;
}

function line(doc: PDFKit.PDFDocument, x1: number, y1: number, x2: number, y2: number): void {
  doc.save().lineWidth(0.3).strokeColor(GRID).moveTo(x1, y1).lineTo(x2, y2).stroke().restore();
}

/** Linear x ticks at round numbers over [min, max]. */
export function roundXTicks(min: number, max: number): Array<{ value: number; label: string }> {
  const ticks = niceTicks(min, max, 6);
  const step = ticks.length > 1 ? ticks[1]! - ticks[0]! : 1;
  return ticks.map((value) => ({ value, label: tickLabel(value, step) }));
}

const TICK_FONT_PT = 7;

/**
 * Draws the x labels under the axis: level when each fits its slot, else turned upright so long
 * wafer names never run into each other. Answers the height they take.
 */
function drawXLabels(
  doc: PDFKit.PDFDocument,
  ticks: ReadonlyArray<{ value: number; label: string }>,
  px: (x: number) => number,
  top: number,
  slot: number,
): number {
  const widest = Math.max(0, ...ticks.map((t) => doc.widthOfString(t.label)));
  if (widest <= slot - 4) {
    for (const t of ticks)
      doc.text(t.label, px(t.value) - slot / 2, top, { width: slot, align: 'center' });
    return TICK_FONT_PT + 4;
  }
  for (const t of ticks) {
    if (!t.label) continue;
    const x = px(t.value);
    doc.save().rotate(-90, { origin: [x, top] });
    // a little spare width: pdfkit breaks a line at a hyphen when it fills the width exactly
    doc.text(t.label, x - widest - 10, top - TICK_FONT_PT / 2 - 1, {
      width: widest + 10,
      align: 'right',
      lineBreak: false,
    });
    doc.restore();
  }
  return widest + 4;
}

/** Draws the box, grid, ticks and titles, and answers the frame to plot data in. */
export function drawAxes(
  doc: PDFKit.PDFDocument,
  box: { x0: number; y0: number; width: number; height: number },
  axes: PlotAxes,
): PlotFrame {
  const { x0, y0, width: w, height: h } = box;
  const xs = axes.xTicks.map((t) => t.value);
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs);
  const xSpan = xMax > xMin ? xMax - xMin : 1;
  const px = (x: number) => x0 + ((x - xMin) / xSpan) * w;

  const yTicks = axes.yLog ? decadeTicks(axes.yMin, axes.yMax) : niceTicks(axes.yMin, axes.yMax, 5);
  const yLo = yTicks[0]!;
  const yHi = yTicks[yTicks.length - 1]!;
  const ySpan = yHi > yLo ? yHi - yLo : 1;
  const py = axes.yLog
    ? (y: number) => y0 + h - ((Math.log10(y) - yLo) / ySpan) * h
    : (y: number) => y0 + h - ((y - yLo) / ySpan) * h;
  const scale = axes.yLog
    ? { factor: 1, prefix: '' }
    : axisPrefix(Math.max(Math.abs(yLo), Math.abs(yHi)));
  const yStep = yTicks.length > 1 ? yTicks[1]! - yTicks[0]! : 1;

  doc.save().lineWidth(0.6).strokeColor(MUTED).rect(x0, y0, w, h).stroke().restore();
  doc.font('plex').fontSize(TICK_FONT_PT).fillColor(MUTED);
  for (const t of yTicks) {
    const y = y0 + h - ((t - yLo) / ySpan) * h;
    line(doc, x0, y, x0 + w, y);
    if (axes.yLog) {
      const label = decadeLabel(t);
      if (label.exponent === null) {
        doc.text(label.base, x0 - 40, y - 4, { width: 36, align: 'right' });
      } else {
        doc.text(label.base, x0 - 40, y - 4, { width: 28, align: 'right' });
        doc.fontSize(5).text(label.exponent, x0 - 12, y - 6, { width: 10, align: 'left' });
        doc.fontSize(TICK_FONT_PT);
      }
    } else {
      doc.text(tickLabel(t / scale.factor, yStep / scale.factor), x0 - 40, y - 4, {
        width: 36,
        align: 'right',
      });
    }
  }
  // A log axis over few decades gets the 2…9 lines between them, as log paper has.
  if (axes.yLog && ySpan <= 3) {
    for (let k = yLo; k < yHi; k++) {
      for (let m = 2; m <= 9; m++) {
        const y = py(m * 10 ** k);
        doc.save().lineWidth(0.2).strokeColor(GRID).opacity(0.6);
        doc
          .moveTo(x0, y)
          .lineTo(x0 + w, y)
          .stroke()
          .restore();
      }
    }
  }
  for (const t of axes.xTicks) line(doc, px(t.value), y0, px(t.value), y0 + h);
  const slot = axes.xTicks.length > 1 ? w / (axes.xTicks.length - 1) : w;
  const labelsPt = drawXLabels(doc, axes.xTicks, px, y0 + h + 3, Math.min(slot, 60));
  doc.text(axes.xTitle, x0, y0 + h + 3 + labelsPt, { width: w, align: 'center' });
  const yTitle = axes.yUnit ? `${axes.yTitle} (${scale.prefix}${axes.yUnit})` : axes.yTitle;
  doc.save().rotate(-90, { origin: [x0 - 46, y0 + h / 2] });
  doc.text(yTitle, x0 - 46 - h / 2, y0 + h / 2 - 4, { width: h, align: 'center' });
  doc.restore();
  const bottom = y0 + h + 3 + labelsPt + TICK_FONT_PT + 6;
  return { x0, y0, width: w, height: h, px, py, bottom };
}
