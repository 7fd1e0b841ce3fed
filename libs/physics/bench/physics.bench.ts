/**
 * Benchmarks of the physics library: prints median times against their targets and writes
 * them as JSON to bench/out/physics.json at the repository root.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import {
  fitArrhenius,
  fitModel,
  modelCurve,
  seededNormal,
  seededRandom,
  BOLTZMANN_EV_PER_K,
} from '../src/index';

interface BenchResult {
  name: string;
  value: number;
  unit: string;
  target: number;
  pass: boolean;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

function time(runs: number, warmup: number, f: () => unknown): number {
  for (let i = 0; i < warmup; i++) f();
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    f();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

const doping = { donorDensity: 5e15, acceptorDensity: 1e15 };
const temps1000 = Array.from({ length: 1000 }, (_, i) => 10 + i * 1.49);

const normal = seededNormal(seededRandom(2024));
const arrheniusPoints = Array.from({ length: 10_000 }, (_, i) => {
  const t = 300 + i * 0.03;
  return { temperatureK: t, value: Math.exp(0.55 / (BOLTZMANN_EV_PER_K * t) + 0.01 * normal()) };
});

const sweepTemps = Array.from({ length: 200 }, (_, i) => 20 + i * 3);
const sweep = modelCurve('Si', { ...doping, donorLevel: 0.045 }, sweepTemps).map((p) => ({
  temperatureK: p.temperatureK,
  resistivityOhmCm: p.resistivityOhmCm * (1 + 0.005 * normal()),
}));
const start = { donorDensity: 1.5e16, acceptorDensity: 3e14, donorLevel: 0.035 };

const results: BenchResult[] = [];
function record(name: string, value: number, target: number): void {
  results.push({ name, value: Number(value.toFixed(4)), unit: 'ms', target, pass: value < target });
}

record(
  'modelCurve, 1,000 temperatures (median)',
  time(50, 20, () => modelCurve('Si', doping, temps1000)),
  5,
);
record(
  'fitArrhenius, 10,000 points (median)',
  time(50, 20, () => fitArrhenius(arrheniusPoints)),
  2,
);
record(
  'fitModel, 200-point sweep, 3 free parameters (median)',
  time(9, 2, () => fitModel(sweep, 'Si', start, ['donorDensity', 'acceptorDensity', 'donorLevel'])),
  250,
);

for (const r of results) {
  console.log(
    `${r.pass ? 'PASS' : 'FAIL'}  ${r.name}: ${r.value.toFixed(3)} ${r.unit} (target < ${r.target} ${r.unit})`,
  );
}

const outDir = new URL('../../../bench/out/', import.meta.url);
mkdirSync(fileURLToPath(outDir), { recursive: true });
writeFileSync(
  fileURLToPath(new URL('physics.json', outDir)),
  `${JSON.stringify(results, null, 2)}\n`,
);
console.log(`wrote ${fileURLToPath(new URL('physics.json', outDir))}`);
