import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_LOTS, DEMO_PASSWORD, DEMO_USERS } from '../../../../seed-data/demo-lab';
import { createTestContext, type TestContext } from '../testing/test-context';
import { User } from '../users/user.model';
import { seeder } from './migrator';

const count = async (ctx: TestContext, sql: string) => {
  const [rows] = (await ctx.sequelize.query(sql)) as [Array<{ n: number }>, unknown];
  return Number(rows[0]?.n ?? 0);
};

describe('demo seed', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('loads the invented lab once, with sweeps imported and fits saved, and is idempotent', async () => {
    const first = await seeder(ctx.sequelize).up();
    expect(first.map((m) => m.name)).toEqual([
      '0001-demo-lab',
      '0002-demo-sweeps',
      '0003-demo-maps',
    ]);
    const second = await seeder(ctx.sequelize).up();
    expect(second).toEqual([]);

    expect(
      await count(ctx, "SELECT COUNT(*) AS n FROM users WHERE email LIKE '%@rhotrace.example'"),
    ).toBe(DEMO_USERS.length);
    expect(await count(ctx, 'SELECT COUNT(*) AS n FROM lots')).toBe(DEMO_LOTS.length);
    // five single-place sweeps and one wafer map
    expect(await count(ctx, 'SELECT COUNT(*) AS n FROM sweeps')).toBe(6);
    expect(await count(ctx, 'SELECT COUNT(*) AS n FROM sweeps WHERE map_info IS NOT NULL')).toBe(1);
    expect(await count(ctx, 'SELECT COUNT(*) AS n FROM raw_files')).toBe(6);
    expect(await count(ctx, 'SELECT COUNT(*) AS n FROM fits WHERE converged = 1')).toBe(3);
    expect(await count(ctx, "SELECT COUNT(*) AS n FROM audit_events WHERE entity = 'sweep'")).toBe(
      6,
    );
  });

  it('gives every role a demo account with the documented password, all under .example', async () => {
    for (const role of ['admin', 'manager', 'engineer', 'physicist', 'technician']) {
      const user = await User.findOne({ where: { email: `${role}@rhotrace.example` } });
      expect(user?.role).toBe(role);
      expect(await bcrypt.compare(DEMO_PASSWORD, user!.passwordHash)).toBe(true);
    }
    for (const u of DEMO_USERS) expect(u.email.endsWith('.example')).toBe(true);
  });

  it('gives the technician assigned wafers with sweeps to see', async () => {
    const technician = await User.findOne({ where: { email: 'technician@rhotrace.example' } });
    const assigned = await count(
      ctx,
      `SELECT COUNT(*) AS n FROM assignments WHERE assignee_id = ${technician!.id}`,
    );
    expect(assigned).toBeGreaterThanOrEqual(2);
  });
});
