/**
 * A scan of every file git tracks for secrets that must never be committed: private keys, cloud
 * access keys, tokens, and passwords written as literals. Used by the security spec.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { REPO_ROOT } from '../config';

/** One suspicious place: file, 1-based line and the kind of secret (never the value itself). */
export interface SecretFinding {
  file: string;
  line: number;
  kind: string;
}

/** The documented demo password (README, seed data), the one literal allowed outside tests. */
export const DEMO_PASSWORD = 'rhotrace-demo';

/** Test, benchmark and end-to-end code, whose literal passwords are throwaway test passwords. */
const TEST_FILE = /(\.spec\.ts$|\.e2e\.ts$|(^|\/)(e2e|testing|bench)\/)/;

/** Patterns that are a secret wherever they appear. */
const ALWAYS: Array<[string, RegExp]> = [
  ['private key', /-----BEGIN (?:[A-Z0-9]+ )*PRIVATE KEY(?: BLOCK)?-----/],
  ['AWS access key id', /\b(?:AKIA|ASIA|AGPA|AIDA|AROA)[0-9A-Z]{16}\b/],
  [
    'AWS secret access key',
    /aws_?secret_?access_?key["']?\s*[:=]\s*["']?(?![$<{])[A-Za-z0-9/+=]{40}\b/i,
  ],
  ['JSON web token', /\beyJ[A-Za-z0-9_-]{8,}\.eyJ[A-Za-z0-9_-]{8,}\.[A-Za-z0-9_-]{16,}/],
  ['GitHub token', /\b(?:gh[pousr]_[A-Za-z0-9]{36}|github_pat_[A-Za-z0-9_]{60,})\b/],
  ['Slack token', /\bxox[abprs]-[A-Za-z0-9-]{10,}/],
  ['npm token', /\bnpm_[A-Za-z0-9]{36}\b/],
];

/** `password = "x"`, `password: 'x'`, `DB_PASSWORD=x`: a name that says secret, then a literal. */
const ASSIGNMENT =
  /(?<![\w/@.-])([A-Za-z_]*(?:password|passwd|secret)[A-Za-z_]*)["']?\s*[:=]\s*(["'`]?)([^"'`\s,;)]*)\2/gi;

/** A URL whose user part carries a password (scheme, user, a colon, the password, an at-sign). */
const URL_PASSWORD = /\b[a-z][a-z0-9+.-]*:\/\/[^\s:@/'"]+:([^\s@/'"]+)@/gi;

/** Values that are no secret: empty, a reference (`$X`, `${x}`, `process.env`), a placeholder. */
function isPlaceholder(value: string): boolean {
  return (
    value === '' ||
    /^(\$|%|<|\{|…|\.\.\.|\*+$|x+$|process\.env|env\.|config\.|this\.|opts?\.|options\.)/i.test(
      value,
    ) ||
    /^(changeme|change-me|example|placeholder|redacted|\[redacted\]|null|undefined|true|false)$/i.test(
      value,
    )
  );
}

/** A literal in code is a quoted one; in env and shell files an unquoted value counts too. */
function literalPasswords(text: string, file: string): Array<{ index: number; kind: string }> {
  const out: Array<{ index: number; kind: string }> = [];
  const code = /\.(ts|js|mjs|cjs|json)$/.test(file);
  for (const m of text.matchAll(ASSIGNMENT)) {
    const [, name, quote, value] = m;
    // Unquoted, only an env or shell line counts (`DB_PASSWORD=x`); not `password: string`,
    // `secret = readSecret()` or prose such as "the same secret: set it".
    if (!quote && (code || !/^[A-Za-z_]+=/.test(m[0]))) continue;
    if (/hash|sha|length|min|max|field|reset|confirm|policy/i.test(name!)) continue;
    if (isPlaceholder(value!) || value === DEMO_PASSWORD) continue;
    out.push({ index: m.index!, kind: `literal ${name}` });
  }
  for (const m of text.matchAll(URL_PASSWORD)) {
    if (!isPlaceholder(m[1]!)) out.push({ index: m.index!, kind: 'password in a URL' });
  }
  return out;
}

const lineAt = (text: string, index: number) => text.slice(0, index).split('\n').length;

/** The findings in one file's text; `file` (its repository path) decides the rules. */
export function scanText(file: string, text: string): SecretFinding[] {
  const findings: SecretFinding[] = [];
  for (const [kind, pattern] of ALWAYS) {
    const m = pattern.exec(text);
    if (m) findings.push({ file, line: lineAt(text, m.index), kind });
  }
  if (!TEST_FILE.test(file)) {
    for (const f of literalPasswords(text, file)) {
      findings.push({ file, line: lineAt(text, f.index), kind: f.kind });
    }
  }
  return findings;
}

let cached: { files: string[]; scanned: number; findings: SecretFinding[] } | null = null;

/**
 * Scans the working-tree content of every tracked file (binary files and files over 5 MB are
 * skipped; the lock file is scanned). Literal passwords are allowed in test code and as the
 * documented demo password.
 */
export function repositorySecrets(): {
  files: string[];
  scanned: number;
  findings: SecretFinding[];
} {
  if (cached) return cached;
  const files = execFileSync('git', ['ls-files', '-z'], { cwd: REPO_ROOT, encoding: 'utf8' })
    .split('\0')
    .filter(Boolean);
  const findings: SecretFinding[] = [];
  let scanned = 0;
  for (const file of files) {
    const path = join(REPO_ROOT, file);
    if (!existsSync(path) || !statSync(path).isFile() || statSync(path).size > 5 * 1024 * 1024) {
      continue;
    }
    const bytes = readFileSync(path);
    if (bytes.subarray(0, 8192).includes(0)) continue;
    scanned += 1;
    findings.push(...scanText(file, bytes.toString('utf8')));
  }
  cached = { files, scanned, findings };
  return cached;
}
