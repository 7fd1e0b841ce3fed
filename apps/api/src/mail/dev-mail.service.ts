import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import { notFound } from '../errors';

/** One captured message in the stand-in's folder. */
export interface DevMailItem {
  file: string;
  sizeBytes: number;
  receivedAt: string;
  to: string;
  subject: string;
}

const EML = /^[\w.-]+\.eml$/;

/** The newest 100 messages the SMTP stand-in captured in `dir`, newest first. */
export async function capturedMail(dir: string): Promise<DevMailItem[]> {
  let files: string[] = [];
  try {
    files = readdirSync(dir).filter((f) => EML.test(f));
  } catch {
    files = [];
  }
  const newest = files
    .map((file) => ({ file, stat: statSync(join(dir, file)) }))
    .sort((a, b) => b.stat.mtimeMs - a.stat.mtimeMs)
    .slice(0, 100);
  const items: DevMailItem[] = [];
  for (const { file, stat } of newest) {
    const parsed = await simpleParser(readFileSync(join(dir, file)));
    const to = Array.isArray(parsed.to)
      ? parsed.to.map((a) => a.text).join(', ')
      : (parsed.to?.text ?? '');
    items.push({
      file,
      sizeBytes: stat.size,
      receivedAt: stat.mtime.toISOString(),
      to,
      subject: parsed.subject ?? '',
    });
  }
  return items;
}

/** One captured message, raw; 404 for a name that is not a captured file. */
export function capturedMessage(dir: string, file: string): Buffer {
  if (!EML.test(file)) throw notFound(`Message ${file}`);
  try {
    return readFileSync(join(dir, file));
  } catch {
    throw notFound(`Message ${file}`);
  }
}
