/**
 * A probe station posts a sweep with its token. The sweep goes through the ordinary import
 * (`importSweep`), and the same transaction records the post under its Idempotency-Key, closes
 * the assignment that names the station, marks the wafer measured and queues an e-mail to the
 * manager who assigned it: all of it commits, or none.
 *
 * One post per (station, key) is enforced by the database's unique key, so it holds across API
 * processes and on every node of a Galera cluster: a second post with the key waits for the
 * first's transaction and then fails on the key (or, on another node, loses certification and
 * is retried into that failure); it then answers the first post's answer.
 */
import { createHash } from 'node:crypto';
import type {
  SweepColumnOverride,
  SweepGeometryInput,
  SweepMethod,
  StationSweepCreatedResponse,
} from '@rhotrace/api-types';
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { database } from '../db/connection';
import { HttpError, forbidden, unprocessable, validationFailed } from '../errors';
import type { Mailer } from '../mail/mailer.service';
import type { StationCaller } from '../station-tokens/station-tokens.service';
import { openTable } from '../sweeps/import/read-table';
import { importSweep } from '../sweeps/sweep.service';
import { closeAssignment, openAssignmentFor } from './station-assignment';

/** What a station posts. */
export interface StationPostInput {
  waferId: number;
  file: Buffer;
  originalName: string;
  method?: SweepMethod;
  columns?: SweepColumnOverride[];
  geometry: SweepGeometryInput;
}

/** A post's answer: the first one, or the same again for a repeated key. */
export interface StationPostAnswer {
  status: number;
  body: StationSweepCreatedResponse;
  replayed: boolean;
}

/** What the post needs besides its input. */
export interface StationPostContext {
  requestId: string | null;
  mail: { mailer: Mailer; publicUrl: string };
  onRetry?: (error: unknown) => void;
}

interface KeyRow {
  requestSha256: string;
  status: number;
  response: string;
}

/** SHA-256 of the file and the fields: a repeated key must come with the same request. */
function requestDigest(input: StationPostInput): string {
  const fields = JSON.stringify([input.waferId, input.method ?? null, input.columns ?? null]);
  const geometry = JSON.stringify(Object.entries(input.geometry).sort());
  return createHash('sha256')
    .update(fields)
    .update(geometry)
    .update(createHash('sha256').update(input.file).digest())
    .digest('hex');
}

async function storedAnswer(stationId: number, key: string): Promise<KeyRow | undefined> {
  const rows = await database().query<KeyRow>(
    'SELECT request_sha256 AS requestSha256, status, response FROM station_idempotency_keys ' +
      'WHERE station_id = ? AND idempotency_key = ?',
    { replacements: [stationId, key], type: QueryTypes.SELECT },
  );
  return rows[0];
}

/** The first post's answer again, or 422 when the key came with another request. */
function replay(row: KeyRow, digest: string): StationPostAnswer {
  if (row.requestSha256 !== digest) {
    throw unprocessable(
      'This Idempotency-Key was already used for another file or other fields; ' +
        'send a new key with a new sweep',
      [{ field: 'header.Idempotency-Key', problem: 'was used for a different request' }],
    );
  }
  const body = JSON.parse(row.response) as StationSweepCreatedResponse;
  return { status: row.status, body, replayed: true };
}

function isKeyClash(error: unknown): boolean {
  const e = error as { errno?: number; original?: { errno?: number } } | null;
  return error instanceof UniqueConstraintError || e?.errno === 1062 || e?.original?.errno === 1062;
}

/** The method the post names, else the one its file names; 400 when neither does. */
function methodOf(input: StationPostInput): SweepMethod {
  const method = input.method ?? openTable(input.file, 1).parsed.suggestedMethod;
  if (!method) {
    throw validationFailed('Name the measurement method: the file does not say', [
      { field: 'body.method', problem: 'is required for this file' },
    ]);
  }
  return method;
}

/**
 * Stores a station's sweep once per Idempotency-Key: 201 the first time, the same answer for
 * the same key and request, 422 for the same key with another request, 403 when no open
 * assignment of the wafer names the station.
 */
export async function postStationSweep(
  caller: StationCaller,
  input: StationPostInput,
  key: string,
  context: StationPostContext,
): Promise<StationPostAnswer> {
  const digest = requestDigest(input);
  const earlier = await storedAnswer(caller.stationId, key);
  if (earlier) return replay(earlier, digest);
  const assignment = await openAssignmentFor(caller, input.waferId);
  if (!assignment) throw notAssigned(caller, input.waferId);
  const method = methodOf(input);
  const actor = { ...caller.issuer, requestId: context.requestId };
  let answer: StationSweepCreatedResponse | undefined;
  try {
    await importSweep(
      {
        waferId: input.waferId,
        file: input.file,
        originalName: input.originalName,
        method,
        stationId: caller.stationId,
        columns: input.columns,
        geometry: input.geometry,
      },
      actor,
      {
        onRetry: context.onRetry,
        hooks: {
          begin: (t) => claimKey(caller, key, digest, t),
          commit: async (result, t) => {
            const post = { waferId: input.waferId, sweepId: result.id };
            const closed = await closeAssignment(caller, post, actor, context.mail, t);
            if (!closed) throw notAssigned(caller, input.waferId);
            answer = { ...result, waferId: input.waferId, assignmentId: closed };
            await recordAnswer(caller.stationId, key, answer, closed, t);
          },
        },
      },
    );
  } catch (error) {
    if (!isKeyClash(error)) throw error;
    const first = await storedAnswer(caller.stationId, key);
    if (first) return replay(first, digest);
    throw new HttpError(
      'conflict',
      'A post with this Idempotency-Key is still being stored; send it again shortly',
      undefined,
      { 'Retry-After': '2' },
    );
  }
  return { status: 201, body: answer!, replayed: false };
}

function notAssigned(caller: StationCaller, waferId: number): HttpError {
  return forbidden(
    `Wafer ${waferId} has no open assignment naming station "${caller.stationName}": ` +
      'assign the wafer with this station first',
  );
}

/** Inserts the key first thing, so a second post with it waits here for this transaction. */
async function claimKey(
  caller: StationCaller,
  key: string,
  digest: string,
  transaction: Transaction,
): Promise<void> {
  await database().query(
    'INSERT INTO station_idempotency_keys (station_id, idempotency_key, request_sha256, ' +
      "token_id, status, response, created_at) VALUES (?, ?, ?, ?, 0, '', ?)",
    {
      replacements: [caller.stationId, key, digest, caller.tokenId, new Date()],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
}

async function recordAnswer(
  stationId: number,
  key: string,
  answer: StationSweepCreatedResponse,
  assignmentId: number,
  transaction: Transaction,
): Promise<void> {
  await database().query(
    'UPDATE station_idempotency_keys SET status = 201, response = ?, sweep_id = ?, ' +
      'assignment_id = ? WHERE station_id = ? AND idempotency_key = ?',
    {
      replacements: [JSON.stringify(answer), answer.id, assignmentId, stationId, key],
      type: QueryTypes.UPDATE,
      transaction,
    },
  );
}
