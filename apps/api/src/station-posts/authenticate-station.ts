import type { RequestHandler } from 'express';
import { unauthenticated } from '../errors';
import { stationCallerOf, type StationCaller } from '../station-tokens/station-tokens.service';

declare module 'express-serve-static-core' {
  interface Request {
    station?: StationCaller;
  }
}

/** A station token as the header carries it (`rts_` and 43 base64url characters). */
const STATION_BEARER = /^Bearer (rts_[A-Za-z0-9_-]{20,100})$/;

/**
 * Requires a live station token (not revoked, its station not deleted, the person who made it
 * still active); a user's session token is no use here.
 */
export const authenticateStation: RequestHandler = async (req, _res, next) => {
  const match = STATION_BEARER.exec(req.headers.authorization ?? '');
  if (!match) {
    throw unauthenticated(
      'Send a station token: Authorization: Bearer rts_… (a sign-in token is no use here)',
    );
  }
  const caller = await stationCallerOf(match[1]!);
  if (!caller) throw unauthenticated('This station token is unknown or was revoked');
  req.station = caller;
  next();
};

/** The station a request was authenticated as; throws 401 when a route forgot the check. */
export function currentStation(req: { station?: StationCaller }): StationCaller {
  if (!req.station) throw unauthenticated('Send a station token');
  return req.station;
}
