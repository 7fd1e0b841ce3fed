import type { AssignmentStationUpload } from '@rhotrace/api-types';
import { QueryTypes, type Transaction } from 'sequelize';
import { database } from '../db/connection';

interface UploadRow {
  assignmentId: number;
  sweepId: number;
  stationName: string;
  tokenLabel: string;
  postedAt: Date;
}

/** The station posts that fulfilled these assignments, keyed by assignment id. */
export async function stationUploadsByAssignment(
  assignmentIds: readonly number[],
  transaction?: Transaction,
): Promise<Map<number, AssignmentStationUpload>> {
  if (!assignmentIds.length) return new Map();
  const rows = await database().query<UploadRow>(
    'SELECT k.assignment_id AS assignmentId, k.sweep_id AS sweepId, s.name AS stationName, ' +
      't.label AS tokenLabel, k.created_at AS postedAt FROM station_idempotency_keys k ' +
      'JOIN station_tokens t ON t.id = k.token_id JOIN stations s ON s.id = k.station_id ' +
      'WHERE k.assignment_id IN (?) AND k.sweep_id IS NOT NULL ORDER BY k.id',
    { replacements: [[...assignmentIds]], type: QueryTypes.SELECT, transaction },
  );
  return new Map(
    rows.map((r) => [
      r.assignmentId,
      {
        sweepId: r.sweepId,
        stationName: r.stationName,
        tokenLabel: r.tokenLabel,
        postedAt: new Date(r.postedAt).toISOString(),
      },
    ]),
  );
}
