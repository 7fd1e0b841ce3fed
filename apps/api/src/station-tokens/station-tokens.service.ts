import { createHash, randomBytes } from 'node:crypto';
import {
  STATION_TOKEN_PREFIX,
  type Role,
  type StationUploadDto,
  type StationTokenCreatedResponse,
  type StationTokenDto,
} from '@rhotrace/api-types';
import { QueryTypes } from 'sequelize';
import { auditChange, type Actor } from '../audit/audit.service';
import { database, inTransaction } from '../db/connection';
import { notFound } from '../errors';
import { Station } from '../stations/station.model';
import { User } from '../users/user.model';
import { StationToken } from './station-token.model';

/** Random bytes in a token: 256 bits, so guessing one is hopeless and a fast hash suffices. */
const TOKEN_BYTES = 32;
/** Characters of a token kept in clear (`rts_` and 8 more) so people can tell tokens apart. */
const PREFIX_LENGTH = STATION_TOKEN_PREFIX.length + 8;

/** The stored form of a token: its SHA-256, hex. */
export function tokenDigest(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** The audit snapshot of a token: never the secret, nor its digest. */
const snapshot = (t: StationToken) => ({
  stationId: t.stationId,
  label: t.label,
  prefix: t.prefix,
  revokedAt: t.revokedAt?.toISOString() ?? null,
});

async function liveStation(id: number): Promise<Station> {
  const station = await Station.findByPk(id);
  if (!station) throw notFound(`Station ${id}`);
  return station;
}

/** Makes a token for a station; the answer holds the token, which is never shown again. */
export async function createStationToken(
  stationId: number,
  label: string,
  actor: Actor,
): Promise<StationTokenCreatedResponse> {
  await liveStation(stationId);
  const token = `${STATION_TOKEN_PREFIX}${randomBytes(TOKEN_BYTES).toString('base64url')}`;
  return inTransaction(async (transaction) => {
    const row = await StationToken.create(
      {
        stationId,
        label,
        prefix: token.slice(0, PREFIX_LENGTH),
        tokenSha256: tokenDigest(token),
        createdById: actor.id,
      },
      { transaction },
    );
    await auditChange(transaction, actor, 'create', 'station-token', row.id, {
      after: snapshot(row),
    });
    return {
      id: row.id,
      label: row.label,
      prefix: row.prefix,
      token,
      createdAt: row.createdAt.toISOString(),
    };
  });
}

/** A station's tokens, newest first, revoked ones included; never a secret. */
export async function listStationTokens(stationId: number): Promise<StationTokenDto[]> {
  await liveStation(stationId);
  const rows = await StationToken.findAll({
    where: { stationId },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  const ids = [...new Set(rows.map((r) => r.createdById))];
  const users = ids.length
    ? await User.findAll({ attributes: ['id', 'name'], where: { id: ids } })
    : [];
  const names = new Map(users.map((u) => [u.id, u.name]));
  return rows.map((r) => ({
    id: r.id,
    stationId: r.stationId,
    label: r.label,
    prefix: r.prefix,
    createdAt: r.createdAt.toISOString(),
    createdBy: { id: r.createdById, name: names.get(r.createdById) ?? null },
    lastUsedAt: r.lastUsedAt?.toISOString() ?? null,
    revokedAt: r.revokedAt?.toISOString() ?? null,
  }));
}

/** Revokes a token at once (its next request is a 401); revoking twice changes nothing. */
export async function revokeStationToken(
  stationId: number,
  tokenId: number,
  actor: Actor,
): Promise<void> {
  await inTransaction(async (transaction) => {
    const row = await StationToken.findOne({
      where: { id: tokenId, stationId },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!row) throw notFound(`Token ${tokenId} of station ${stationId}`);
    if (row.revokedAt) return;
    const before = snapshot(row);
    await row.update({ revokedAt: new Date(), revokedById: actor.id }, { transaction });
    await auditChange(transaction, actor, 'revoke', 'station-token', row.id, {
      before,
      after: snapshot(row),
    });
  });
}

/** What a valid station token stands for. */
export interface StationCaller {
  tokenId: number;
  tokenLabel: string;
  stationId: number;
  stationName: string;
  /** The person who made the token: the accountable uploader of what the station posts. */
  issuer: { id: number; email: string; name: string; role: Role };
}

interface TokenRow {
  tokenId: number;
  tokenLabel: string;
  stationId: number;
  stationName: string;
  issuerId: number;
  issuerEmail: string;
  issuerName: string;
  issuerRole: Role;
}

/**
 * The caller a token stands for, or null when it is unknown, revoked, its station deleted or
 * the person who made it no longer active. Marks the token as used.
 */
export async function stationCallerOf(token: string): Promise<StationCaller | null> {
  const rows = await database().query<TokenRow>(
    'SELECT t.id AS tokenId, t.label AS tokenLabel, s.id AS stationId, s.name AS stationName, ' +
      'u.id AS issuerId, u.email AS issuerEmail, u.name AS issuerName, u.role AS issuerRole ' +
      'FROM station_tokens t JOIN stations s ON s.id = t.station_id ' +
      'JOIN users u ON u.id = t.created_by_id ' +
      'WHERE t.token_sha256 = ? AND t.revoked_at IS NULL AND s.deleted_at IS NULL AND u.active = 1',
    { replacements: [tokenDigest(token)], type: QueryTypes.SELECT },
  );
  const row = rows[0];
  if (!row) return null;
  await database().query('UPDATE station_tokens SET last_used_at = ? WHERE id = ?', {
    replacements: [new Date(), row.tokenId],
    type: QueryTypes.UPDATE,
  });
  return {
    tokenId: row.tokenId,
    tokenLabel: row.tokenLabel,
    stationId: row.stationId,
    stationName: row.stationName,
    issuer: {
      id: row.issuerId,
      email: row.issuerEmail,
      name: row.issuerName,
      role: row.issuerRole,
    },
  };
}

/** How sweeps posted with these tokens are attributed, keyed by token id (nulls skipped). */
export async function stationUploadsOf(
  tokenIds: ReadonlyArray<number | null>,
): Promise<Map<number, StationUploadDto>> {
  const ids = [...new Set(tokenIds.filter((id): id is number => id !== null))];
  if (!ids.length) return new Map();
  const rows = await database().query<StationUploadDto>(
    'SELECT t.id AS tokenId, t.label AS tokenLabel, s.id AS stationId, s.name AS stationName ' +
      'FROM station_tokens t JOIN stations s ON s.id = t.station_id WHERE t.id IN (?)',
    { replacements: [ids], type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.tokenId, r]));
}
