/** Starts the Rhotrace server: API and built web app on one port, mail queue delivery. */
import { createServer } from 'node:http';
import { createApp } from './app';
import { loadConfig } from './config';
import { connectDatabase } from './db/database';
import { createLogger } from './logger';
import { Mailer } from './mail/mailer.service';
import { startHousekeeping } from './ops/housekeeping';

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

let stopHousekeeping: (() => void) | null = null;
server.listen(config.port, config.host, () => {
  mailer.start();
  stopHousekeeping = startHousekeeping({ sequelize, config, logger, mailer });
  console.log(`[api] listening on http://${config.host}:${config.port}`);
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log(`[api] ${signal}: stopping`);
  stopHousekeeping?.();
  server.close();
  server.closeAllConnections();
  await mailer.stop();
  mailer.close();
  await sequelize.close().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
