const ENTITIES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Escapes text for an HTML e-mail body or attribute, so user text never becomes markup. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}

/** Wraps an e-mail body in Rhotrace's plain HTML frame (inline styles only; mail clients). */
export function htmlFrame(title: string, bodyHtml: string): string {
  return [
    '<!doctype html>',
    '<html lang="en"><head><meta charset="utf-8">',
    `<title>${escapeHtml(title)}</title></head>`,
    '<body style="font-family: sans-serif; line-height: 1.5; color: #1d2430; max-width: 40em">',
    bodyHtml,
    '<p style="color: #5b6472; font-size: 0.85em">Sent by Rhotrace, your lab notebook.</p>',
    '</body></html>',
  ].join('\n');
}
