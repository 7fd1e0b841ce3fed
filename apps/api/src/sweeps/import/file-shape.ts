/**
 * A file's shape: its separator, column count and header cells. Files a station writes again
 * and again share one shape, so saved import settings are kept under it.
 */
import { createHash } from 'node:crypto';
import type { ParsedSweepFile } from '../parse';

/** The shape's key (sha256 of its description) and its description in words. */
export interface FileShape {
  key: string;
  label: string;
}

const SEPARATOR_WORDS = { ',': 'comma', ';': 'semicolon', '\t': 'tab' } as const;

/** The shape of a parsed file; header cells compare without case or surrounding spaces. */
export function fileShape(parsed: ParsedSweepFile): FileShape {
  const { delimiter, headers } = parsed.layout;
  const width = parsed.columns.length;
  const cells = headers.map((h) => h.trim().toLowerCase());
  const description = JSON.stringify([delimiter, width, cells]);
  const named = headers.length ? headers.map((h) => h.trim()).join(', ') : 'no header line';
  const label = `${width} ${SEPARATOR_WORDS[delimiter]}-separated columns: ${named}`;
  return {
    key: createHash('sha256').update(description).digest('hex'),
    label: label.slice(0, 500),
  };
}
