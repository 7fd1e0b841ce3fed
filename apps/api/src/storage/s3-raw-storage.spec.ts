import { createHash, randomBytes } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
// s3rver ships no types; it is the local S3 stand-in for tests only.
// @ts-expect-error no type declarations
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HttpError } from '../errors';
import { freePortForTest } from '../testing/free-port';
import { S3RawStorage, s3SettingsFromEnv } from './s3-raw-storage';

describe('S3RawStorage against a local S3 stand-in (s3rver)', () => {
  let server: { run: () => Promise<unknown>; close: () => Promise<void> };
  let dir: string;
  let storage: S3RawStorage;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'rhotrace-s3-'));
    const port = await freePortForTest();
    server = new S3rver({ port, address: '127.0.0.1', silent: true, directory: dir });
    await server.run();
    storage = new S3RawStorage(
      s3SettingsFromEnv({
        S3_ENDPOINT: `http://127.0.0.1:${port}`,
        S3_BUCKET: 'rhotrace-raw-test',
        S3_ACCESS_KEY_ID: 'S3RVER',
        S3_SECRET_ACCESS_KEY: 'S3RVER',
      }),
    );
  });
  afterAll(async () => {
    storage.close();
    await server.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('keeps bytes identical, including a BOM, CRLF, NUL and non-UTF-8 bytes', async () => {
    const content = Buffer.concat([
      Buffer.from([0xef, 0xbb, 0xbf]),
      Buffer.from('T (°C);R [kΩ]\r\n23,0;1,5\r\n'),
      Buffer.from([0x00, 0xff, 0xfe]),
      randomBytes(300_000),
    ]);
    const key = await storage.put(content);
    expect(key).toMatch(/^raw-[0-9a-f-]{36}$/);
    const back = await storage.get(key);
    expect(back).not.toBeNull();
    expect(createHash('sha256').update(back!).digest('hex')).toBe(
      createHash('sha256').update(content).digest('hex'),
    );
  });

  it('answers null for an unknown key and forgets deleted objects', async () => {
    expect(await storage.get('raw-00000000-0000-0000-0000-000000000000')).toBeNull();
    const key = await storage.put(Buffer.from('x'));
    await storage.delete(key);
    expect(await storage.get(key)).toBeNull();
  });

  it('names the missing variable when configured incompletely', () => {
    expect(() => s3SettingsFromEnv({ S3_BUCKET: 'b' })).toThrow(/S3_ACCESS_KEY_ID/);
  });
});

describe('S3RawStorage when the store does not answer', () => {
  it('refuses a put with a 503 and Retry-After, not a server fault', async () => {
    const port = await freePortForTest(); // nothing listens there
    const storage = new S3RawStorage({
      endpoint: `http://127.0.0.1:${port}`,
      region: 'us-east-1',
      bucket: 'rhotrace-unreachable',
      accessKeyId: 'S3RVER',
      secretAccessKey: 'S3RVER',
      forcePathStyle: true,
    });
    const error = await storage.put(Buffer.from('T (K),R (ohm)\n300,1\n')).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(HttpError);
    expect((error as HttpError).status).toBe(503);
    expect((error as HttpError).headers).toEqual({ 'Retry-After': '5' });
    expect((error as HttpError).message).toMatch(/raw-file store does not answer/);
  });
});
