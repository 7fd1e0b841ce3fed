import {
  roleCan,
  rolesWith,
  type AssigneeDto,
  type Page,
  type Role,
  type UserDto,
} from '@rhotrace/api-types';
import { Op, UniqueConstraintError, type Transaction, type WhereOptions } from 'sequelize';
import { auditChange, type Actor } from '../audit/audit.service';
import { conflict, notFound } from '../errors';
import { likePattern, orderFrom } from '../db/query';
import { hashPassword as hashInWorker } from '../auth/password-hasher';
import { User } from './user.model';
import { handOverOpenTasks } from './hand-over';
import { inTransaction } from '../db/connection';

/** bcrypt work factor for every stored password. */
export const BCRYPT_COST = 10;

/** Hashes a password with bcrypt at `BCRYPT_COST`. */
export function hashPassword(password: string): Promise<string> {
  return hashInWorker(password, BCRYPT_COST);
}

/** The API's view of a user: never the hash or the token version. */
export function toUserDto(user: User): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    createdAt: user.createdAt.toISOString(),
    updatedAt: user.updatedAt.toISOString(),
  };
}

/** E-mail addresses are compared and stored in lower case. */
export const normaliseEmail = (email: string): string => email.trim().toLowerCase();

export interface NewUser {
  email: string;
  name: string;
  role: Role;
  password: string;
}

/**
 * Creates an account with a bcrypt-hashed password and its audit event. `actor` is null for
 * the demo seeder and other system work. Runs in `transaction` when given, else in its own.
 */
export async function createUser(
  input: NewUser,
  actor: Actor | null,
  transaction?: Transaction,
): Promise<User> {
  const passwordHash = await hashPassword(input.password);
  const work = async (t: Transaction) => {
    const email = normaliseEmail(input.email);
    try {
      const user = await User.create(
        { email, name: input.name, role: input.role, passwordHash },
        { transaction: t },
      );
      await auditChange(t, actor, 'create', 'user', user.id, { after: toUserDto(user) });
      return user;
    } catch (error) {
      if (error instanceof UniqueConstraintError) {
        throw conflict(`An account with e-mail ${email} already exists`);
      }
      throw error;
    }
  };
  return transaction ? work(transaction) : inTransaction(work);
}

export interface UserChanges {
  name?: string;
  role?: Role;
  active?: boolean;
  password?: string;
  /** With `active: false`: who takes over the person's open tasks (they stay put without it). */
  reassignTo?: number;
}

/**
 * Changes an account (admin only). Deactivation and a new password raise the token version, so
 * sessions signed before stop working. The last active admin cannot be demoted or deactivated.
 */
export async function updateUser(id: number, changes: UserChanges, actor: Actor): Promise<User> {
  const passwordHash = changes.password ? await hashPassword(changes.password) : undefined;
  return inTransaction(async (t) => {
    const user = await User.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!user) throw notFound(`User ${id}`);
    const before = toUserDto(user);
    if (changes.active === false && user.active && user.id === actor.id) {
      throw conflict('You cannot deactivate your own account; another admin can');
    }
    // The last active account that manages accounts (the admin) must stay one.
    const losesAdmin =
      roleCan(user.role, 'users:manage') &&
      user.active &&
      ((changes.role !== undefined && !roleCan(changes.role, 'users:manage')) ||
        changes.active === false);
    if (losesAdmin) {
      const admins = await User.count({
        where: { role: { [Op.in]: rolesWith('users:manage') }, active: true },
        transaction: t,
      });
      if (admins <= 1) throw conflict('This is the last active admin; appoint another one first');
    }
    const revoke = (changes.active === false && user.active) || passwordHash !== undefined;
    await user.update(
      {
        ...(changes.name !== undefined ? { name: changes.name } : {}),
        ...(changes.role !== undefined ? { role: changes.role } : {}),
        ...(changes.active !== undefined ? { active: changes.active } : {}),
        ...(passwordHash ? { passwordHash } : {}),
        ...(revoke ? { tokenVersion: user.tokenVersion + 1 } : {}),
      },
      { transaction: t },
    );
    if (changes.reassignTo !== undefined)
      await handOverOpenTasks(t, user.id, changes.reassignTo, actor);
    await auditChange(t, actor, 'update', 'user', user.id, {
      before,
      after: { ...toUserDto(user), ...(passwordHash ? { passwordChanged: true } : {}) },
    });
    return user;
  });
}

/** One account or 404. */
export async function getUser(id: number): Promise<User> {
  const user = await User.findByPk(id);
  if (!user) throw notFound(`User ${id}`);
  return user;
}

export interface UserListOptions {
  page: number;
  pageSize: number;
  sort?: string;
  q?: string;
  role?: Role;
  active?: boolean;
}

/** A page of accounts, searchable by name and e-mail. */
export async function listUsers(options: UserListOptions): Promise<Page<UserDto>> {
  const where: WhereOptions<User>[] = [];
  if (options.q) {
    const like = likePattern(options.q);
    where.push({ [Op.or]: [{ name: { [Op.like]: like } }, { email: { [Op.like]: like } }] });
  }
  if (options.role) where.push({ role: options.role });
  if (options.active !== undefined) where.push({ active: options.active });
  const { rows, count } = await User.findAndCountAll({
    where: { [Op.and]: where },
    order: orderFrom(options.sort, 'name'),
    limit: options.pageSize,
    offset: (options.page - 1) * options.pageSize,
  });
  return {
    items: rows.map(toUserDto),
    total: count,
    page: options.page,
    pageSize: options.pageSize,
  };
}

/** Active accounts that can be given an assignment, by name. */
export async function listAssignees(): Promise<AssigneeDto[]> {
  const rows = await User.findAll({ where: { active: true }, order: [['name', 'ASC']] });
  return rows.map((u) => ({ id: u.id, name: u.name, email: u.email, role: u.role }));
}
