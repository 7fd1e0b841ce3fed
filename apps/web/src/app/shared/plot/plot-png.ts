/** The words drawn above a saved plot image. */
export interface PngStamp {
  title: string;
  /** The sample (wafer, sweep) the plot shows; omitted when empty. */
  sample: string;
  /** The day the image was saved. */
  date: Date;
}

/** Size of the saved image's plot, px, and the band above it that holds the stamp. */
export const PNG_SIZE = { width: 1200, height: 700, header: 84 } as const;

/** The stamp's second line: sample and date (ISO day, so any reader can sort it). */
export function stampLine(stamp: PngStamp): string {
  const day = stamp.date.toISOString().slice(0, 10);
  return stamp.sample ? `${stamp.sample} · saved ${day}` : `saved ${day}`;
}

/** A file name from words: lower case, dashes, no characters a file system dislikes. */
export function pngFilename(words: string): string {
  const base = words
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80);
  return `${base || 'plot'}.png`;
}

/**
 * Draws the plot image (a PNG data URL from plotly) under a band with the title, the sample and
 * the date, on the scheme's background, and returns the result as a PNG blob.
 */
export async function stampedPng(
  plotImage: string,
  stamp: PngStamp,
  colours: { background: string; text: string },
): Promise<Blob> {
  const image = new Image();
  await new Promise<void>((resolve, reject) => {
    image.onload = () => resolve();
    image.onerror = () => reject(new Error('the plot image could not be read'));
    image.src = plotImage;
  });
  const canvas = document.createElement('canvas');
  canvas.width = PNG_SIZE.width;
  canvas.height = PNG_SIZE.height + PNG_SIZE.header;
  const g = canvas.getContext('2d');
  if (!g) throw new Error('this browser cannot draw the image');
  g.fillStyle = colours.background;
  g.fillRect(0, 0, canvas.width, canvas.height);
  g.fillStyle = colours.text;
  g.font = '600 26px "IBM Plex Sans", sans-serif';
  g.fillText(stamp.title, 24, 38, canvas.width - 48);
  g.font = '18px "IBM Plex Sans", sans-serif';
  g.fillText(stampLine(stamp), 24, 68, canvas.width - 48);
  g.drawImage(image, 0, PNG_SIZE.header, PNG_SIZE.width, PNG_SIZE.height);
  return new Promise((resolve, reject) =>
    canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('no image was made'))), 'image/png'),
  );
}

/** Offers a blob as a download under the given file name. */
export function saveBlob(blob: Blob, filename: string): void {
  const href = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = href;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
}
