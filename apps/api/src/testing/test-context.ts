import { randomBytes } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import bcrypt from 'bcryptjs';
import type { Express } from 'express';
import { ROLES, type Role } from '@rhotrace/api-types';
import type { Sequelize } from 'sequelize';
import { createApp } from '../app';
import { signToken } from '../auth/token.service';
import { loadConfig, type AppConfig } from '../config';
import { connectDatabase } from '../db/database';
import { migrator } from '../db/migrator';
import { createLogger } from '../logger';
import { startMailStandIn, type StandInMessage } from '../mail/mail-stand-in';
import { Mailer } from '../mail/mailer.service';
import { User } from '../users/user.model';

export const TEST_PASSWORD = 'test-password-1';

export interface TestContext {
  app: Express;
  config: AppConfig;
  sequelize: Sequelize;
  mailer: Mailer;
  /** Messages the SMTP stand-in received, oldest first. */
  mailbox: StandInMessage[];
  /** One active user per role, e-mail `ROLE@test.rhotrace.example`. */
  users: Record<Role, User>;
  /** A valid bearer header per role. */
  auth: (role: Role) => { Authorization: string };
  /** Creates another user and returns it with its bearer header. */
  addUser: (
    role: Role,
    name?: string,
  ) => Promise<{ user: User; header: { Authorization: string } }>;
  close: () => Promise<void>;
}

/**
 * A fresh, migrated database of its own (dropped again by `close`), an SMTP stand-in on a free
 * port, and the app built over them. Needs the MariaDB that `npm test` starts (DB_* variables).
 */
export async function createTestContext(
  overrides: Partial<AppConfig> = {},
  /** Extra environment, e.g. the DB_* variables of a private server started by the test. */
  env: Record<string, string> = {},
): Promise<TestContext> {
  const base = loadConfig({
    ...process.env,
    ...env,
    DATA_DIR: mkdtempSync(join(tmpdir(), 'rhotrace-t-')),
  });
  const dbName = `${base.db.name}_t_${randomBytes(5).toString('hex')}`;
  const admin = connectDatabase(base.db, { poolMax: 1 });
  await admin.query(
    `CREATE DATABASE \`${dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
  );
  await admin.close();

  const mailbox: StandInMessage[] = [];
  const standIn = await startMailStandIn({
    port: 0,
    mailDir: join(base.dataDir, 'mail'),
    onMessage: (m) => mailbox.push(m),
  });
  const config: AppConfig = {
    ...base,
    db: { ...base.db, name: dbName },
    smtp: { ...base.smtp, port: standIn.port },
    mailDir: join(base.dataDir, 'mail'),
    webDist: join(base.dataDir, 'no-web'),
    ...overrides,
  };
  const sequelize = connectDatabase(config.db, { poolMax: 10 });
  await migrator(sequelize).up();
  const mailer = new Mailer({ ...config.smtp, retryBaseMs: 50, maxBackoffMs: 500 });
  const app = createApp({ config, sequelize, mailer, logger: createLogger('silent') });

  const passwordHash = await bcrypt.hash(TEST_PASSWORD, 10);
  const users = {} as Record<Role, User>;
  for (const role of ROLES) {
    users[role] = await User.create({
      email: `${role}@test.rhotrace.example`,
      name: `Test ${role}`,
      role,
      passwordHash,
    });
  }
  const header = (user: User) => ({
    Authorization: `Bearer ${signToken(user, config.jwtSecret, config.tokenTtlS).token}`,
  });
  let extra = 0;
  return {
    app,
    config,
    sequelize,
    mailer,
    mailbox,
    users,
    auth: (role) => header(users[role]),
    addUser: async (role, name) => {
      extra += 1;
      const user = await User.create({
        email: `${role}${extra}@test.rhotrace.example`,
        name: name ?? `Test ${role} ${extra}`,
        role,
        passwordHash,
      });
      return { user, header: header(user) };
    },
    close: async () => {
      await mailer.stop();
      mailer.close();
      await standIn.close();
      await sequelize.query(`DROP DATABASE IF EXISTS \`${dbName}\``).catch(() => undefined);
      await sequelize.close();
    },
  };
}
