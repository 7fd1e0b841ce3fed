import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { SessionUser } from '@rhotrace/api-types';

const keys = new Map<string, KeyObject>();
/**
 * The secret as a KeyObject, made once: given a plain string, jsonwebtoken first tries to read
 * it as a key in PEM form on every call (to sign as well as to verify), which costs about a
 * millisecond each time.
 */
function keyOf(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(secret, 'utf8'));
    keys.set(secret, key);
  }
  return key;
}

/** Only this algorithm is accepted; `none` and asymmetric confusion are refused. */
export const TOKEN_ALGORITHM = 'HS256' as const;

interface TokenClaims {
  sub: string;
  ver: number;
}

/** Signs a session token for the user; `ttlS` seconds of validity. */
export function signToken(
  user: SessionUser & { tokenVersion: number },
  secret: string,
  ttlS: number,
): { token: string; expiresAt: string } {
  const claims = { ver: user.tokenVersion } satisfies Omit<TokenClaims, 'sub'>;
  const token = jwt.sign(claims, keyOf(secret), {
    algorithm: TOKEN_ALGORITHM,
    subject: String(user.id),
    expiresIn: ttlS,
    issuer: 'rhotrace',
  });
  return { token, expiresAt: new Date(Date.now() + ttlS * 1000).toISOString() };
}

/** Verifies signature, algorithm, issuer and expiry; returns the user id and token version. */
export function verifyToken(
  token: string,
  secret: string,
): { userId: number; version: number } | null {
  try {
    const claims = jwt.verify(token, keyOf(secret), {
      algorithms: [TOKEN_ALGORITHM],
      issuer: 'rhotrace',
    }) as jwt.JwtPayload;
    const userId = Number(claims.sub);
    // jwt.verify checks expiry only when the claim is there: a token without one is refused here.
    if (typeof claims.exp !== 'number') return null;
    if (!Number.isInteger(userId) || userId <= 0 || typeof claims.ver !== 'number') return null;
    return { userId, version: claims.ver };
  } catch {
    return null;
  }
}
