import { createHash, randomBytes } from 'node:crypto';
import { comparePassword } from './password-hasher';
import type { LoginResponse, SessionUser } from '@rhotrace/api-types';
import { Op } from 'sequelize';
import { auditChange, recordAudit } from '../audit/audit.service';
import type { AppConfig } from '../config';
import { badRequest, unauthenticated } from '../errors';
import type { Mailer } from '../mail/mailer.service';
import { passwordResetMail } from '../mail/templates/password-reset.mail';
import { PasswordReset, User } from '../users/user.model';
import { hashPassword, normaliseEmail } from '../users/users.service';
import {
  ACCOUNT_POLICY,
  ADDRESS_POLICY,
  clearFailures,
  recordFailure,
  takeSignInTurn,
  throttleKeys,
} from './sign-in-throttle.service';
import { signToken } from './token.service';
import { inTransaction } from '../db/connection';

/** The one message for every failed sign-in, so it never tells which part was wrong. */
export const SIGN_IN_FAILED = 'The e-mail address or password is not correct';
/**
 * Told only after a correct password, so it reveals nothing a guesser does not already hold:
 * the person learns why they cannot sign in instead of doubting their password.
 */
export const ACCOUNT_DEACTIVATED =
  'This account is deactivated. Ask your lab\u2019s administrator to reactivate it.';

/** How long a password reset link works. */
export const RESET_VALID_MINUTES = 60;

let dummyHash: Promise<string> | undefined;
/** A hash to compare against when the account does not exist, so timing does not tell. */
const dummy = () => (dummyHash ??= hashPassword(randomBytes(16).toString('hex')));

function session(user: User): SessionUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/**
 * Signs in with e-mail and password. Every attempt counts against the account before the
 * password is checked (and is taken back by a match); failures also count against the address.
 * A throttled account or address answers 429 before the password is even checked.
 */
export async function login(
  input: { email: string; password: string },
  address: string,
  config: Pick<AppConfig, 'jwtSecret' | 'tokenTtlS'>,
): Promise<LoginResponse> {
  const email = normaliseEmail(input.email);
  const keys = throttleKeys(email, address);
  await takeSignInTurn(keys, ACCOUNT_POLICY);
  const user = await User.findOne({ where: { email } });
  // bcrypt runs with no database connection or lock held, so a burst of sign-ins cannot
  // starve the pool that every other request needs
  const matches = await comparePassword(input.password, user?.passwordHash ?? (await dummy()));
  if (!user || !matches) {
    await recordFailure(keys.address, ADDRESS_POLICY);
    throw unauthenticated(SIGN_IN_FAILED);
  }
  await clearFailures(keys.account);
  if (!user.active) throw unauthenticated(ACCOUNT_DEACTIVATED);
  const { token, expiresAt } = signToken(user, config.jwtSecret, config.tokenTtlS);
  return { token, expiresAt, user: session(user) };
}

/** A fresh token for a user whose current token `authenticate` has just accepted. */
export async function refresh(
  userId: number,
  config: Pick<AppConfig, 'jwtSecret' | 'tokenTtlS'>,
): Promise<LoginResponse> {
  const user = await User.findByPk(userId);
  if (!user || !user.active) throw unauthenticated();
  const { token, expiresAt } = signToken(user, config.jwtSecret, config.tokenTtlS);
  return { token, expiresAt, user: session(user) };
}

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

/**
 * Starts a password reset: for an active account, stores the sha256 of a random single-use
 * token and queues the e-mail with the link, in one transaction. Unknown addresses do nothing,
 * and the caller answers the same either way.
 */
export async function requestPasswordReset(
  emailInput: string,
  deps: { mailer: Mailer; publicUrl: string; requestId: string | null },
): Promise<void> {
  const email = normaliseEmail(emailInput);
  const user = await User.findOne({ where: { email, active: true } });
  if (!user) return;
  const token = randomBytes(32).toString('base64url');
  await inTransaction(async (t) => {
    const reset = await PasswordReset.create(
      {
        userId: user.id,
        tokenSha256: sha256(token),
        expiresAt: new Date(Date.now() + RESET_VALID_MINUTES * 60_000),
        usedAt: null,
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorId: null,
        action: 'password-reset',
        entity: 'user',
        entityId: user.id,
        after: { requested: true, resetId: reset.id, expiresAt: reset.expiresAt.toISOString() },
        requestId: deps.requestId,
      },
      t,
    );
    const link = `${deps.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
    await deps.mailer.enqueue(
      {
        ...passwordResetMail({
          to: user.email,
          name: user.name,
          link,
          validMinutes: RESET_VALID_MINUTES,
        }),
        relatedId: user.id,
      },
      t,
    );
  });
}

/** The message for a reset link that is unknown, used or expired (one answer for all three). */
export const RESET_LINK_INVALID =
  'This password reset link is not valid any more (used, expired or mistyped); ask for a new one';

/**
 * Sets a new password through a reset token: the token must be unused and unexpired; it and
 * every other open reset of the account are spent, and the token version rises so existing
 * sessions end.
 */
export async function confirmPasswordReset(
  token: string,
  password: string,
  requestId: string | null,
): Promise<void> {
  const passwordHash = await hashPassword(password);
  await inTransaction(async (t) => {
    const reset = await PasswordReset.findOne({
      where: { tokenSha256: sha256(token) },
      transaction: t,
      lock: t.LOCK.UPDATE,
    });
    const now = new Date();
    if (!reset || reset.usedAt || reset.expiresAt.getTime() <= now.getTime()) {
      throw badRequest(RESET_LINK_INVALID, [
        { field: 'body.token', problem: 'is not valid any more' },
      ]);
    }
    const user = await User.findByPk(reset.userId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!user || !user.active) {
      throw badRequest(RESET_LINK_INVALID, [
        { field: 'body.token', problem: 'is not valid any more' },
      ]);
    }
    await PasswordReset.update(
      { usedAt: now },
      { where: { userId: user.id, usedAt: { [Op.is]: null } }, transaction: t },
    );
    await user.update({ passwordHash, tokenVersion: user.tokenVersion + 1 }, { transaction: t });
    // The user whose password it is makes this change, through the link sent to them.
    await auditChange(t, { id: user.id, requestId }, 'password-reset', 'user', user.id, {
      after: { passwordChanged: true, resetId: reset.id },
    });
  });
}
