import { inflateSync } from 'node:zlib';

/**
 * The text lines a PDF prints, read the way a PDF reader's search does: each text object's
 * glyph codes mapped to characters through its font's ToUnicode table (PDF 32000-1:2008,
 * 9.10.3). Enough for the reports Rhotrace writes (pdfkit: embedded fonts with two-byte codes,
 * text shown with Tj and TJ); not a general PDF parser.
 */
export function pdfTextLines(bytes: Buffer): string[] {
  const file = bytes.toString('latin1');
  const objects = new Map<string, { dict: string; stream: string | null }>();
  for (const m of file.matchAll(/(\d+) 0 obj([\s\S]*?)endobj/g)) {
    const body = m[2]!;
    const at = body.search(/stream\r?\n/);
    if (at < 0) {
      objects.set(m[1]!, { dict: body, stream: null });
      continue;
    }
    const dict = body.slice(0, at);
    const raw = body.slice(body.indexOf('\n', at) + 1, body.lastIndexOf('endstream'));
    const data = Buffer.from(raw.replace(/\r?\n$/, ''), 'latin1');
    const stream = /\/FlateDecode/.test(dict) ? inflateSync(data) : data;
    objects.set(m[1]!, { dict, stream: stream.toString('latin1') });
  }

  // Font resource names (/F3) to the characters of their codes.
  const fonts = new Map<string, Map<number, string>>();
  for (const { dict } of objects.values()) {
    for (const group of dict.matchAll(/\/Font\s*<<([\s\S]*?)>>/g)) {
      for (const ref of group[1]!.matchAll(/\/(\S+)\s+(\d+) 0 R/g)) {
        const font = objects.get(ref[2]!);
        const cmapRef = font && /\/ToUnicode\s+(\d+) 0 R/.exec(font.dict)?.[1];
        const cmap = cmapRef ? objects.get(cmapRef)?.stream : null;
        if (cmap) fonts.set(ref[1]!, readCmap(cmap));
      }
    }
  }

  const lines: string[] = [];
  for (const { dict, stream } of objects.values()) {
    if (stream === null || /\/Type\s*\/XObject|begincmap|\/Length1/.test(dict + stream)) continue;
    for (const block of stream.matchAll(/BT([\s\S]*?)ET/g)) {
      let font = new Map<number, string>();
      let text = '';
      for (const op of block[1]!.matchAll(
        /\/(\S+)\s+[\d.]+\s+Tf|\[([^\]]*)\]\s*TJ|<([^>]*)>\s*Tj/g,
      )) {
        if (op[1]) font = fonts.get(op[1]) ?? new Map();
        const shown = op[2] ?? op[3] ?? '';
        for (const hex of shown.matchAll(/<([0-9a-fA-F\s]*)>/g)) text += decode(hex[1]!, font);
        if (op[3] !== undefined) text += decode(op[3], font);
      }
      if (text) lines.push(text);
    }
  }
  return lines;
}

function decode(hex: string, font: Map<number, string>): string {
  const clean = hex.replace(/\s+/g, '');
  let out = '';
  for (let i = 0; i + 4 <= clean.length; i += 4) {
    out += font.get(parseInt(clean.slice(i, i + 4), 16)) ?? '\uFFFD';
  }
  return out;
}

/** A ToUnicode CMap's bfchar and bfrange entries (both the offset and the array forms). */
function readCmap(cmap: string): Map<number, string> {
  const map = new Map<number, string>();
  const utf16 = (hex: string) => {
    const units = hex.replace(/\s+/g, '').match(/.{4}/g) ?? [];
    return String.fromCharCode(...units.map((u) => parseInt(u, 16)));
  };
  for (const section of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const e of section[1]!.matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F\s]+)>/g))
      map.set(parseInt(e[1]!, 16), utf16(e[2]!));
  }
  for (const section of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    const entries = section[1]!.matchAll(
      /<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(?:\[([^\]]*)\]|<([0-9a-fA-F]+)>)/g,
    );
    for (const e of entries) {
      const first = parseInt(e[1]!, 16);
      const last = parseInt(e[2]!, 16);
      if (e[3] !== undefined) {
        [...e[3].matchAll(/<([0-9a-fA-F\s]+)>/g)].forEach((u, i) =>
          map.set(first + i, utf16(u[1]!)),
        );
      } else {
        const start = parseInt(e[4]!, 16);
        for (let code = first; code <= last; code++)
          map.set(code, String.fromCharCode(start + code - first));
      }
    }
  }
  return map;
}
