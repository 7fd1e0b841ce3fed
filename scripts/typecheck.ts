/** Type-checks every TypeScript project of the workspace with `tsc --noEmit`. */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '..');
const projects = [
  'libs/physics/tsconfig.json',
  'libs/api-types/tsconfig.json',
  'apps/api/tsconfig.json',
  'apps/web/tsconfig.app.json',
  'apps/web/tsconfig.spec.json',
  'e2e/tsconfig.json',
  'scripts/tsconfig.json',
].filter((p) => existsSync(join(ROOT, p)));

let failed = 0;
for (const project of projects) {
  try {
    execFileSync(join(ROOT, 'node_modules/.bin/tsc'), ['--noEmit', '-p', project], {
      cwd: ROOT,
      stdio: 'inherit',
    });
    console.log(`[typecheck] ${project}: clean`);
  } catch {
    failed += 1;
    console.error(`[typecheck] ${project}: errors above`);
  }
}
process.exit(failed ? 1 : 0);
