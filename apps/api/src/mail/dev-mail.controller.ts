import type { Request, Response } from 'express';
import { capturedMail, capturedMessage } from './dev-mail.service';
import { escapeHtml, htmlFrame } from './templates/escape-html';

/** Handlers of the development mailbox, reading the stand-in's folder `mailDir`. */
export function devMailController(mailDir: string) {
  return {
    /** `GET /api/dev/mail`: the captured messages as JSON or, for a browser, a small page. */
    async list(req: Request, res: Response): Promise<void> {
      const items = await capturedMail(mailDir);
      if (req.accepts(['json', 'html']) !== 'html') {
        res.json({ items });
        return;
      }
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
    },
    /** `GET /api/dev/mail/:file`: one raw message. */
    get(req: Request, res: Response): void {
      const raw = capturedMessage(mailDir, String(req.params.file));
      res.type('text/plain; charset=utf-8').send(raw);
    },
  };
}
