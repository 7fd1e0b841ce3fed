/**
 * Upload benchmark: a 100,000-row four-column four-point-probe file uploaded over HTTP, parsed,
 * converted and stored, against two references measured in the same run: the bare baseline
 * (csv-parse of the same file plus the driver's batch insert of the same rows in one
 * transaction) and MariaDB's own LOAD DATA LOCAL INFILE of the same point rows (the rows the
 * upload just stored, read back: raw cells, flags and leg as the import writes them) from a
 * tab-separated file prepared beforehand, in one transaction (timed: the statement and its
 * commit, the server's own floor). Prints medians, peak memory
 * growth and the ratios; writes bench/out/upload.json. Needs the MariaDB that `npm run bench`
 * starts (DB_*).
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mariadb from 'mariadb';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { parse } from 'csv-parse/sync';
import { makeWafer } from '../src/sweeps/sweep-test-helpers';
import { QueryTypes } from 'sequelize';
import { Sweep } from '../src/sweeps/sweep.model';
import { createTestContext } from '../src/testing/test-context';
import { WRITTEN_POINT_COLUMNS } from '../src/sweeps/import/store/point-writer';

const ROWS = 100_000;
/** Measured runs of each (BENCH_RUNS overrides; a noisy machine needs more). */
const RUNS = Number(process.env.BENCH_RUNS) || 5;
const RATIO_TARGET = 1.5;
/** Issue 20: the upload within twice the time of MariaDB's own LOAD DATA of the same rows. */
const LOAD_DATA_RATIO_TARGET = 2;
const MEMORY_TARGET_MB = 300;
/** Every column the import writes besides the sweep id and sequence: the writer's own list. */
const STORED_COLUMNS = WRITTEN_POINT_COLUMNS.filter((c) => c !== 'sequence');
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

  async function full(file: Buffer): Promise<{ ms: number; peakMb: number; sweepId: number }> {
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
    const body = (await res.json()) as { id?: number; pointCount?: number };
    const ms = performance.now() - start;
    clearInterval(timer);
    peak = Math.max(peak, process.memoryUsage().rss);
    if (res.status !== 201 || body.pointCount !== ROWS)
      throw new Error(`upload failed: ${res.status} ${JSON.stringify(body)}`);
    return { ms, peakMb: (peak - rss0) / 2 ** 20, sweepId: body.id! };
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

  // LOAD DATA needs a connection that allows a local file; the app's pool does not.
  const config = ctx.sequelize.config;
  const loader = await mariadb.createConnection({
    host: config.host,
    port: Number(config.port),
    user: config.username,
    password: config.password ?? undefined,
    database: config.database,
    permitLocalInfile: true,
  });
  const scratch = mkdtempSync(join(tmpdir(), 'rhotrace-load-data-'));

  /**
   * The very rows the upload of the same file stored (raw cells, flags and leg included), read
   * back from sweep `sweepId` and loaded by LOAD DATA under the reference sweep.
   */
  async function loadData(sweepId: number): Promise<number> {
    const stored = (await ctx.sequelize.query(
      `SELECT ${STORED_COLUMNS.join(', ')} FROM sweep_points WHERE sweep_id = ${sweepId} ORDER BY sequence`,
      { type: QueryTypes.SELECT, raw: true },
    )) as Array<Record<string, unknown>>;
    const tsv = join(scratch, 'points.tsv');
    // LOAD DATA's defaults: tab between fields, \N for NULL, a backslash escapes
    const field = (v: unknown) =>
      v === null ? '\\N' : (typeof v === 'string' ? v : JSON.stringify(v)).replace(/\\/g, '\\\\');
    const lines = stored.map((r, i) =>
      [holder.id, i + 1, ...STORED_COLUMNS.map((c) => field(r[c]))].join('\t'),
    );
    writeFileSync(tsv, `${lines.join('\n')}\n`);
    // Timed: the server's own work only (the rows are ready in a file, as LOAD DATA wants them).
    const start = performance.now();
    await loader.beginTransaction();
    const result = (await loader.query(
      `LOAD DATA LOCAL INFILE '${tsv}' INTO TABLE sweep_points ` +
        `(sweep_id, sequence, ${STORED_COLUMNS.join(', ')})`,
    )) as { affectedRows: number };
    await loader.commit();
    const ms = performance.now() - start;
    if (result.affectedRows !== ROWS)
      throw new Error(`LOAD DATA stored ${result.affectedRows} rows`);
    await ctx.sequelize.query(`DELETE FROM sweep_points WHERE sweep_id = ${holder.id}`);
    return ms;
  }

  const fullMs: number[] = [];
  const loadMs: number[] = [];
  const peaks: number[] = [];
  const baseMs: number[] = [];
  await loadData((await full(makeFile(-1))).sweepId);
  await baseline(makeFile(-1));
  for (let k = 0; k < RUNS; k++) {
    const file = makeFile(k);
    baseMs.push(await baseline(file));
    const f = await full(file);
    fullMs.push(f.ms);
    peaks.push(f.peakMb);
    loadMs.push(await loadData(f.sweepId));
  }
  server.close();
  await loader.end();
  rmSync(scratch, { recursive: true, force: true });
  await ctx.close();

  // Each full run follows its own baseline run, so the per-pair ratio shares the machine's load.
  const pairMedian = median(fullMs.map((ms, k) => ms / baseMs[k]!));
  const fullMedian = median(fullMs);
  const baseMedian = median(baseMs);
  const ratio = fullMedian / baseMedian;
  const peak = Math.max(...peaks);
  const loadMedian = median(loadMs);
  const loadRatio = median(fullMs.map((ms, k) => ms / loadMs[k]!));
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
      name: "upload / MariaDB's LOAD DATA of the same rows (median of per-run ratios)",
      value: +loadRatio.toFixed(2),
      unit: 'x',
      target: `<= ${LOAD_DATA_RATIO_TARGET}`,
      reference: `LOAD DATA LOCAL INFILE ${loadMedian.toFixed(0)} ms (median)`,
      pass: loadRatio <= LOAD_DATA_RATIO_TARGET,
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
  console.log(`  LOAD DATA runs (ms):   ${loadMs.map((x) => x.toFixed(0)).join(', ')}`);
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
