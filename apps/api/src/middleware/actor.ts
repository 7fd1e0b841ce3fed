import type { SessionUser } from '@rhotrace/api-types';
import type { Request } from 'express';
import type { Actor } from '../audit/audit.service';
import { currentUser } from './authenticate';

/** The signed-in user making a change, with the request it comes in: what services are given. */
export type SessionActor = SessionUser & Actor & { requestId: string | null };

/** The request id pino-http gave this request (also sent back as `X-Request-Id`). */
export function requestIdOf(req: Request): string | null {
  const id = (req as { id?: unknown }).id;
  return id === undefined || id === null || id === '' ? null : String(id);
}

/**
 * Who makes this change and in which request: the signed-in user and the request id, which
 * every audit event records. The one way a controller names the actor.
 */
export function actorOf(req: Request): SessionActor {
  return { ...currentUser(req), requestId: requestIdOf(req) };
}
