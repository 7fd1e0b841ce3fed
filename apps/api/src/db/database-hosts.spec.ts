import { createServer, type Server } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { loadConfig } from '../config';
import { DatabaseHosts, hostLabel, parseDatabaseHosts } from './database-hosts';

const servers: Server[] = [];
async function listening(): Promise<number> {
  const server = createServer((socket) => socket.destroy());
  servers.push(server);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return (server.address() as { port: number }).port;
}
async function closedPort(): Promise<number> {
  const port = await listening();
  await new Promise<void>((resolve) => servers.pop()!.close(() => resolve()));
  return port;
}
afterEach(async () => {
  await Promise.all(servers.splice(0).map((s) => new Promise((r) => s.close(r))));
});

describe('DB_HOSTS', () => {
  it('reads host:port entries in order, IPv6 in brackets', () => {
    expect(parseDatabaseHosts('127.0.0.1:3600, db2.lab.example:3601,[::1]:3602')).toEqual([
      { host: '127.0.0.1', port: 3600 },
      { host: 'db2.lab.example', port: 3601 },
      { host: '::1', port: 3602 },
    ]);
  });

  it.each(['127.0.0.1', '127.0.0.1:0', 'host:70000', 'a b:1', ','])(
    'refuses "%s" naming the entry',
    (raw) => {
      expect(() => parseDatabaseHosts(raw)).toThrow(/DB_HOSTS/);
    },
  );

  it('replaces DB_HOST and DB_PORT in the configuration when set', () => {
    const config = loadConfig({
      DATA_DIR: '/tmp/rhotrace-hosts-spec',
      DB_HOST: '10.0.0.9',
      DB_PORT: '3307',
      DB_HOSTS: '127.0.0.1:3601,127.0.0.1:3602',
      JWT_SECRET: 'x'.repeat(40),
    });
    expect(config.db.host).toBe('127.0.0.1');
    expect(config.db.port).toBe(3601);
    expect(config.db.hosts?.map(hostLabel)).toEqual(['127.0.0.1:3601', '127.0.0.1:3602']);
  });
});

describe('DatabaseHosts', () => {
  it('prefers the first host that answers', async () => {
    const a = await listening();
    const b = await listening();
    const hosts = new DatabaseHosts([
      { host: '127.0.0.1', port: a },
      { host: '127.0.0.1', port: b },
    ]);
    expect((await hosts.pick()).port).toBe(a);
  });

  it('skips a host that refuses, backs it off, and returns to it once it answers again', async () => {
    const dead = await closedPort();
    const alive = await listening();
    let now = 1_000;
    const hosts = new DatabaseHosts(
      [
        { host: '127.0.0.1', port: dead },
        { host: '127.0.0.1', port: alive },
      ],
      { backoffMs: 1_000, now: () => now },
    );
    expect((await hosts.pick()).port).toBe(alive);
    expect(hosts.current.port).toBe(alive);
    // within its back-off the dead host is not even probed
    now += 500;
    expect((await hosts.pick()).port).toBe(alive);
    // it comes back: after the back-off, new connections go to it again
    const revived = createServer((s) => s.destroy());
    servers.push(revived);
    await new Promise<void>((resolve) => revived.listen(dead, '127.0.0.1', resolve));
    now += 600;
    expect((await hosts.pick()).port).toBe(dead);
  });

  it('doubles the back-off on each consecutive failure', async () => {
    const dead = await closedPort();
    const alive = await listening();
    let now = 0;
    const hosts = new DatabaseHosts(
      [
        { host: '127.0.0.1', port: dead },
        { host: '127.0.0.1', port: alive },
      ],
      { backoffMs: 100, maxBackoffMs: 1_000, now: () => now },
    );
    await hosts.pick(); // first failure at 0: skipped until 100
    now = 150;
    await hosts.pick(); // second failure at 150: skipped until 350
    const revived = createServer((s) => s.destroy());
    servers.push(revived);
    await new Promise<void>((resolve) => revived.listen(dead, '127.0.0.1', resolve));
    now = 300;
    expect((await hosts.pick()).port).toBe(alive);
    now = 360;
    expect((await hosts.pick()).port).toBe(dead);
  });

  it('when every host is down, names the first so the connection reports the real error', async () => {
    const d1 = await closedPort();
    const d2 = await closedPort();
    const hosts = new DatabaseHosts([
      { host: '127.0.0.1', port: d1 },
      { host: '127.0.0.1', port: d2 },
    ]);
    expect((await hosts.pick()).port).toBe(d1);
  });

  it('tries a host still backing off when none of the others answers', async () => {
    const answering = new Set<string>(['b']);
    const hosts = new DatabaseHosts(
      [
        { host: 'a', port: 1 },
        { host: 'b', port: 2 },
      ],
      { backoffMs: 60_000, probe: async (h) => answering.has(h.host), now: () => 0 },
    );
    expect((await hosts.pick()).host).toBe('b'); // a fails and backs off for a minute
    answering.clear();
    answering.add('a'); // b goes away, a is back long before its back-off ends
    expect((await hosts.pick()).host).toBe('a');
  });

  it('uses a custom probe, e.g. a Galera node that answers TCP but is not ready', async () => {
    const probed: string[] = [];
    const hosts = new DatabaseHosts(
      [
        { host: 'joining', port: 1 },
        { host: 'synced', port: 2 },
      ],
      {
        probe: async (h) => {
          probed.push(h.host);
          return h.host === 'synced';
        },
      },
    );
    expect((await hosts.pick()).host).toBe('synced');
    expect(probed).toEqual(['joining', 'synced']);
  });
});
