import type { RequestHandler } from 'express';

/** `Cache-Control: no-store` for answers that carry a session token (ASVS V8.2.1). */
export const noStore: RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};
