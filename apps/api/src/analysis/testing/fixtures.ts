import { createHash } from 'node:crypto';
import { Lot } from '../../lots/lot.model';
import { Assignment } from '../../assignments/assignment.model';
import { Sweep, SweepPoint } from '../../sweeps/sweep.model';
import { Wafer } from '../../wafers/wafer.model';

/** Deterministic uniform generator in [0, 1) (mulberry32), so test data is the same every run. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates from a seeded generator (Box–Muller). */
export function seededNormal(seed: number): () => number {
  const u = seededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

/** One synthetic reading. */
export interface SyntheticPoint {
  temperatureK: number;
  resistivityOhmCm: number;
}

/**
 * Readings at `temperaturesK` (each `repeats` times) from `model`, with relative Gaussian noise
 * of `noise` (0.005 = 0.5 %) from a seeded generator.
 */
export function synthesize(
  temperaturesK: readonly number[],
  model: (temperatureK: number) => number,
  options: { noise?: number; seed?: number; repeats?: number } = {},
): SyntheticPoint[] {
  const normal = seededNormal(options.seed ?? 1);
  const noise = options.noise ?? 0;
  const out: SyntheticPoint[] = [];
  for (const t of temperaturesK) {
    for (let r = 0; r < (options.repeats ?? 1); r += 1) {
      out.push({ temperatureK: t, resistivityOhmCm: model(t) * (1 + noise * normal()) });
    }
  }
  return out;
}

/** Evenly spaced temperatures from a to b inclusive. */
export function range(a: number, b: number, count: number): number[] {
  return Array.from({ length: count }, (_, i) => a + ((b - a) * i) / (count - 1));
}

let lotSerial = 0;

/** A lot with one or more wafers. */
export async function makeLot(
  fields: Partial<{
    material: string;
    dopant: string | null;
    dopantType: 'n' | 'p' | null;
    specMinOhmCm: number | null;
    specMaxOhmCm: number | null;
    thicknessCm: number | null;
    diameterCm: number | null;
  }> = {},
  waferNumbers: string[] = ['W01'],
): Promise<{ lot: Lot; wafers: Wafer[] }> {
  lotSerial += 1;
  const lot = await Lot.create({
    code: `LOT-T${lotSerial}`,
    material: fields.material ?? 'Si',
    dopant: fields.dopant === undefined ? 'P' : fields.dopant,
    dopantType: fields.dopantType === undefined ? 'n' : fields.dopantType,
    orientation: '100',
    diameterCm: fields.diameterCm === undefined ? 10 : fields.diameterCm,
    thicknessCm: fields.thicknessCm === undefined ? 0.05 : fields.thicknessCm,
    supplier: 'Example Substrates',
    receivedOn: '2024-05-01',
    specMinOhmCm: fields.specMinOhmCm === undefined ? null : fields.specMinOhmCm,
    specMaxOhmCm: fields.specMaxOhmCm === undefined ? null : fields.specMaxOhmCm,
    notes: null,
    createdById: null,
  });
  const wafers: Wafer[] = [];
  for (const number of waferNumbers) {
    wafers.push(await Wafer.create({ lotId: lot.id, number, thicknessCm: null, notes: null }));
  }
  return { lot, wafers };
}

/** A stored sweep of `points` on a wafer, created directly through the models. */
export async function makeSweep(
  waferId: number,
  uploadedById: number,
  points: readonly SyntheticPoint[],
  name = 'synthetic.csv',
): Promise<Sweep> {
  const temps = points.map((p) => p.temperatureK);
  const sha = createHash('sha256').update(`${waferId}-${name}-${Math.random()}`).digest('hex');
  const sweep = await Sweep.create({
    waferId,
    stationId: null,
    method: 'four-point',
    geometry: { spacingCm: 0.1, thicknessCm: 0.05, diameterCm: 10, sources: {} },
    uploadedById,
    originalName: name,
    sizeBytes: 1000,
    sha256: sha,
    storageKind: 'db',
    storageKey: sha.slice(0, 32),
    columnMapping: {},
    metadata: null,
    parseReport: { rows: points.length },
    pointCount: points.length,
    minTemperatureK: temps.length ? Math.min(...temps) : null,
    maxTemperatureK: temps.length ? Math.max(...temps) : null,
  });
  const rows = points.map((p, i) => ({
    sweepId: sweep.id,
    sequence: i + 1,
    sourceRow: i + 2,
    temperatureK: p.temperatureK,
    currentA: null,
    voltageV: null,
    resistanceOhm: null,
    sheetResistanceOhmSq: null,
    resistivityOhmCm: p.resistivityOhmCm,
    raw: {},
    flags: '',
  }));
  for (let i = 0; i < rows.length; i += 2000) {
    await SweepPoint.bulkCreate(rows.slice(i, i + 2000));
  }
  return sweep;
}

/** Assigns a wafer to a user (so a technician may see it). */
export async function assign(
  waferId: number,
  assigneeId: number,
  assignedById: number,
): Promise<void> {
  await Assignment.create({
    waferId,
    assigneeId,
    assignedById,
    task: 'Measure rho(T)',
    dueDate: '2030-01-01',
    state: 'assigned',
    notes: null,
  } as never);
}
