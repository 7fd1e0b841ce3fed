/**
 * Writes libs/api-types/src/index.ts: a named re-export of every exported declaration of every
 * other file in that folder (values and types apart), so the public API is spelled out and no
 * `export *` hides what it holds. Run it after adding an export: `npx tsx scripts/api-types-index.ts`
 * (`--check` exits 1 when the index is out of date instead of writing it).
 */
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { format, resolveConfig } from 'prettier';

const DIR = resolve(import.meta.dirname, '../libs/api-types/src');
const INDEX = join(DIR, 'index.ts');
const DECLARATION =
  /^export (?:declare )?(?:abstract )?(const|let|function|class|enum|interface|type)\s+(\w+)/gm;

function block(keyword: 'export' | 'export type', names: string[], file: string): string {
  return `${keyword} {\n${names.map((n) => `  ${n},\n`).join('')}} from './${file}';`;
}

const parts = [
  '/**\n * The public API of @rhotrace/api-types: request and response types shared by the API and' +
    ' the\n * web app, the error shape, and the role-to-capability table. Named re-exports only.\n */',
];
const files = readdirSync(DIR)
  .filter((f) => f.endsWith('.ts') && f !== 'index.ts' && !f.endsWith('.spec.ts'))
  .sort();
for (const file of files) {
  const text = readFileSync(join(DIR, file), 'utf8');
  const values: string[] = [];
  const types: string[] = [];
  for (const [, kind, name] of text.matchAll(DECLARATION)) {
    (kind === 'interface' || kind === 'type' ? types : values).push(name!);
  }
  const module = file.slice(0, -3);
  if (values.length) parts.push(block('export', values, module));
  if (types.length) parts.push(block('export type', types, module));
}
const index = await format(`${parts.join('\n')}\n`, {
  ...(await resolveConfig(INDEX)),
  filepath: INDEX,
});

if (process.argv.includes('--check')) {
  if (readFileSync(INDEX, 'utf8') !== index) {
    console.error(
      'libs/api-types/src/index.ts is out of date: run npx tsx scripts/api-types-index.ts',
    );
    process.exit(1);
  }
} else {
  writeFileSync(INDEX, index);
}
