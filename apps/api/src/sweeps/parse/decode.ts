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

/**
 * Decodes a file as UTF-8 (a byte-order mark is dropped), falling back to Latin-1 for older
 * instrument software that writes `°` as a single byte. Empty and binary files are refused.
 */
export function decodeText(bytes: Buffer): string {
  if (bytes.length === 0) throw new UnreadableFileError('The file is empty.', 400);
  const sample = bytes.subarray(0, Math.min(bytes.length, 64 * 1024));
  let control = 0;
  for (const b of sample) {
    if (b === 0) {
      throw new UnreadableFileError(
        'This file is not a text export (it contains binary data). Export the measurement as ' +
          'CSV or text from the probe station software and upload that file.',
        400,
      );
    }
    if (b < 32 && b !== 9 && b !== 10 && b !== 13 && b !== 12) control += 1;
  }
  if (control > sample.length * MAX_CONTROL_SHARE) {
    throw new UnreadableFileError(
      'This file is not a text export (it contains binary data). Export the measurement as ' +
        'CSV or text from the probe station software and upload that file.',
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
