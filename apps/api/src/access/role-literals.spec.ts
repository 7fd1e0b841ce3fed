import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { ROLES } from '@rhotrace/api-types';
import { describe, expect, it } from 'vitest';

/**
 * Who may do what is stated in two places only: the role-to-capability table in
 * `@rhotrace/api-types` and this access module. Everywhere else in the API and the web app asks
 * for a capability, so a role name written as a string (a role list, `role === 'technician'`, a
 * `where: { role: ... }`) is a second copy of the rule. This spec fails when one appears.
 */
const REPO = resolve(import.meta.dirname, '../../../..');
const SCANNED = ['apps/api/src', 'apps/web/src'];

/** Files that name roles for a reason other than permission, with the reason. */
const ALLOWED: Record<string, string> = {
  'apps/web/src/app/features/home/home.ts': 'picks the landing desk drawn for each role',
  'apps/web/src/app/features/people/people-list.ts': 'the role a new account form starts on',
};

const ROLE_LITERAL = new RegExp(`(['"\`])(${ROLES.join('|')})\\1`, 'g');

/** Role names written as string literals in `text`, with their line numbers. */
export function roleLiterals(text: string): Array<{ line: number; role: string }> {
  const found: Array<{ line: number; role: string }> = [];
  text.split('\n').forEach((content, index) => {
    for (const match of content.matchAll(ROLE_LITERAL)) {
      found.push({ line: index + 1, role: match[2]! });
    }
  });
  return found;
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return entry.name === 'node_modules' ? [] : sourceFiles(path);
    return /\.(ts|html)$/.test(entry.name) && !entry.name.endsWith('.spec.ts') ? [path] : [];
  });
}

describe('role names outside the capability table and the access module', () => {
  it('recognises the ways a role list or a role check is written', () => {
    const samples = [
      "if (user.role === 'technician') return {};",
      "export const EDITORS = ['admin', 'manager', 'engineer'] as const;",
      'requireRole("admin")',
      "where: { role: 'admin', active: true }",
      '@if (role() === `physicist`) {',
    ];
    for (const sample of samples) expect(roleLiterals(sample), sample).not.toEqual([]);
    expect(roleLiterals("throw forbidden('Technicians may not delete sweeps');")).toEqual([]);
    expect(roleLiterals("can(user, 'records:see-all')")).toEqual([]);
  });

  it('finds none in the API and the web app', () => {
    const offenders: string[] = [];
    for (const root of SCANNED) {
      for (const file of sourceFiles(join(REPO, root))) {
        const path = relative(REPO, file);
        if (path.startsWith('apps/api/src/access/') || path in ALLOWED) continue;
        for (const { line, role } of roleLiterals(readFileSync(file, 'utf8'))) {
          offenders.push(`${path}:${line} names '${role}'; ask for a capability instead`);
        }
      }
    }
    expect(offenders).toEqual([]);
  });

  it('scans real files (the allowed ones still name roles)', () => {
    for (const path of Object.keys(ALLOWED)) {
      expect(roleLiterals(readFileSync(join(REPO, path), 'utf8')), path).not.toEqual([]);
    }
  });
});
