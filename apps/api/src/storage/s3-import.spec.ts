import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
// s3rver ships no types; it is the local S3 stand-in for tests only.
// @ts-expect-error no type declarations
import S3rver from 's3rver';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importSweep } from '../sweeps/sweep-import.service';
import { makeWafer, uploadFourPoint } from '../sweeps/sweep-test-helpers';
import { RawFile, Sweep, SweepPoint } from '../sweeps/sweep.model';
import { freePortForTest } from '../testing/free-port';
import { createTestContext, type TestContext } from '../testing/test-context';
import { houseKeep } from '../ops/housekeeping';
import { ORPHAN_GRACE_S, removeOrphanedObjects } from './object-reconciler';
import type { S3RawStorage } from './s3-raw-storage';
import { closeRawStorages, rawStorageFor } from './storage';

const BUCKET = 'rhotrace-raw-e2e';
const S3_ENV = ['S3_ENDPOINT', 'S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const;

let server: { run: () => Promise<unknown>; close: () => Promise<void> };
let dir: string;
let client: S3Client;
let ctx: TestContext;
const savedEnv: Record<string, string | undefined> = {};

function sweepFile(rows: number, tag: string): Buffer {
  // CRLF, a BOM and a metadata line: the download must give these bytes back unchanged.
  const lines = [`# run ${tag}`, 'T (K);I (mA);V (mV)'];
  for (let i = 0; i < rows; i++)
    lines.push(
      `${(80 + i * 0.01).toFixed(2)};1,000;${(10 + i * 1e-4).toFixed(5).replace('.', ',')}`,
    );
  return Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(`${lines.join('\r\n')}\r\n`)]);
}

const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');

async function bucketKeys(): Promise<string[]> {
  const res = await client.send(new ListObjectsV2Command({ Bucket: BUCKET }));
  return (res.Contents ?? []).map((o) => o.Key!).sort();
}

const upload = (waferId: number, file: Buffer) =>
  uploadFourPoint(ctx, ctx.auth('engineer'), waferId, file);

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'rhotrace-s3-e2e-'));
  const port = await freePortForTest();
  server = new S3rver({ port, address: '127.0.0.1', silent: true, directory: dir });
  await server.run();
  const env = {
    S3_ENDPOINT: `http://127.0.0.1:${port}`,
    S3_BUCKET: BUCKET,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
  };
  for (const key of S3_ENV) {
    savedEnv[key] = process.env[key];
    process.env[key] = env[key];
  }
  ctx = await createTestContext({ storage: 's3' });
  client = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
});

afterAll(async () => {
  await ctx?.close();
  closeRawStorages();
  client?.destroy();
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
  for (const key of S3_ENV) {
    if (savedEnv[key] === undefined) delete process.env[key];
    else process.env[key] = savedEnv[key];
  }
});

describe('RAW_STORAGE=s3 end to end (s3rver stand-in)', () => {
  let firstKey = '';

  it('stores the upload as an object, not in raw_files, and downloads it byte for byte', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const file = sweepFile(500, 'one');
    const res = await upload(wafer.id, file);
    expect(res.status).toBe(201);
    expect(res.body.pointCount).toBe(500);
    const sweep = await Sweep.findByPk(res.body.id as number);
    expect(sweep!.storageKind).toBe('s3');
    expect(sweep!.storageKey).toMatch(/^raw-[0-9a-f-]{36}$/);
    firstKey = sweep!.storageKey;
    expect(await bucketKeys()).toEqual([firstKey]);
    expect(await RawFile.count()).toBe(0);

    const raw = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}/raw`)
      .set(ctx.auth('engineer'))
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(raw.status).toBe(200);
    expect(Buffer.compare(raw.body as Buffer, file)).toBe(0);
    expect(sha(raw.body as Buffer)).toBe(sweep!.sha256);
  });

  it('leaves no object behind when the database fails half-way through the points', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const before = {
      sweeps: await Sweep.count({ paranoid: false }),
      points: await SweepPoint.count(),
    };
    await ctx.sequelize.query(
      'CREATE TRIGGER s3_fail_half_way BEFORE INSERT ON sweep_points FOR EACH ROW ' +
        "IF NEW.sequence = 700 THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'disk full (test)'; END IF",
    );
    try {
      const res = await upload(wafer.id, sweepFile(1500, 'two'));
      expect(res.status).toBe(500);
    } finally {
      await ctx.sequelize.query('DROP TRIGGER s3_fail_half_way');
    }
    expect(await bucketKeys()).toEqual([firstKey]);
    expect({
      sweeps: await Sweep.count({ paranoid: false }),
      points: await SweepPoint.count(),
    }).toEqual(before);
  });

  it('leaves no object behind when a row is refused after the write began (422)', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    // Zero current in the last row: found during conversion, after the object was sent.
    const file = Buffer.concat([sweepFile(800, 'three'), Buffer.from('99,00;0;1,0\r\n')]);
    const res = await upload(wafer.id, file);
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body.error)).toMatch(/row 803/);
    expect(await bucketKeys()).toEqual([firstKey]);
  });

  it('writes no object for a duplicate (409)', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const file = sweepFile(50, 'four');
    expect((await upload(wafer.id, file)).status).toBe(201);
    const keys = await bucketKeys();
    expect(keys).toHaveLength(2);
    expect((await upload(wafer.id, file)).status).toBe(409);
    expect(await bucketKeys()).toEqual(keys);
  });

  it('reads each sweep from the storage its storage_kind names', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const file = sweepFile(20, 'five');
    const created = await importSweep(
      {
        waferId: wafer.id,
        file,
        originalName: 'kept-in-db.csv',
        method: 'four-point',
        geometry: { spacingCm: 0.1 },
      },
      { ...ctx.users.engineer.get({ plain: true }), role: 'engineer' } as never,
      { storage: rawStorageFor('db') },
    );
    const sweep = await Sweep.findByPk(created.id);
    expect(sweep!.storageKind).toBe('db');
    expect(await RawFile.count()).toBe(1);
    const raw = await request(ctx.app)
      .get(`/api/sweeps/${created.id}/raw`)
      .set(ctx.auth('engineer'))
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(raw.status).toBe(200);
    expect(Buffer.compare(raw.body as Buffer, file)).toBe(0);
  });

  it('removes objects no sweep names once they are an hour old, and keeps every named one', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const kept = await upload(wafer.id, sweepFile(30, 'six'));
    expect(kept.status).toBe(201);
    const deleted = await upload(wafer.id, sweepFile(30, 'seven'));
    expect(deleted.status).toBe(201);
    expect(
      (await request(ctx.app).delete(`/api/sweeps/${deleted.body.id}`).set(ctx.auth('admin')))
        .status,
    ).toBe(204);
    // what an API process killed between the object write and the commit leaves behind
    await client.send(
      new PutObjectCommand({ Bucket: BUCKET, Key: 'raw-orphan-of-a-killed-upload', Body: 'T;V\n' }),
    );
    const named = (await Sweep.findAll({ paranoid: false, where: { storageKind: 's3' } })).map(
      (s) => s.storageKey,
    );
    expect(named).toHaveLength(4);
    const storage = rawStorageFor('s3') as S3RawStorage;
    // just written: inside the grace period, nothing goes
    expect(await removeOrphanedObjects(ctx.sequelize, storage)).toEqual({ checked: 0, deleted: 0 });
    const later = new Date(Date.now() + (ORPHAN_GRACE_S + 60) * 1000);
    expect(await removeOrphanedObjects(ctx.sequelize, storage, later)).toEqual({
      checked: 5,
      deleted: 1,
    });
    expect(await bucketKeys()).toEqual([...named].sort());
    // an object Rhotrace did not name is never touched
    await client.send(new PutObjectCommand({ Bucket: BUCKET, Key: 'notes/other.txt', Body: 'x' }));
    named.push('notes/other.txt');
    // the hourly chores do the same, and say what they removed
    await client.send(new PutObjectCommand({ Bucket: BUCKET, Key: 'raw-orphan-two', Body: 'x' }));
    const logged: unknown[] = [];
    const logger = { info: (o: unknown) => logged.push(o), warn: (o: unknown) => logged.push(o) };
    await houseKeep(
      { sequelize: ctx.sequelize, config: { storage: 's3' }, logger: logger as never },
      later,
    );
    expect(await bucketKeys()).toEqual([...named].sort());
    expect(logged).toContainEqual({ checked: 5, deleted: 1 });
  });
});
