import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { cmToLength, GEOMETRY_LABELS, LENGTH_UNIT_OF } from '@rhotrace/api-types';

const require = createRequire(import.meta.url);
/** IBM Plex Sans static TTFs from the installed font package (no machine paths). */
const FONTS = {
  regular:
    require.resolve('@expo-google-fonts/ibm-plex-sans/400Regular/IBMPlexSans_400Regular.ttf'),
  bold: require.resolve('@expo-google-fonts/ibm-plex-sans/600SemiBold/IBMPlexSans_600SemiBold.ttf'),
};

export const INK = '#1d2733';
export const MUTED = '#5b6773';
export const ACCENT = '#1f6f8b';
export const GRID = '#d5dbe1';

/** Resistivity's unit as the screens write it. */
export const OHM_CM = 'Ω·cm';

/** Formats a number to `digits` significant figures (exponent form for very large/small). */
export function sig(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  const a = Math.abs(value);
  if (a !== 0 && (a < 1e-3 || a >= 1e5))
    return value.toExponential(digits - 1).replace(/e\+?/, ' × 10^');
  const fixed = value.toPrecision(digits);
  // toPrecision answers 1.44e+3 for 1440 at three digits: write the digits out instead
  return fixed.includes('e') ? String(Number(fixed)) : fixed;
}

/**
 * A recorded value (spec limit, thickness) to at most `digits` significant figures without
 * trailing zeros, so 0.0525 cm prints as 525 µm and a limit of 8 as 8, as they were entered.
 */
export function plain(value: number | null | undefined, digits = 4): string {
  return sig(value, digits)
    .replace(/(\.\d*?)0+(?=$| )/, '$1')
    .replace(/\.(?=$| )/, '');
}

/** A sweep's geometry as words and units ("thickness 525 µm, diameter 150 mm"). */
export function geometryText(geometry: Record<string, unknown>): string {
  return Object.entries(geometry)
    .flatMap(([key, value]) => {
      const label = GEOMETRY_LABELS[key];
      if (!label || typeof value !== 'number' || !Number.isFinite(value)) return [];
      if (key === 'rtdR0Ohm') return [`${label} ${plain(value)} Ω`];
      const unit = LENGTH_UNIT_OF[key] ?? 'cm';
      return [`${label} ${plain(cmToLength(value, unit))} ${unit}`];
    })
    .join(', ');
}

/** An A4 document in IBM Plex Sans and the promise of its bytes once `doc.end()` is called. */
export function openPdf(
  info: PDFKit.DocumentInfo,
  options: { compress?: boolean } = {},
): { doc: PDFKit.PDFDocument; done: Promise<Buffer> } {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 50,
    compress: options.compress ?? true,
    info: { Author: 'Rhotrace', ...info },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.registerFont('plex', FONTS.regular);
  doc.registerFont('plex-bold', FONTS.bold);
  return { doc, done };
}

/** Starts a new page when fewer than `heightPt` points remain above the bottom margin. */
export function keepSpace(doc: PDFKit.PDFDocument, heightPt: number): void {
  if (doc.y + heightPt > doc.page.height - doc.page.margins.bottom) doc.addPage();
}
