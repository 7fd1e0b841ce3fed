/**
 * The cluster suite's clients: each uploads a file of its own, reads a stored sweep back through
 * the other API instance and lists lots, in a loop. A file whose upload got no answer (the
 * instance died) or a 503 is sent again, to the other instance, up to three times: uploads are
 * keyed by their hash, so a lost answer shows as a 409 naming the sweep that was stored.
 */
import { createHash } from 'node:crypto';
import { fourPointCsv } from '../src/testing/sweep-files';

export interface Attempt {
  status: number; // 0: no answer (connection refused or reset)
  sweepId: number | null;
  instance: string;
}

export interface UploadRecord {
  sha256: string;
  waferId: number;
  attempts: Attempt[];
}

export interface Tally {
  requests: number;
  byStatus: Record<string, number>;
  byKind: Record<string, Record<string, number>>;
  uploads: UploadRecord[];
  /** Every answer (or its absence) with its time from the start, to measure outages. */
  timeline: Array<{ atMs: number; instance: string; kind: string; ok: boolean }>;
  clientRetries: number;
}

export interface Target {
  name: string;
  url: string;
}

export const POINTS_PER_FILE = 40;

async function call(
  target: Target,
  path: string,
  init: RequestInit,
): Promise<{ status: number; body: unknown }> {
  try {
    const res = await fetch(`${target.url}${path}`, {
      ...init,
      signal: AbortSignal.timeout(20_000),
    });
    const text = await res.text();
    let body: unknown = null;
    try {
      body = JSON.parse(text);
    } catch {
      body = text;
    }
    return { status: res.status, body };
  } catch {
    return { status: 0, body: null };
  }
}

export async function signIn(target: Target, email: string, password: string): Promise<string> {
  const res = await call(target, '/api/auth/login', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  const token = (res.body as { token?: string } | null)?.token;
  if (res.status !== 200 || !token) throw new Error(`sign-in failed: ${res.status}`);
  return token;
}

export function emptyTally(): Tally {
  return {
    requests: 0,
    byStatus: {},
    byKind: {},
    uploads: [],
    timeline: [],
    clientRetries: 0,
  };
}

/** Runs one client until `untilMs`; `targets` are the API instances, tried in turn. */
export async function runClient(input: {
  index: number;
  targets: Target[];
  token: string;
  waferIds: number[];
  untilMs: number;
  startedMs: number;
  tally: Tally;
}): Promise<void> {
  const { index, targets, token, waferIds, untilMs, startedMs, tally } = input;
  const auth = { authorization: `Bearer ${token}` };
  const note = (kind: string, target: Target, status: number) => {
    tally.requests += 1;
    tally.byStatus[status] = (tally.byStatus[status] ?? 0) + 1;
    const k = (tally.byKind[kind] ??= {});
    k[status] = (k[status] ?? 0) + 1;
    tally.timeline.push({
      atMs: Date.now() - startedMs,
      instance: target.name,
      kind,
      ok: status > 0 && status < 500,
    });
  };
  for (let round = 0; Date.now() < untilMs; round += 1) {
    const first = (index + round) % targets.length;
    const file = fourPointCsv(POINTS_PER_FILE, `cluster client ${index} round ${round}`);
    const record: UploadRecord = {
      sha256: createHash('sha256').update(file).digest('hex'),
      waferId: waferIds[(index + round) % waferIds.length]!,
      attempts: [],
    };
    tally.uploads.push(record);
    for (let tryNo = 0; tryNo < 3; tryNo += 1) {
      const target = targets[(first + tryNo) % targets.length]!;
      const form = new FormData();
      form.set('method', 'four-point');
      form.set('spacingCm', '0.1');
      form.set('file', new Blob([file]), `client-${index}-${round}.csv`);
      const res = await call(target, `/api/wafers/${record.waferId}/sweeps`, {
        method: 'POST',
        body: form,
        headers: auth,
      });
      note('upload', target, res.status);
      const body = res.body as { id?: number; error?: { details?: { sweepId?: number } } } | null;
      const sweepId =
        res.status === 201 ? (body?.id ?? null) : (body?.error?.details?.sweepId ?? null);
      record.attempts.push({ status: res.status, sweepId, instance: target.name });
      if (res.status !== 0 && res.status !== 503) break;
      tally.clientRetries += 1;
      await new Promise((r) => setTimeout(r, 300));
    }
    const stored = tally.uploads.flatMap((u) =>
      u.attempts.filter((a) => a.status === 201).map((a) => a.sweepId!),
    );
    const readFrom = targets[(first + 1) % targets.length]!;
    if (stored.length) {
      const id = stored[Math.floor(Math.random() * stored.length)]!;
      const res = await call(readFrom, `/api/sweeps/${id}`, { headers: auth });
      note('read sweep', readFrom, res.status);
    }
    const lots = await call(readFrom, '/api/lots', { headers: auth });
    note('list lots', readFrom, lots.status);
  }
}

/** Reads and lists through `instance` that failed (no answer or 5xx) in a window, ms from start. */
export function failedReads(
  tally: Tally,
  instance: string,
  fromMs: number,
  spanMs: number,
): number {
  return tally.timeline.filter(
    (e) =>
      e.instance === instance &&
      e.kind !== 'upload' &&
      !e.ok &&
      e.atMs >= fromMs &&
      e.atMs < fromMs + spanMs,
  ).length;
}
