/**
 * mariadb 3.0.2 sends a batch as COM_STMT_BULK_EXECUTE packets of at most `maxAllowedPacket`
 * (4 MiB unless configured). When the last row of a batch spills past that limit, the driver
 * reads past its rows (`!this.rowIdx >= this.values.length` in lib/cmd/batch-bulk.js), the
 * batch rejects with a TypeError, and its command stays at the head of the connection's queue,
 * where it takes the answers meant for the statements after it. The writer cuts its batches
 * below the limit; two 2.5 MB rows used to go out as one 5 MB batch.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeWafer } from '../../sweep-test-helpers';
import { Sweep, SweepPoint } from '../../sweep.model';
import { createTestContext, type TestContext } from '../../../testing/test-context';
import type { ConvertedPoint } from '../import-types';
import { PointWriter } from './point-writer';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const point = (row: number): ConvertedPoint => ({
  sourceRows: [row],
  recordIndexes: [row],
  temperatureK: 300 + row,
  currentA: 1e-3,
  voltageV: 1e-2,
  resistanceOhm: null,
  sheetResistanceOhmSq: 45,
  resistivityOhmCm: 2.2,
  flags: [],
});

describe('points with very wide raw rows', () => {
  it('are written whole, and the connection still answers the next statement', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const raw = JSON.stringify(['x'.repeat(2_500_000)]);
    const stored = await ctx.sequelize.transaction(async (transaction) => {
      const sweep = await Sweep.create(
        {
          waferId: wafer.id,
          stationId: null,
          method: 'four-point',
          geometry: {},
          uploadedById: ctx.users.engineer.id,
          originalName: 'wide.csv',
          sizeBytes: 0,
          sha256: 'f'.repeat(64),
          storageKind: 'db',
          storageKey: 'wide',
          columnMapping: [],
          metadata: null,
          parseReport: {},
          pointCount: 0,
          minTemperatureK: null,
          maxTemperatureK: null,
          deletedById: null,
        },
        { transaction },
      );
      const writer = new PointWriter(sweep.id, () => raw, transaction);
      await writer.write([point(2), point(3)]);
      const written = await writer.finish();
      const count = await SweepPoint.count({ where: { sweepId: sweep.id }, transaction });
      return { written, count };
    });
    expect(stored).toEqual({ written: 2, count: 2 });
  });
});
