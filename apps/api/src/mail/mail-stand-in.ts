import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { SMTPServer } from 'smtp-server';

export interface StandInMessage {
  from: string;
  to: string[];
  raw: string;
  file: string;
}

/**
 * The local SMTP stand-in for a mail service: accepts every message on loopback and keeps it as
 * an .eml file in `mailDir`, where a developer can read it (also listed under /api/dev/mail).
 */
export function startMailStandIn(options: {
  port: number;
  host?: string;
  mailDir: string;
  onMessage?: (message: StandInMessage) => void;
}): Promise<{ server: SMTPServer; port: number; close: () => Promise<void> }> {
  mkdirSync(options.mailDir, { recursive: true });
  let counter = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Rhotrace mail stand-in',
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        counter += 1;
        const stamp = new Date().toISOString().replace(/[:.]/g, '-');
        const file = join(options.mailDir, `${stamp}-${process.pid}-${counter}.eml`);
        writeFileSync(file, raw);
        options.onMessage?.({
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          raw,
          file,
        });
        callback();
      });
    },
  });
  return new Promise((resolvePromise, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host ?? '127.0.0.1', () => {
      const address = server.server.address();
      const port = typeof address === 'object' && address ? address.port : options.port;
      resolvePromise({
        server,
        port,
        close: () => new Promise<void>((r) => server.close(() => r())),
      });
    });
  });
}
