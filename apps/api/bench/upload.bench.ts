/**
 * Upload benchmark: a 100,000-row four-column four-point-probe file uploaded over HTTP, parsed,
 * converted and stored, against the bare baseline (csv-parse of the same file plus the driver's
 * batch insert of the same rows in one transaction). Prints medians, peak memory growth and the
 * ratio; writes bench/out/upload.json. Needs the MariaDB that `npm run bench` starts (DB_*).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { parse } from 'csv-parse/sync';
import { makeWafer } from '../src/sweeps/sweep-test-helpers';
import { Sweep } from '../src/sweeps/sweep.model';
import { createTestContext } from '../src/testing/test-context';

const ROWS = 100_000;
/** Measured runs of each (BENCH_RUNS overrides; a noisy machine needs more). */
const RUNS = Number(process.env.BENCH_RUNS) || 5;
const RATIO_TARGET = 1.5;
const MEMORY_TARGET_MB = 300;
const OUT = fileURLToPath(new URL('../../../bench/out/', import.meta.url));

function makeFile(seed: number): Buffer {
  const lines = ['time_s,temperature_K,current_A,voltage_V'];
  for (let i = 0; i < ROWS; i++) {
    const t = 80 + (i * 420) / ROWS;
    const v = 0.0123 * (t / 300) ** 1.5 * (1 + 1e-4 * Math.sin(i + seed));
    lines.push(`${(i * 0.5).toFixed(1)},${t.toFixed(4)},1.000e-3,${v.toExponential(6)}`);
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
};

async function main(): Promise<void> {
  const ctx = await createTestContext({ uploadLimitBytes: 20 * 1024 * 1024 });
  const server = ctx.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const auth = ctx.auth('engineer');
  const baselineWafer = await makeWafer({ thicknessCm: 0.05 });
  const holder = await Sweep.create({
    waferId: baselineWafer.id,
    stationId: null,
    method: 'four-point',
    geometry: {},
    uploadedById: ctx.users.engineer.id,
    originalName: 'baseline.csv',
    sizeBytes: 0,
    sha256: '0'.repeat(64),
    storageKind: 'db',
    storageKey: 'baseline',
    columnMapping: [],
    metadata: null,
    parseReport: {},
    pointCount: 0,
    minTemperatureK: null,
    maxTemperatureK: null,
    deletedById: null,
  });

  async function full(file: Buffer): Promise<{ ms: number; peakMb: number }> {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const form = new FormData();
    form.set('method', 'four-point');
    form.set('spacingCm', '0.1');
    form.set('file', new Blob([file], { type: 'text/csv' }), 'bench.csv');
    global.gc?.();
    const rss0 = process.memoryUsage().rss;
    let peak = rss0;
    const timer = setInterval(() => {
      peak = Math.max(peak, process.memoryUsage().rss);
    }, 5);
    const start = performance.now();
    const res = await fetch(`${base}/api/wafers/${wafer.id}/sweeps`, {
      method: 'POST',
      headers: auth,
      body: form,
    });
    const body = (await res.json()) as { pointCount?: number };
    const ms = performance.now() - start;
    clearInterval(timer);
    peak = Math.max(peak, process.memoryUsage().rss);
    if (res.status !== 201 || body.pointCount !== ROWS)
      throw new Error(`upload failed: ${res.status} ${JSON.stringify(body)}`);
    return { ms, peakMb: (peak - rss0) / 2 ** 20 };
  }

  async function baseline(file: Buffer): Promise<number> {
    const start = performance.now();
    const records = parse(file, { cast: true, from_line: 2 }) as unknown as number[][];
    const rows = records.map((r, i) => [
      holder.id,
      i + 1,
      i + 2,
      r[1],
      r[2],
      r[3],
      r[3]! / r[2]!,
      '[]',
      '',
    ]);
    await ctx.sequelize.transaction(async (t) => {
      const connection = (
        t as unknown as { connection: { batch(sql: string, v: unknown[][]): Promise<unknown> } }
      ).connection;
      await connection.batch(
        'INSERT INTO sweep_points (sweep_id, sequence, source_row, temperature_k, current_a, voltage_v, resistivity_ohm_cm, raw, flags) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)',
        rows,
      );
    });
    const ms = performance.now() - start;
    await ctx.sequelize.query(`DELETE FROM sweep_points WHERE sweep_id = ${holder.id}`);
    return ms;
  }

  const fullMs: number[] = [];
  const peaks: number[] = [];
  const baseMs: number[] = [];
  await full(makeFile(-1));
  await baseline(makeFile(-1));
  for (let k = 0; k < RUNS; k++) {
    const file = makeFile(k);
    baseMs.push(await baseline(file));
    const f = await full(file);
    fullMs.push(f.ms);
    peaks.push(f.peakMb);
  }
  server.close();
  await ctx.close();

  // Each full run follows its own baseline run, so the per-pair ratio shares the machine's load.
  const pairMedian = median(fullMs.map((ms, k) => ms / baseMs[k]!));
  const fullMedian = median(fullMs);
  const baseMedian = median(baseMs);
  const ratio = fullMedian / baseMedian;
  const peak = Math.max(...peaks);
  const figures = [
    {
      name: 'upload 100k rows over HTTP (median)',
      value: +fullMedian.toFixed(1),
      unit: 'ms',
      target: 'reference',
      pass: true,
    },
    {
      name: 'baseline csv-parse + batch insert (median)',
      value: +baseMedian.toFixed(1),
      unit: 'ms',
      target: 'reference',
      pass: true,
    },
    {
      name: 'upload / baseline',
      value: +ratio.toFixed(2),
      unit: 'x',
      target: `< ${RATIO_TARGET}`,
      pass: ratio < RATIO_TARGET,
    },
    {
      name: 'upload peak memory growth',
      value: +peak.toFixed(1),
      unit: 'MB',
      target: `< ${MEMORY_TARGET_MB}`,
      pass: peak < MEMORY_TARGET_MB,
    },
  ];
  console.log(`upload benchmark: ${ROWS} rows, ${RUNS} runs each`);
  console.log(`  full upload runs (ms): ${fullMs.map((x) => x.toFixed(0)).join(', ')}`);
  console.log(`  baseline runs (ms):    ${baseMs.map((x) => x.toFixed(0)).join(', ')}`);
  console.log(`  median of per-run ratios: ${pairMedian.toFixed(2)} x (noise check)`);
  for (const f of figures) {
    console.log(
      `  ${f.name.padEnd(44)} ${String(f.value).padStart(9)} ${f.unit.padEnd(3)} target ${f.target} ${f.pass ? 'PASS' : 'FAIL'}`,
    );
  }
  mkdirSync(OUT, { recursive: true });
  writeFileSync(`${OUT}upload.json`, `${JSON.stringify(figures, null, 2)}\n`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
