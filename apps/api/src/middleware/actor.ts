import type { Request } from 'express';
import type { Actor } from '../audit/audit.service';
import { currentUser } from './authenticate';

/** The request id pino-http gave this request (also sent back as `X-Request-Id`). */
export function requestIdOf(req: Request): string | null {
  const id = (req as { id?: unknown }).id;
  return id === undefined || id === null ? null : String(id);
}

/** Who makes this change and in which request: what every audit event records. */
export function actorOf(req: Request): Actor {
  return { id: currentUser(req).id, requestId: requestIdOf(req) };
}
