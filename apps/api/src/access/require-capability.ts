import type { Capability } from '@rhotrace/api-types';
import type { RequestHandler } from 'express';
import { unauthenticated } from '../errors';
import { assertCan } from './policy';

/**
 * Route guard: lets through only users whose role has `capability` in the role-to-capability
 * table (403 otherwise). Use after `authenticate`.
 */
export function requireCapability(capability: Capability): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw unauthenticated();
    assertCan(req.user, capability);
    next();
  };
}
