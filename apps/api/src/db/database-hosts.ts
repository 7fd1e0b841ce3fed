/**
 * The database servers an API process may connect to (`DB_HOSTS`), in order of preference. A new
 * connection goes to the first host that accepts a TCP connection and is not backing off; a host
 * that fails is skipped for a back-off that doubles on each failure (capped), then tried again,
 * so a recovered first host takes new connections back.
 */
import { connect } from 'node:net';

export interface DatabaseHost {
  host: string;
  port: number;
}

/** `host:port` as written in `DB_HOSTS` and reported by the health route. */
export const hostLabel = (h: DatabaseHost): string => `${h.host}:${h.port}`;

/**
 * Reads `DB_HOSTS` (`host:port,host:port,...`); throws an error naming the entry that is not a
 * host and a port from 1 to 65535.
 */
export function parseDatabaseHosts(raw: string): DatabaseHost[] {
  const entries = raw
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  if (entries.length === 0) throw new Error('DB_HOSTS is set but names no host');
  return entries.map((entry) => {
    const m = /^([A-Za-z0-9.\-_]+|\[[0-9a-fA-F:]+\]):(\d{1,5})$/.exec(entry);
    const port = m ? Number(m[2]) : NaN;
    if (!m || port < 1 || port > 65_535) {
      throw new Error(`DB_HOSTS entry "${entry}" is not host:port (for example 127.0.0.1:3600)`);
    }
    return { host: m[1]!.replace(/^\[|\]$/g, ''), port };
  });
}

interface HostState {
  host: DatabaseHost;
  failures: number;
  retryAt: number;
  /** When the host last passed a probe. */
  goodAt: number;
}

export interface DatabaseHostsOptions {
  /** First back-off after a failure, ms; doubles per consecutive failure. */
  backoffMs?: number;
  maxBackoffMs?: number;
  /** How long a probe may take before the host counts as down, ms. */
  probeTimeoutMs?: number;
  /** Whether a host can take a connection now; by default, whether it accepts TCP. */
  probe?: (host: DatabaseHost, timeoutMs: number) => Promise<boolean>;
  /** A host that passed a probe this recently is not probed again, ms. */
  trustMs?: number;
  /** How long `pick` keeps probing when no host answers (a cluster changing its view), ms. */
  waitMs?: number;
  now?: () => number;
}

/** TCP reachability of `h` within `timeoutMs`. */
export function tcpProbe(h: DatabaseHost, timeoutMs: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect({ host: h.host, port: h.port });
    const done = (ok: boolean) => {
      socket.destroy();
      resolve(ok);
    };
    socket.setTimeout(timeoutMs, () => done(false));
    socket.once('connect', () => done(true));
    socket.once('error', () => done(false));
  });
}

export class DatabaseHosts {
  private readonly states: HostState[];
  private lastUsed: DatabaseHost | null = null;
  private readonly backoffMs: number;
  private readonly maxBackoffMs: number;
  private readonly probeTimeoutMs: number;
  private readonly probe: (host: DatabaseHost, timeoutMs: number) => Promise<boolean>;
  private readonly trustMs: number;
  private readonly waitMs: number;
  private readonly now: () => number;

  constructor(hosts: DatabaseHost[], options: DatabaseHostsOptions = {}) {
    if (hosts.length === 0) throw new Error('DatabaseHosts needs at least one host');
    this.states = hosts.map((host) => ({ host, failures: 0, retryAt: 0, goodAt: -Infinity }));
    this.backoffMs = options.backoffMs ?? 1_000;
    this.maxBackoffMs = options.maxBackoffMs ?? 15_000;
    this.probeTimeoutMs = options.probeTimeoutMs ?? 500;
    this.probe = options.probe ?? tcpProbe;
    this.trustMs = options.trustMs ?? 0;
    this.waitMs = options.waitMs ?? 0;
    this.now = options.now ?? Date.now;
  }

  /** Every host, in order of preference. */
  get all(): DatabaseHost[] {
    return this.states.map((s) => s.host);
  }

  /** The host the latest new connection went to (the first one before any connection). */
  get current(): DatabaseHost {
    return this.lastUsed ?? this.states[0]!.host;
  }

  /**
   * The host for a new connection: the first one not backing off that passes the probe. When
   * none does, the hosts backing off are probed too, soonest back-off end first (a node may come
   * back early). When still none answers, the round is repeated every 250 ms for up to `waitMs`
   * (a Galera cluster stalls for a few seconds while it drops a dead node), and then the first host
   * is returned, so the caller's connection attempt reports the real error.
   */
  async pick(): Promise<DatabaseHost> {
    if (this.states.length === 1) return (this.lastUsed = this.states[0]!.host);
    const giveUpAt = this.now() + this.waitMs;
    for (;;) {
      const found = await this.round();
      if (found) return (this.lastUsed = found);
      if (this.now() >= giveUpAt) return (this.lastUsed = this.states[0]!.host);
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
  }

  /** One pass over the hosts; the first that is trusted or passes its probe. */
  private async round(): Promise<DatabaseHost | null> {
    const now = this.now();
    const ready = this.states.filter((s) => s.retryAt <= now);
    const waiting = this.states
      .filter((s) => s.retryAt > now)
      .sort((a, b) => a.retryAt - b.retryAt);
    for (const state of [...ready, ...waiting]) {
      if (now - state.goodAt < this.trustMs && state.retryAt <= now) return state.host;
      if (await this.probe(state.host, this.probeTimeoutMs)) {
        state.goodAt = this.now();
        state.failures = 0;
        state.retryAt = 0;
        return state.host;
      }
      this.markDown(state.host);
    }
    return null;
  }

  /** Records a failure of `host`: it is skipped until its back-off ends. */
  markDown(host: DatabaseHost): void {
    const state = this.find(host);
    if (!state) return;
    state.failures += 1;
    state.goodAt = -Infinity;
    const delay = Math.min(this.maxBackoffMs, this.backoffMs * 2 ** (state.failures - 1));
    state.retryAt = this.now() + delay;
  }

  /** Records a good connection to `host`: its back-off is cleared. */
  markUp(host: DatabaseHost): void {
    const state = this.find(host);
    if (!state) return;
    state.failures = 0;
    state.retryAt = 0;
  }

  private find(host: DatabaseHost): HostState | undefined {
    return this.states.find((s) => s.host.host === host.host && s.host.port === host.port);
  }
}
