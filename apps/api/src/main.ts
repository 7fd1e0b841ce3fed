/** Starts the Rhotrace server: API and built web app on one port, mail queue delivery. */
import { createServer } from 'node:http';
import { createApp } from './app';
import { pruneThrottles } from './auth/sign-in-throttle.service';
import { loadConfig } from './config';
import { connectDatabase } from './db/database';
import { createLogger } from './logger';
import { Mailer } from './mail/mailer.service';

const config = loadConfig();
const logger = createLogger();
const sequelize = connectDatabase(config.db);
const mailer = new Mailer({
  host: config.smtp.host,
  port: config.smtp.port,
  from: config.smtp.from,
});
const app = createApp({ config, sequelize, mailer, logger });
const server = createServer(app);
server.requestTimeout = 120_000;

server.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EADDRINUSE') {
    console.error(
      `[api] port ${config.port} is already in use: is Rhotrace already running? Set PORT to use another.`,
    );
  } else {
    console.error(`[api] ${error.message}`);
  }
  process.exit(1);
});

/** Forgotten sign-in throttle rows go once an hour (any instance may do it; it is idempotent). */
const PRUNE_EVERY_MS = 60 * 60 * 1000;
const prune = () =>
  void pruneThrottles().catch((error: unknown) =>
    logger.warn({ err: error }, 'pruning old sign-in throttle rows failed'),
  );
const pruning = setInterval(prune, PRUNE_EVERY_MS);
pruning.unref();

server.listen(config.port, config.host, () => {
  mailer.start();
  prune();
  console.log(`[api] listening on http://${config.host}:${config.port}`);
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log(`[api] ${signal}: stopping`);
  clearInterval(pruning);
  server.close();
  server.closeAllConnections();
  await mailer.stop();
  mailer.close();
  await sequelize.close().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
