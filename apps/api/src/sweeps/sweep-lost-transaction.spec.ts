/**
 * An upload whose transaction is lost part-way (issue 19: on a Galera cluster a brute-force
 * abort rolled the transaction back, its deadlock error never reached the import, the later
 * statements ran in autocommit and COMMIT "succeeded": 201, the sweep and its points missing,
 * the audit event "create sweep N" stored). On one MariaDB the same state is made by issuing
 * ROLLBACK on the transaction's own connection behind Sequelize's back, from a `beforeQuery`
 * hook. A deadlock (1213) and a joining Galera node (1047) are raised by a trigger with SIGNAL.
 * The rule checked: no 201 unless the sweep, all its points, its raw file and its audit event
 * are stored exactly once; a failure of the moment is retried once; twice is a 503 with
 * Retry-After and nothing stored.
 */
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Options, Transaction } from 'sequelize';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { fourPointCsv } from '../testing/sweep-files';
import { makeWafer, uploadFourPoint } from './sweep-test-helpers';
import { RawFile, Sweep, SweepPoint } from './sweep.model';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});
afterEach(async () => {
  ctx.sequelize.removeHook('beforeQuery', 'silent-abort');
  ctx.sequelize.removeHook('afterQuery', 'silent-abort');
  await ctx.sequelize.query('DROP TRIGGER IF EXISTS transient_fault');
  await ctx.sequelize.query('DROP TABLE IF EXISTS transient_fault_fired');
});

/** Rows of the points file: a point 1234 to delete, and rows enough for a fault mid-insert. */
const ROWS = 2_500;

const upload = (waferId: number, file: Buffer) =>
  uploadFourPoint(ctx, ctx.auth('engineer'), waferId, file);

async function counts() {
  return {
    sweeps: await Sweep.count({ paranoid: false }),
    points: await SweepPoint.count(),
    raw: await RawFile.count(),
    audit: await AuditEvent.count({ where: { entity: 'sweep', action: 'create' } }),
  };
}

type QueryOptions = Options & { transaction?: Transaction; type?: string; model?: unknown };

/** A point in the import: before or after the first query `at` matches. */
interface Place {
  hook: 'beforeQuery' | 'afterQuery';
  at: (o: QueryOptions) => boolean;
}

// the sweep row's completing update, not the leg and flag updates of its points just before it
const completingTheSweep = (o: QueryOptions) =>
  (o.type === 'UPDATE' || o.type === 'BULKUPDATE') && o.model === Sweep;

/** Where in the import the transaction is lost. */
const WHERE: Record<string, Place> = {
  // after every point is written, before the sweep row is completed (what issue 19 saw)
  'after the points': { hook: 'beforeQuery', at: completingTheSweep },
  // after the sweep row is completed, before the audit event
  'before the audit event': { hook: 'afterQuery', at: completingTheSweep },
  // after the wafer lock, before the duplicate check and the raw file's write
  'before the raw file': {
    hook: 'beforeQuery',
    at: (o) => o.type === 'SELECT' && o.model === Sweep,
  },
};

/**
 * Issues ROLLBACK on the upload transaction's own connection at `place`, `times` times in all
 * (Infinity: every attempt). Sequelize and the import are not told, as when a Galera node
 * aborts a transaction and its error goes unseen.
 */
function loseTransaction(place: Place, times: number): { fired: number } {
  const state = { fired: 0 };
  ctx.sequelize.addHook(place.hook, 'silent-abort', async (options: QueryOptions) => {
    if (!options.transaction || !place.at(options) || state.fired >= times) return;
    state.fired += 1;
    const { connection } = options.transaction as unknown as {
      connection: { query(sql: string): Promise<unknown> };
    };
    await connection.query('ROLLBACK');
  });
  return state;
}

/** Checks an answered 201 stored its sweep, every point and one audit event. */
async function expectStoredOnce(res: request.Response, before: Awaited<ReturnType<typeof counts>>) {
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  expect(res.body.pointCount).toBe(ROWS);
  const sweep = await Sweep.findByPk(res.body.id as number);
  expect(sweep, 'the sweep answered 201 is stored').not.toBeNull();
  expect(sweep!.pointCount).toBe(ROWS);
  expect(await SweepPoint.count({ where: { sweepId: res.body.id } })).toBe(ROWS);
  const audit = await AuditEvent.findAll({
    where: { entity: 'sweep', action: 'create', entityId: String(res.body.id) },
  });
  expect(audit).toHaveLength(1);
  expect(await counts()).toEqual({
    sweeps: before.sweeps + 1,
    points: before.points + ROWS,
    raw: before.raw + 1,
    audit: before.audit + 1,
  });
}

describe('a transaction lost part-way through an upload', () => {
  it.each(Object.keys(WHERE))('%s, once: the retry stores the upload exactly once', async (at) => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const before = await counts();
    const fault = loseTransaction(WHERE[at]!, 1);
    const res = await upload(wafer.id, fourPointCsv(ROWS, 'lost once'));
    expect(fault.fired).toBe(1);
    await expectStoredOnce(res, before);
  });

  it.each(Object.keys(WHERE))(
    '%s, every time: 503 with Retry-After, nothing stored',
    async (at) => {
      const wafer = await makeWafer({ thicknessCm: 0.05 });
      const before = await counts();
      const fault = loseTransaction(WHERE[at]!, Infinity);
      const res = await upload(wafer.id, fourPointCsv(ROWS, 'lost always'));
      expect(fault.fired).toBe(2);
      expect(res.status).toBe(503);
      expect(res.headers['retry-after']).toBe('2');
      expect(res.body.error.code).toBe('unavailable');
      expect(res.body.error.message).toMatch(/nothing was stored/);
      expect(await counts()).toEqual(before);
    },
  );
});

describe('a point missing from the transaction though its batch reported it inserted', () => {
  it('is found by the count behind the audit event: retried, stored exactly once', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const before = await counts();
    let dropped = 0;
    // after the sweep row is completed: remove one point from the middle, behind the import's back
    ctx.sequelize.addHook('afterQuery', 'silent-abort', async (options: QueryOptions) => {
      if (!options.transaction || !completingTheSweep(options) || dropped > 0) return;
      dropped += 1;
      const { connection } = options.transaction as unknown as {
        connection: { query(sql: string): Promise<unknown> };
      };
      // the upload's own sweep is the newest one its transaction sees
      await connection.query(
        'DELETE FROM sweep_points WHERE sequence = 1234 AND sweep_id = (SELECT MAX(id) FROM sweeps)',
      );
    });
    const res = await upload(wafer.id, fourPointCsv(ROWS, 'one point missing'));
    expect(dropped).toBe(1);
    await expectStoredOnce(res, before);
  });
});

/**
 * A trigger that refuses the 1,500th point with `errno` (as InnoDB or Galera would), `times`
 * times in all: a MyISAM table, which a rollback does not undo, counts the refusals.
 */
async function refusePoints(errno: number, sqlState: string, times: number): Promise<void> {
  await ctx.sequelize.query('CREATE TABLE transient_fault_fired (n INT) ENGINE=MyISAM');
  await ctx.sequelize.query(
    'CREATE TRIGGER transient_fault BEFORE INSERT ON sweep_points FOR EACH ROW ' +
      `IF NEW.sequence = 1500 AND (SELECT COUNT(*) FROM transient_fault_fired) < ${times} THEN ` +
      'INSERT INTO transient_fault_fired VALUES (1); ' +
      `SIGNAL SQLSTATE '${sqlState}' SET MESSAGE_TEXT = 'refused (test)', MYSQL_ERRNO = ${errno}; ` +
      'END IF',
  );
}

const fired = async () =>
  Number(
    (
      (await ctx.sequelize.query('SELECT COUNT(*) AS n FROM transient_fault_fired')) as [
        Array<{ n: number }>,
        unknown,
      ]
    )[0][0]!.n,
  );

describe('a deadlock or a joining Galera node during the point insert', () => {
  it.each([
    ['deadlock', 1213, '40001'],
    ['WSREP has not yet prepared node', 1047, '08S01'],
  ])('%s once: retried, stored exactly once', async (_, errno, sqlState) => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const before = await counts();
    await refusePoints(errno, sqlState, 1);
    const res = await upload(wafer.id, fourPointCsv(ROWS, `refused once ${errno}`));
    expect(await fired()).toBe(1);
    await expectStoredOnce(res, before);
  });

  it('a deadlock on every attempt: 503 with Retry-After, nothing stored', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const before = await counts();
    await refusePoints(1213, '40001', 1000);
    const res = await upload(wafer.id, fourPointCsv(ROWS, 'refused always'));
    expect(await fired()).toBe(2);
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBe('2');
    expect(await counts()).toEqual(before);
  });
});
