/**
 * Station tokens: a probe-station computer posts its sweeps itself with a bearer token of its
 * own (`POST /api/station/sweeps`), which can do nothing else.
 */

/** Every station token starts with this, so a leaked one is easy to recognise. */
export const STATION_TOKEN_PREFIX = 'rts_';

/** `POST /api/stations/:id/tokens` body. */
export interface CreateStationTokenRequest {
  /** Where the token is used, e.g. "cryostat PC, bench 2". */
  label: string;
}

/** A station token as listed: never its secret. */
export interface StationTokenDto {
  id: number;
  stationId: number;
  label: string;
  /** The first characters of the token (`rts_` and a few more), to tell tokens apart. */
  prefix: string;
  createdAt: string;
  createdBy: { id: number; name: string | null };
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** `POST /api/stations/:id/tokens` → 201: the token itself, shown this once only. */
export interface StationTokenCreatedResponse {
  id: number;
  label: string;
  prefix: string;
  token: string;
  createdAt: string;
}

/** How a sweep posted by a station is attributed (null or absent for an ordinary upload). */
export interface StationUploadDto {
  stationId: number;
  stationName: string;
  tokenId: number;
  tokenLabel: string;
}

/** `POST /api/station/sweeps` → 201 (and the same answer again for a repeated Idempotency-Key). */
export interface StationSweepCreatedResponse {
  id: number;
  pointCount: number;
  warnings: string[];
  waferId: number;
  /** The assignment the sweep fulfilled (now `done`). */
  assignmentId: number;
}
