import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, isAbsolute, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseDatabaseHosts, type DatabaseHost } from './db/database-hosts';
import { calibrationIntervalMonths } from './stations/calibration';

/** The repository root, found from this file so scripts work from any working directory. */
export const REPO_ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');

export interface DbConfig {
  /** The first (or only) database host; with `hosts`, the first of them. */
  host: string;
  port: number;
  /** `DB_HOSTS`: every host of a cluster in order of preference (see db/database-hosts.ts). */
  hosts?: DatabaseHost[];
  name: string;
  user: string;
  password: string;
}

export interface AppConfig {
  nodeEnv: string;
  production: boolean;
  host: string;
  port: number;
  dataDir: string;
  publicUrl: string;
  db: DbConfig;
  jwtSecret: string;
  /** Lifetime of a sign-in token in seconds. */
  tokenTtlS: number;
  smtp: { host: string; port: number; from: string };
  mailDir: string;
  uploadLimitBytes: number;
  webDist: string;
  storage: 'db' | 's3';
  /** Sign-in attempts one address and e-mail may make per 15 minutes (first-line limiter). */
  signInLimitPer15Min: number;
  /** Sweeps one station token may post per minute (429 with Retry-After beyond). */
  stationPostsPerMinute: number;
}

type Env = Record<string, string | undefined>;

function readEnvFile(path: string): Env {
  if (!existsSync(path)) return {};
  const out: Env = {};
  for (const line of readFileSync(path, 'utf8').split('\n')) {
    const m = /^([A-Z_]+)=(.*)$/.exec(line.trim());
    if (m) out[m[1]!] = m[2];
  }
  return out;
}

function intFrom(env: Env, key: string, fallback: number): number {
  const raw = env[key];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value <= 0) {
    throw new Error(`${key} must be a positive whole number, got "${raw}"`);
  }
  return value;
}

/** Reads the JWT secret kept in the data directory, creating it on first use (never committed). */
function jwtSecretFrom(env: Env, dataDir: string): string {
  if (env.JWT_SECRET) return env.JWT_SECRET;
  const file = join(dataDir, 'jwt-secret');
  if (!existsSync(file)) {
    mkdirSync(dirname(file), { recursive: true });
    writeFileSync(file, randomBytes(48).toString('hex'), { mode: 0o600 });
  }
  return readFileSync(file, 'utf8').trim();
}

/** `DB_HOSTS`, when set, replaces `DB_HOST` and `DB_PORT`. */
function dbHosts(
  list: string,
  host: string,
  port: number,
): Pick<DbConfig, 'host' | 'port' | 'hosts'> {
  if (!list) return { host, port };
  const hosts = parseDatabaseHosts(list);
  return { host: hosts[0]!.host, port: hosts[0]!.port, hosts };
}

/** Builds the configuration from environment variables and the data directory's files. */
export function loadConfig(env: Env = process.env): AppConfig {
  const dataDirRaw = env.DATA_DIR ?? join(REPO_ROOT, 'db/.data');
  const dataDir = isAbsolute(dataDirRaw) ? dataDirRaw : resolve(REPO_ROOT, dataDirRaw);
  const fromFile = readEnvFile(join(dataDir, 'db.env'));
  const pick = (key: string, fallback: string): string => env[key] ?? fromFile[key] ?? fallback;
  const port = intFrom(env, 'PORT', 4300);
  const nodeEnv = env.NODE_ENV ?? 'development';
  // read where it is used; checked here so a bad value stops the start, not an upload
  calibrationIntervalMonths(env);
  return {
    nodeEnv,
    production: nodeEnv === 'production',
    host: env.HOST ?? '127.0.0.1',
    port,
    dataDir,
    publicUrl: env.PUBLIC_URL ?? `http://127.0.0.1:${port}`,
    db: {
      ...dbHosts(
        pick('DB_HOSTS', ''),
        pick('DB_HOST', '127.0.0.1'),
        Number(pick('DB_PORT', '3307')),
      ),
      name: pick('DB_NAME', 'rhotrace'),
      user: pick('DB_USER', 'rhotrace'),
      password: pick('DB_PASSWORD', ''),
    },
    jwtSecret: jwtSecretFrom(env, dataDir),
    tokenTtlS: intFrom(env, 'TOKEN_TTL_S', 8 * 3600),
    smtp: {
      host: env.SMTP_HOST ?? '127.0.0.1',
      port: intFrom(env, 'SMTP_PORT', port + 25),
      from: env.MAIL_FROM ?? 'Rhotrace <notebook@rhotrace.example>',
    },
    mailDir: env.MAIL_DIR ?? join(dataDir, 'mail'),
    uploadLimitBytes: intFrom(env, 'UPLOAD_LIMIT_MB', 20) * 1024 * 1024,
    webDist: env.WEB_DIST ?? join(REPO_ROOT, 'dist/web/browser'),
    storage: env.RAW_STORAGE === 's3' ? 's3' : 'db',
    signInLimitPer15Min: intFrom(env, 'SIGN_IN_LIMIT', 30),
    stationPostsPerMinute: intFrom(env, 'STATION_POSTS_PER_MIN', 30),
  };
}
