/**
 * Turns uploaded bytes into text, refusing what is not a text export in words a technician
 * understands.
 */

/** Why a file cannot be read at all (answered as 400/422 by the API). */
export class UnreadableFileError extends Error {
  constructor(
    message: string,
    readonly status: 400 | 422 = 422,
  ) {
    super(message);
  }
}

const utf8 = new TextDecoder('utf-8', { fatal: true });
const latin1 = new TextDecoder('latin1');

/** Share of control bytes (other than tab, CR, LF, form feed) above which a file is binary. */
const MAX_CONTROL_SHARE = 0.01;

const NOT_TEXT =
  'Export the measurement as CSV or text from the probe station software and upload that file.';

/** Leading bytes of common non-text files, named so a technician knows what was picked. */
const SIGNATURES: Array<{ bytes: number[]; what: string }> = [
  { bytes: [0x50, 0x4b, 0x03, 0x04], what: 'a zip archive (or an Excel .xlsx workbook)' },
  { bytes: [0x50, 0x4b, 0x05, 0x06], what: 'an empty zip archive' },
  { bytes: [0xd0, 0xcf, 0x11, 0xe0], what: 'an old Excel .xls or Office document' },
  { bytes: [0x25, 0x50, 0x44, 0x46, 0x2d], what: 'a PDF document' },
  { bytes: [0x89, 0x50, 0x4e, 0x47], what: 'a PNG image' },
  { bytes: [0xff, 0xd8, 0xff], what: 'a JPEG image' },
  { bytes: [0x47, 0x49, 0x46, 0x38], what: 'a GIF image' },
  { bytes: [0x1f, 0x8b], what: 'a gzip archive' },
  { bytes: [0x7b, 0x5c, 0x72, 0x74, 0x66], what: 'a rich-text (RTF) document' },
];

function startsWith(bytes: Buffer, prefix: number[]): boolean {
  return bytes.length >= prefix.length && prefix.every((b, i) => bytes[i] === b);
}

/** Refuses files whose first bytes name another format (400). */
function refuseKnownFormats(bytes: Buffer): void {
  const known = SIGNATURES.find((s) => startsWith(bytes, s.bytes));
  if (known) {
    throw new UnreadableFileError(
      `This file is ${known.what}, not a text export. ${NOT_TEXT}`,
      400,
    );
  }
  if (startsWith(bytes, [0xff, 0xfe]) || startsWith(bytes, [0xfe, 0xff])) {
    throw new UnreadableFileError(
      'This file is saved as UTF-16 text, which Rhotrace does not read. Save or export it as ' +
        'UTF-8 (or ANSI) CSV and upload that file.',
      400,
    );
  }
}

/**
 * Decodes a file as UTF-8 (a byte-order mark is dropped), falling back to Latin-1 for older
 * instrument software that writes `°` as a single byte. Empty and binary files are refused.
 */
export function decodeText(bytes: Buffer): string {
  if (bytes.length === 0) throw new UnreadableFileError('The file is empty.', 400);
  refuseKnownFormats(bytes);
  const sample = bytes.subarray(0, Math.min(bytes.length, 64 * 1024));
  let control = 0;
  for (const b of sample) {
    if (b === 0) {
      throw new UnreadableFileError(
        `This file is not a text export (it contains binary data). ${NOT_TEXT}`,
        400,
      );
    }
    if (b < 32 && b !== 9 && b !== 10 && b !== 13 && b !== 12) control += 1;
  }
  if (control > sample.length * MAX_CONTROL_SHARE) {
    throw new UnreadableFileError(
      `This file is not a text export (it contains binary data). ${NOT_TEXT}`,
      400,
    );
  }
  let text: string;
  try {
    text = utf8.decode(bytes);
  } catch {
    text = latin1.decode(bytes);
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === '')
    throw new UnreadableFileError('The file holds no readings, only blank space.', 400);
  return text;
}
