import { decadeLabel, decadeTicks, niceTicks } from './pdf-axes';
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
}

/** Axis choices: x ticks are given (numbers or names), y is linear or log with round ticks. */
export interface PlotAxes {
  xTicks: Array<{ value: number; label: string }>;
  xTitle: string;
  yMin: number;
  yMax: number;
  yLog: boolean;
  yTitle: string;
}

function line(doc: PDFKit.PDFDocument, x1: number, y1: number, x2: number, y2: number): void {
  doc.save().lineWidth(0.3).strokeColor(GRID).moveTo(x1, y1).lineTo(x2, y2).stroke().restore();
}

/** Linear x ticks at round numbers over [min, max]. */
export function roundXTicks(min: number, max: number): Array<{ value: number; label: string }> {
  return niceTicks(min, max, 6).map((value) => ({ value, label: String(value) }));
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

  doc.save().lineWidth(0.6).strokeColor(MUTED).rect(x0, y0, w, h).stroke().restore();
  doc.font('plex').fontSize(7).fillColor(MUTED);
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
        doc.fontSize(7);
      }
    } else {
      doc.text(String(t), x0 - 40, y - 4, { width: 36, align: 'right' });
    }
  }
  for (const t of axes.xTicks) {
    line(doc, px(t.value), y0, px(t.value), y0 + h);
    doc.text(t.label, px(t.value) - 24, y0 + h + 3, { width: 48, align: 'center' });
  }
  doc.text(axes.xTitle, x0, y0 + h + 14, { width: w, align: 'center' });
  doc.save().rotate(-90, { origin: [x0 - 46, y0 + h / 2] });
  doc.text(axes.yTitle, x0 - 46 - h / 2, y0 + h / 2 - 4, { width: h, align: 'center' });
  doc.restore();
  return { x0, y0, width: w, height: h, px, py };
}
