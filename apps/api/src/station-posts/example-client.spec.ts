/**
 * Runs docs/examples/station_client.py (Python, standard library only) against a test server:
 * the documented client must store a sweep, survive a dropped connection by retrying with the
 * same Idempotency-Key, and get the first answer again when it sends the file twice.
 */
import { execFile, execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { promisify } from 'node:util';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Assignment } from '../assignments/assignment.model';
import { REPO_ROOT } from '../config';
import { makeStation, makeWafer } from '../sweeps/sweep-test-helpers';
import { Sweep } from '../sweeps/sweep.model';
import { fourPointCsv } from '../testing/sweep-files';
import { createTestContext, type TestContext } from '../testing/test-context';

const run = promisify(execFile);
const CLIENT = join(REPO_ROOT, 'docs/examples/station_client.py');

let ctx: TestContext;
let server: Server;
let baseUrl: string;
/** Connections the server cuts before answering (a network hiccup), counted down. */
let dropNext = 0;

beforeAll(async () => {
  try {
    execFileSync('python3', ['--version']);
  } catch {
    throw new Error('python3 is required: this test runs the documented example station client');
  }
  ctx = await createTestContext();
  server = createServer((req, res) => {
    if (dropNext > 0) {
      dropNext -= 1;
      req.socket.destroy();
      return;
    }
    ctx.app(req, res);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await ctx?.close();
});

async function client(token: string, args: string[]) {
  const env = { ...process.env, RHOTRACE_URL: baseUrl, RHOTRACE_STATION_TOKEN: token };
  try {
    const { stdout, stderr } = await run('python3', [CLIENT, ...args], { env });
    return { code: 0, out: JSON.parse(stdout), stderr };
  } catch (error) {
    const e = error as { code?: number; stdout?: string; stderr?: string };
    return { code: e.code, out: e.stdout ? JSON.parse(e.stdout) : null, stderr: e.stderr ?? '' };
  }
}

describe('docs/examples/station_client.py', () => {
  it('posts a sweep, retries a dropped connection with the same key, and never stores twice', async () => {
    const station = await makeStation({ probeSpacingCm: 0.1, name: 'Bench P' });
    const made = await request(ctx.app)
      .post(`/api/stations/${station.id}/tokens`)
      .set(ctx.auth('manager'))
      .send({ label: 'example client' });
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    await Assignment.create({
      waferId: wafer.id,
      assigneeId: ctx.users.technician.id,
      assignedById: ctx.users.manager.id,
      task: 'Measure rho(T)',
      dueDate: '2031-01-31',
      notes: null,
      stationId: station.id,
    });
    const file = join(ctx.config.dataDir, 'bench-p.csv');
    writeFileSync(file, fourPointCsv(50, 'python'));
    const args = ['--wafer', String(wafer.id), '--method', 'four-point', '--wait', '0.05', file];

    dropNext = 1;
    const first = await client(made.body.token, args);
    expect(first.code, first.stderr).toBe(0);
    expect(first.stderr).toContain('retrying');
    expect(first.out.status).toBe(201);
    expect(first.out.answer).toMatchObject({ pointCount: 50, waferId: wafer.id, replayed: false });

    const again = await client(made.body.token, args);
    expect(again.code).toBe(0);
    expect(again.out.answer).toMatchObject({ id: first.out.answer.id, replayed: true });
    expect(await Sweep.count({ where: { waferId: wafer.id } })).toBe(1);

    const refused = await client(made.body.token, ['--wafer', '999999', '--wait', '0.05', file]);
    expect(refused.code).toBe(1);
    expect(refused.out.status).toBe(403);
  });
});
