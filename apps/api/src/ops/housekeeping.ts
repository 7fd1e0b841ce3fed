/**
 * The server's hourly chores: forgotten sign-in throttle rows and orphaned raw-file objects go.
 * Every instance may run them at once; both only delete what nothing refers to.
 */
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import { pruneThrottles } from '../auth/sign-in-throttle.service';
import type { AppConfig } from '../config';
import { removeOrphanedObjects } from '../storage/object-reconciler';
import type { S3RawStorage } from '../storage/s3-raw-storage';
import { rawStorageFor } from '../storage/storage';

/** How often the chores run, ms. */
export const HOUSEKEEPING_EVERY_MS = 60 * 60 * 1000;

/** Runs the chores once; a failure is logged and the next run tries again. */
export async function houseKeep(
  deps: { sequelize: Sequelize; config: Pick<AppConfig, 'storage'>; logger: Logger },
  now = new Date(),
): Promise<void> {
  try {
    const pruned = await pruneThrottles(now);
    if (pruned) deps.logger.info({ pruned }, 'forgot old sign-in throttle rows');
  } catch (error) {
    deps.logger.warn({ err: error }, 'pruning old sign-in throttle rows failed');
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
