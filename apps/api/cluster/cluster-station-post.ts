/**
 * The cluster suite's station post: one station token and one assigned wafer, and the same
 * sweep posted with one Idempotency-Key to both API instances at once (each on its own node).
 */
import { randomBytes, randomUUID } from 'node:crypto';
import { Assignment } from '../src/assignments/assignment.model';
import { StationToken } from '../src/station-tokens/station-token.model';
import { tokenDigest } from '../src/station-tokens/station-tokens.service';
import { makeStation, makeWafer } from '../src/sweeps/sweep-test-helpers';
import { fourPointCsv } from '../src/testing/sweep-files';

export interface StationSetup {
  token: string;
  waferId: number;
}

/** Writes the station, its token (stored as its hash) and an assignment naming the station. */
export async function seedStationPost(userId: number): Promise<StationSetup> {
  const station = await makeStation({ probeSpacingCm: 0.1, name: 'Cluster bench' });
  const wafer = await makeWafer({ thicknessCm: 0.05 });
  await Assignment.create({
    waferId: wafer.id,
    assigneeId: userId,
    assignedById: userId,
    task: 'Measure rho(T) (cluster suite)',
    dueDate: '2031-01-31',
    notes: null,
    stationId: station.id,
  });
  const token = `rts_${randomBytes(32).toString('base64url')}`;
  await StationToken.create({
    stationId: station.id,
    label: 'cluster suite',
    prefix: token.slice(0, 12),
    tokenSha256: tokenDigest(token),
    createdById: userId,
  });
  return { token, waferId: wafer.id };
}

/** Posts one file with one key to every URL at the same moment; the answers in URL order. */
export async function postEverywhere(
  setup: StationSetup,
  urls: string[],
): Promise<Array<{ status: number; id: number | null }>> {
  const file = fourPointCsv(60, 'cluster station post');
  const key = randomUUID();
  return Promise.all(
    urls.map(async (url) => {
      const form = new FormData();
      form.set('waferId', String(setup.waferId));
      form.set('method', 'four-point');
      form.set('file', new Blob([file]), 'bench.csv');
      const res = await fetch(`${url}/api/station/sweeps`, {
        method: 'POST',
        headers: { authorization: `Bearer ${setup.token}`, 'idempotency-key': key },
        body: form,
        signal: AbortSignal.timeout(30_000),
      });
      const body = (await res.json()) as { id?: number };
      return { status: res.status, id: body.id ?? null };
    }),
  );
}
