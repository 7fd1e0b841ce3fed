import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { Router } from 'express';
import { simpleParser } from 'mailparser';
import type { AppDeps } from '../deps';
import { notFound } from '../errors';
import { escapeHtml, htmlFrame } from './templates/escape-html';

/** One captured message in the stand-in's folder. */
export interface DevMailItem {
  file: string;
  sizeBytes: number;
  receivedAt: string;
  to: string;
  subject: string;
}

const EML = /^[\w.-]+\.eml$/;

/**
 * /api/dev/mail (never in production): the SMTP stand-in's captured .eml files, newest first, as
 * JSON or, for a browser, a small page; `/api/dev/mail/:file` answers one raw message.
 */
export function devMailRouter(deps: AppDeps): Router {
  const router = Router();
  if (deps.config.production) return router;
  const dir = deps.config.mailDir;

  router.get('/dev/mail', async (req, res) => {
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
    if (req.accepts(['json', 'html']) === 'html') {
      const rows = items
        .map(
          (m) =>
            `<tr><td>${escapeHtml(m.receivedAt)}</td><td>${escapeHtml(m.to)}</td>` +
            `<td><a href="mail/${encodeURIComponent(m.file)}">${escapeHtml(m.subject || '(no subject)')}</a></td></tr>`,
        )
        .join('\n');
      res
        .type('html')
        .send(
          htmlFrame(
            'Rhotrace dev mail',
            `<h1>Captured e-mail (development only)</h1><p>${items.length} newest messages from the SMTP stand-in.</p>` +
              `<table><thead><tr><th align="left">Received</th><th align="left">To</th><th align="left">Subject</th></tr></thead><tbody>${rows}</tbody></table>`,
          ),
        );
      return;
    }
    res.json({ items });
  });

  router.get('/dev/mail/:file', (req, res) => {
    const file = String(req.params.file);
    if (!EML.test(file)) throw notFound(`Message ${file}`);
    let raw: Buffer;
    try {
      raw = readFileSync(join(dir, file));
    } catch {
      throw notFound(`Message ${file}`);
    }
    res.type('text/plain; charset=utf-8').send(raw);
  });
  return router;
}
