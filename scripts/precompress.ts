/**
 * Writes .br and .gz copies beside the built web app's text files, so the server sends the
 * 5 MB plot library compressed without compressing it again on every request.
 *   tsx scripts/precompress.ts [DIR]   (default dist/web/browser)
 */
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

const ROOT = resolve(import.meta.dirname, '..');
const dir = resolve(process.argv[2] ?? join(ROOT, 'dist/web/browser'));
const TEXT = /\.(js|mjs|css|html|svg|json|txt|map)$/;

let files = 0;
let before = 0;
let after = 0;
const walk = (folder: string) => {
  for (const entry of readdirSync(folder)) {
    const path = join(folder, entry);
    if (statSync(path).isDirectory()) {
      walk(path);
      continue;
    }
    if (!TEXT.test(entry)) continue;
    const content = readFileSync(path);
    if (content.length < 1024) continue;
    const br = brotliCompressSync(content, {
      params: {
        [constants.BROTLI_PARAM_QUALITY]: 9,
        [constants.BROTLI_PARAM_SIZE_HINT]: content.length,
      },
    });
    writeFileSync(`${path}.br`, br);
    writeFileSync(`${path}.gz`, gzipSync(content, { level: 9 }));
    files += 1;
    before += content.length;
    after += br.length;
  }
};
walk(dir);
console.log(
  `[precompress] ${files} files, ${(before / 1024).toFixed(0)} kB → ${(after / 1024).toFixed(0)} kB brotli`,
);
