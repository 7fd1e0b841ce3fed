import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config';
import type { Mailer } from './mail/mailer.service';

/** What `createApp` needs from the outside world; tests pass their own. */
export interface AppDeps {
  config: AppConfig;
  sequelize: Sequelize;
  mailer: Mailer;
  logger: Logger;
}
