/**
 * Started by `npm start` in a process group of its own, with a pipe from the starter as its
 * standard input. The starter never writes to it: the pipe closes when the starter ends, however
 * it ends (SIGKILL included, which no handler sees). If the starter did not clean up first (its
 * record is still in the data folder), the guardian stops the API, the mail stand-in and MariaDB
 * it had started, so the next start finds its ports free.
 *
 *   tsx scripts/guardian.ts DATA_DIR STARTER_PID
 */
import { readRecord, stopLeftovers } from './leftovers';

const [dataDir, starter] = process.argv.slice(2);
if (!dataDir || !starter) {
  console.error('usage: tsx scripts/guardian.ts DATA_DIR STARTER_PID');
  process.exit(2);
}
const log = (line: string) => console.error(`[guardian] ${line}`);

process.stdin.resume();
process.stdin.on('data', () => undefined);
process.stdin.once('close', () => {
  const record = readRecord(dataDir);
  if (!record || record.starterPid !== Number(starter)) process.exit(0);
  log(`the starter (process ${starter}) ended without stopping Rhotrace: stopping what it started`);
  void stopLeftovers(dataDir, log).then(() => {
    log('stopped');
    process.exit(0);
  });
});
