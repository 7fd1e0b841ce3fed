import type { RequestHandler } from 'express';
import { STATION_TOKEN_PREFIX, type Role, type SessionUser } from '@rhotrace/api-types';
import { QueryTypes } from 'sequelize';
import { verifyToken } from '../auth/token.service';
import { forbidden, unauthenticated } from '../errors';
import { database } from '../db/connection';

declare module 'express-serve-static-core' {
  interface Request {
    user?: SessionUser;
  }
}

interface SessionRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: number | boolean;
  tokenVersion: number;
}

/**
 * The fields a session needs, in one plain query: this runs on every request, and a model
 * lookup costs several times the CPU of the query itself.
 */
async function sessionRow(userId: number): Promise<SessionRow | undefined> {
  const rows = await database().query<SessionRow>(
    'SELECT id, email, name, role, active, token_version AS tokenVersion FROM users WHERE id = ?',
    { replacements: [userId], type: QueryTypes.SELECT },
  );
  return rows[0];
}

/** What every route but the station post answers a station token. */
export const STATION_TOKEN_ONLY =
  'A station token may only post sweeps (POST /api/station/sweeps); sign in as a person for this';

/**
 * Requires a valid bearer token of an active account whose token version still matches
 * (deactivation and password changes raise the version, so older tokens stop working).
 */
export function authenticate(secret: string): RequestHandler {
  return async (req, _res, next) => {
    const header = req.headers.authorization ?? '';
    const match = /^Bearer ([A-Za-z0-9._-]+)$/.exec(header);
    if (!match) throw unauthenticated();
    // a station token is for station posts only, whatever it is presented to
    if (match[1]!.startsWith(STATION_TOKEN_PREFIX)) throw forbidden(STATION_TOKEN_ONLY);
    // verifyToken checks signature, algorithm, issuer and a required expiry in one place
    const claims = verifyToken(match[1]!, secret);
    if (!claims) throw unauthenticated('Your session is not valid or has expired; sign in again');
    const user = await sessionRow(claims.userId);
    if (!user || !user.active || user.tokenVersion !== claims.version) {
      throw unauthenticated('Your session is no longer valid; sign in again');
    }
    req.user = { id: user.id, email: user.email, name: user.name, role: user.role };
    next();
  };
}

/** The signed-in user; throws 401 when a route forgot `authenticate`. */
export function currentUser(req: { user?: SessionUser }): SessionUser {
  if (!req.user) throw unauthenticated();
  return req.user;
}
