/**
 * An upload whose COMMIT takes effect but whose answer is an error: a connection lost under
 * COMMIT after the write set was replicated (a Galera node killed at that moment), or a
 * failure of the moment reported after the work committed. Seen on the cluster suite as a 503
 * ("nothing was stored") followed by a 409 on the client's retry. The rule checked: the client
 * gets 201 with the sweep, which is stored once with its points, raw file and audit event.
 * The error is raised from an after-commit hook of the upload's own transaction.
 */
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
afterEach(() => {
  ctx.sequelize.removeHook('beforeQuery', 'fail-after-commit');
});

const upload = (waferId: number, file: Buffer) =>
  uploadFourPoint(ctx, ctx.auth('engineer'), waferId, file);

/** Makes the next upload transaction's COMMIT take effect and then fail with `error`. */
function failAfterCommit(error: Error): void {
  let armed = true;
  ctx.sequelize.addHook(
    'beforeQuery',
    'fail-after-commit',
    (options: Options & { transaction?: Transaction; model?: unknown }) => {
      if (!armed || !options.transaction || options.model !== Sweep) return;
      armed = false;
      options.transaction.afterCommit(() => {
        throw error;
      });
    },
  );
}

const withCode = (message: string, props: Record<string, unknown>) =>
  Object.assign(new Error(message), props);

const CASES: Record<string, Error> = {
  // what the driver raises when the server goes away mid-COMMIT
  'a connection lost during COMMIT': withCode('socket has unexpectedly been closed', {
    code: 'ER_SOCKET_UNEXPECTED_CLOSE',
    errno: 45009,
  }),
  // a deadlock answer for work that committed: the retry then meets its own file
  'a failure of the moment after the commit': withCode('Deadlock found', {
    errno: 1213,
    sqlState: '40001',
  }),
};

describe('an upload whose commit took effect behind an error', () => {
  for (const [name, error] of Object.entries(CASES)) {
    it(`answers 201 with the stored sweep after ${name}`, async () => {
      const wafer = await makeWafer({ thicknessCm: 0.05 });
      const file = fourPointCsv(40, name);
      failAfterCommit(error);
      const res = await upload(wafer.id, file);
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      const sweeps = await Sweep.findAll({ where: { waferId: wafer.id } });
      expect(sweeps.map((s) => s.id)).toEqual([res.body.id]);
      expect(res.body.pointCount).toBe(40);
      expect(await SweepPoint.count({ where: { sweepId: res.body.id } })).toBe(40);
      expect(await RawFile.count({ where: { storageKey: sweeps[0]!.storageKey } })).toBe(1);
      expect(
        await AuditEvent.count({
          where: { entity: 'sweep', action: 'create', entityId: res.body.id },
        }),
      ).toBe(1);
    });
  }
});
