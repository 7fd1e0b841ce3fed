import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../config';
import { connectDatabase } from '../db/database';
import { createTestContext, type TestContext } from '../testing/test-context';

/** Tables whose every row must survive a backup and restore unchanged. */
const TABLES = [
  'users',
  'lots',
  'wafers',
  'stations',
  'sweeps',
  'sweep_points',
  'raw_files',
  'fits',
  'audit_events',
];

async function digest(
  ctx: TestContext,
  dbName: string,
): Promise<Record<string, { rows: number; sha256: string }>> {
  const db = connectDatabase({ ...ctx.config.db, name: dbName }, { poolMax: 1 });
  const out: Record<string, { rows: number; sha256: string }> = {};
  try {
    for (const table of TABLES) {
      const [rows] = (await db.query(`SELECT * FROM \`${table}\` ORDER BY 1`)) as [
        unknown[],
        unknown,
      ];
      const text = JSON.stringify(rows, (_k, v: unknown) =>
        Buffer.isBuffer(v) ? v.toString('base64') : v,
      );
      out[table] = { rows: rows.length, sha256: createHash('sha256').update(text).digest('hex') };
    }
  } finally {
    await db.close();
  }
  return out;
}

describe('npm run db:backup and db:restore', () => {
  let ctx: TestContext;
  let backupDir: string;
  beforeAll(async () => {
    ctx = await createTestContext();
    backupDir = mkdtempSync(join(tmpdir(), 'rhotrace-backup-'));
    const q = ctx.sequelize.getQueryInterface();
    const now = new Date();
    await q.bulkInsert('lots', [
      {
        code: 'BK-1',
        material: 'Si',
        dopant: 'B',
        dopant_type: 'p',
        created_at: now,
        updated_at: now,
      },
    ]);
    const [[lot]] = (await ctx.sequelize.query("SELECT id FROM lots WHERE code = 'BK-1'")) as [
      Array<{ id: number }>,
      unknown,
    ];
    await q.bulkInsert('wafers', [
      { lot_id: lot!.id, number: '01', state: 'measured', created_at: now, updated_at: now },
    ]);
    const [[wafer]] = (await ctx.sequelize.query('SELECT id FROM wafers')) as [
      Array<{ id: number }>,
      unknown,
    ];
    const bytes = Buffer.from(
      'T (K),V (mV),I (mA)\r\n300,1.5,1\r\n310,1.6,1\r\n\u00b5\u03a9\r\n',
      'utf8',
    );
    await q.bulkInsert('raw_files', [
      { storage_key: 'k1', size_bytes: bytes.length, content: bytes, created_at: now },
    ]);
    await q.bulkInsert('sweeps', [
      {
        wafer_id: wafer!.id,
        method: 'four-point',
        geometry: '{"thicknessCm":0.05}',
        uploaded_by_id: ctx.users.engineer.id,
        original_name: 'run ü.csv',
        size_bytes: bytes.length,
        sha256: createHash('sha256').update(bytes).digest('hex'),
        storage_kind: 'db',
        storage_key: 'k1',
        column_mapping: '{}',
        parse_report: '{}',
        point_count: 2,
        created_at: now,
        updated_at: now,
      },
    ]);
    const [[sweep]] = (await ctx.sequelize.query('SELECT id FROM sweeps')) as [
      Array<{ id: number }>,
      unknown,
    ];
    await q.bulkInsert(
      'sweep_points',
      [1, 2].map((i) => ({
        sweep_id: sweep!.id,
        sequence: i,
        source_row: i + 1,
        temperature_k: 290 + 10 * i + 1 / 3,
        resistivity_ohm_cm: 10.12345678901234 * i,
        raw: '{"T (K)":"300"}',
        flags: '',
      })),
    );
    await q.bulkInsert('fits', [
      {
        sweep_id: sweep!.id,
        kind: 'arrhenius',
        inputs: '{}',
        parameters: '{"activationEnergyEv":0.5612345678901234}',
        standard_errors: '{}',
        confidence_intervals: '{}',
        goodness: '{}',
        residuals: '[]',
        converged: true,
        model_version: 't',
        created_by_id: ctx.users.physicist.id,
        created_at: now,
        updated_at: now,
      },
    ]);
  });
  afterAll(async () => {
    rmSync(backupDir, { recursive: true, force: true });
    await ctx.close();
  });

  it('restores every lot, sweep, point, raw byte and fit identically after the database is dropped', async () => {
    const dbName = ctx.config.db.name;
    const before = await digest(ctx, dbName);
    expect(before.sweep_points!.rows).toBe(2);
    const env = { ...process.env, DB_NAME: dbName };
    const file = execFileSync('bash', [join(REPO_ROOT, 'db/db.sh'), 'backup', backupDir], {
      env,
      encoding: 'utf8',
    }).trim();
    expect(readFileSync(file, 'utf8').slice(0, 4096)).toMatch(/MariaDB dump|MySQL dump/);

    await ctx.sequelize.query(`DROP DATABASE \`${dbName}\``);
    await expect(digest(ctx, dbName)).rejects.toThrow();

    execFileSync('bash', [join(REPO_ROOT, 'db/db.sh'), 'restore', file], { env, stdio: 'pipe' });
    expect(await digest(ctx, dbName)).toEqual(before);
  });

  it('refuses to restore a file that is not a dump, leaving the database alone', async () => {
    const bogus = join(backupDir, 'not-a-dump.sql');
    execFileSync('bash', ['-c', `echo 'DROP TABLE lots;' > '${bogus}'`]);
    const env = { ...process.env, DB_NAME: ctx.config.db.name };
    expect(() =>
      execFileSync('bash', [join(REPO_ROOT, 'db/db.sh'), 'restore', bogus], { env, stdio: 'pipe' }),
    ).toThrow();
    const after = await digest(ctx, ctx.config.db.name);
    expect(after.lots!.rows).toBe(1);
  });
});
