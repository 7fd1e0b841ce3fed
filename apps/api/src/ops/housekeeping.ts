/**
 * The server's hourly chores: forgotten sign-in throttle rows and orphaned raw-file objects go,
 * station Idempotency-Keys past their retention are forgotten, and assignees of overdue tasks get
 * their daily reminder. Every instance may run them at once:
 * the deletions only take what nothing refers to, and each reminder is claimed in the database.
 */
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import { pruneThrottles } from '../auth/sign-in-throttle.service';
import { remindOverdue } from '../assignments/overdue-reminders';
import type { AppConfig } from '../config';
import type { Mailer } from '../mail/mailer.service';
import { removeOrphanedObjects } from '../storage/object-reconciler';
import type { S3RawStorage } from '../storage/s3-raw-storage';
import { forgetOldKeys } from '../station-posts/key-retention';
import { rawStorageFor } from '../storage/storage';

/** How often the chores run, ms. */
export const HOUSEKEEPING_EVERY_MS = 60 * 60 * 1000;

/** Runs the chores once; a failure is logged and the next run tries again. */
export async function houseKeep(
  deps: {
    sequelize: Sequelize;
    config: Pick<AppConfig, 'storage'> & Partial<Pick<AppConfig, 'publicUrl'>>;
    logger: Logger;
    mailer?: Mailer;
  },
  now = new Date(),
): Promise<void> {
  if (deps.mailer && deps.config.publicUrl) {
    try {
      const queued = await remindOverdue({ mailer: deps.mailer, publicUrl: deps.config.publicUrl });
      if (queued) deps.logger.info({ queued }, 'queued overdue-task reminders');
    } catch (error) {
      deps.logger.warn({ err: error }, 'queuing overdue-task reminders failed');
    }
  }
  try {
    const pruned = await pruneThrottles(now);
    if (pruned) deps.logger.info({ pruned }, 'forgot old sign-in throttle rows');
  } catch (error) {
    deps.logger.warn({ err: error }, 'pruning old sign-in throttle rows failed');
  }
  try {
    const forgotten = await forgetOldKeys(now);
    if (forgotten) deps.logger.info({ forgotten }, 'forgot old station Idempotency-Keys');
  } catch (error) {
    deps.logger.warn({ err: error }, 'forgetting old station Idempotency-Keys failed');
  }
  if (deps.config.storage !== 's3') return;
  try {
    const storage = rawStorageFor('s3') as S3RawStorage;
    const { checked, deleted } = await removeOrphanedObjects(deps.sequelize, storage, now);
    if (deleted) deps.logger.info({ checked, deleted }, 'removed orphaned raw-file objects');
  } catch (error) {
    deps.logger.warn({ err: error }, 'removing orphaned raw-file objects failed');
  }
}

/** Runs the chores now and every `HOUSEKEEPING_EVERY_MS`; returns the function that stops them. */
export function startHousekeeping(deps: Parameters<typeof houseKeep>[0]): () => void {
  const run = () => void houseKeep(deps);
  const timer = setInterval(run, HOUSEKEEPING_EVERY_MS);
  timer.unref();
  run();
  return () => clearInterval(timer);
}
