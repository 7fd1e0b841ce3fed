/**
 * `npm run stop`: stops the Rhotrace that `npm start` runs from DATA_DIR (default db/.data), from
 * another terminal or after its starter was killed: a live starter is asked to shut down as Ctrl-C
 * would; processes a dead starter left behind (API, mail stand-in, MariaDB) are stopped here.
 */
import { existsSync, readFileSync } from 'node:fs';
import { isAbsolute, join, resolve } from 'node:path';
import { alive, starterPidFile, stopLeftovers, survivors } from './leftovers';

const ROOT = resolve(import.meta.dirname, '..');
const dataDirRaw = process.env.DATA_DIR ?? join(ROOT, 'db/.data');
const dataDir = isAbsolute(dataDirRaw) ? dataDirRaw : resolve(ROOT, dataDirRaw);
const log = (line: string) => console.log(`[stop] ${line}`);

async function main(): Promise<void> {
  const pidFile = starterPidFile(dataDir);
  const starter = existsSync(pidFile) ? Number(readFileSync(pidFile, 'utf8')) : 0;
  if (starter && alive(starter)) {
    log(`asking Rhotrace (process ${starter}) to stop`);
    process.kill(starter, 'SIGTERM');
    const until = Date.now() + 60_000;
    while (alive(starter) && Date.now() < until) await new Promise((r) => setTimeout(r, 100));
    if (alive(starter)) {
      log(`process ${starter} did not stop within 60 s`);
      process.exit(1);
    }
  }
  const left = survivors(dataDir);
  const still = left.length ? await stopLeftovers(dataDir, log) : [];
  if (still.length) {
    log(`still running: ${still.join(', ')}`);
    process.exit(1);
  }
  log(
    starter || left.length
      ? `Rhotrace of ${dataDir} is stopped`
      : `nothing running from ${dataDir}`,
  );
}

void main();
