/**
 * Notices when whatever launched this process is gone. `npm start` runs npm, then npm's `sh -c`,
 * then start.sh exec'd into node running this script: a SIGKILL of npm leaves the rest running as
 * orphans, since sh does not stop when its parent dies (nor does the tsx launcher, where one runs
 * this script). So the watch covers the parent and, through those wrappers, every ancestor up to
 * the first that is not one (npm, a terminal's shell, a test runner). On Linux it reads /proc;
 * elsewhere it sees only the parent's id.
 */
import { readFileSync } from 'node:fs';

interface ProcInfo {
  ppid: number;
  state: string;
  startTicks: string;
  command: string[];
}

function procInfo(pid: number): ProcInfo | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // fields after "pid (comm) ": state, ppid, …; the start time is field 22 of the whole line
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const command = readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').filter(Boolean);
    return {
      state: fields[0] ?? '',
      ppid: Number(fields[1]),
      startTicks: fields[19] ?? '',
      command,
    };
  } catch {
    return null;
  }
}

/** A process that only passes the start along: a `sh -c`, start.sh, the tsx launcher. */
function isWrapper(command: string[]): boolean {
  const [program = '', flag] = command;
  if (/(^|\/)(ba|da)?sh$/.test(program) && flag === '-c') return true;
  return command.some((a) =>
    /scripts\/start\.sh$|node_modules\/\.bin\/tsx$|tsx\/dist\/cli/.test(a),
  );
}

/** Calls `onGone` once, when the parent or a launcher above it has ended. Polls every `everyMs`. */
export function watchLaunchers(onGone: (pid: number) => void, everyMs = 500): void {
  const watched: Array<{ pid: number; startTicks: string }> = [];
  let pid = process.ppid;
  for (let depth = 0; depth < 8 && pid > 1; depth++) {
    const info = procInfo(pid);
    if (!info) break;
    watched.push({ pid, startTicks: info.startTicks });
    if (!isWrapper(info.command)) break;
    pid = info.ppid;
  }
  const parentAtStart = process.ppid;
  const timer = setInterval(() => {
    const gone =
      watched.length === 0
        ? process.ppid !== parentAtStart
          ? parentAtStart
          : 0
        : (watched.find((w) => {
            const now = procInfo(w.pid);
            return !now || now.state === 'Z' || now.startTicks !== w.startTicks;
          })?.pid ?? 0);
    if (gone) {
      clearInterval(timer);
      onGone(gone);
    }
  }, everyMs);
  timer.unref();
}
