import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

let cached: string | null = null;

/** Version of the installed `@rhotrace/physics` package (from its package.json). */
export function physicsVersion(): string {
  if (cached) return cached;
  const entry = createRequire(import.meta.url).resolve('@rhotrace/physics');
  let dir = dirname(entry);
  for (let i = 0; i < 4; i += 1) {
    try {
      const pkg = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8')) as {
        name?: string;
        version?: string;
      };
      if (pkg.name === '@rhotrace/physics' && pkg.version) {
        cached = pkg.version;
        return cached;
      }
    } catch {
      // not at this level; look one folder up
    }
    dir = dirname(dir);
  }
  cached = 'unknown';
  return cached;
}

/**
 * The model version stored with a fit or shown with a curve: physics package version plus the
 * short name of the parameter set (at most 96 characters, the column's width).
 */
export function modelVersion(parameterSet: string): string {
  return `physics@${physicsVersion()}+${parameterSet}`.slice(0, 96);
}
