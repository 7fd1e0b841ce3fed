import { createServer, type Server } from 'node:net';

/** Opens a listener on a port of the system's choosing and answers it with the port. */
function listenOnAny(): Promise<{ server: Server; port: number }> {
  return new Promise((resolvePort, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      resolvePort({ server, port: typeof address === 'object' && address ? address.port : 0 });
    });
  });
}

/**
 * `count` distinct TCP ports on loopback that nothing listens on right now. Every port is held
 * until all are chosen: asked one after another, the system may hand the same free port out
 * twice (a database and an API once got one port between them).
 */
export async function freePortsForTest(count: number): Promise<number[]> {
  const held: Array<{ server: Server; port: number }> = [];
  try {
    for (let i = 0; i < count; i += 1) held.push(await listenOnAny());
    return held.map((h) => h.port);
  } finally {
    await Promise.all(held.map((h) => new Promise((done) => h.server.close(done))));
  }
}

/** A TCP port on loopback that nothing listens on right now. */
export async function freePortForTest(): Promise<number> {
  const [port] = await freePortsForTest(1);
  return port!;
}
