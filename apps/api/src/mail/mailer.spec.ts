import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePortForTest } from '../testing/free-port';
import { createTestContext, type TestContext } from '../testing/test-context';
import { startMailStandIn, type StandInMessage } from './mail-stand-in';
import { Mailer } from './mailer.service';
import { OutgoingEmail } from './outgoing-email.model';

const message = (to: string) => ({
  to,
  subject: 'Wafer LV-1/01 assigned',
  text: 'Plain text part',
  html: '<p>HTML part</p>',
});

describe('Mailer queue', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('keeps a message queued while the SMTP stand-in is down and delivers it once it is back', async () => {
    const port = await freePortForTest();
    const mailer = new Mailer({
      host: '127.0.0.1',
      port,
      from: 'notebook@rhotrace.example',
      retryBaseMs: 20,
      maxBackoffMs: 50,
    });
    const row = await mailer.enqueue(message('down@test.rhotrace.example'));
    await mailer.deliverDue();
    await row.reload();
    expect(row.state).toBe('queued');
    expect(row.attempts).toBeGreaterThanOrEqual(1);
    expect(row.lastError).toBeTruthy();

    const received: StandInMessage[] = [];
    const standIn = await startMailStandIn({
      port,
      mailDir: `${ctx.config.dataDir}/mail-b`,
      onMessage: (m) => received.push(m),
    });
    try {
      await new Promise((r) => setTimeout(r, 80));
      await mailer.deliverDue();
      await row.reload();
      expect(row.state).toBe('sent');
      expect(received.map((m) => m.to)).toEqual([['down@test.rhotrace.example']]);
      expect(received[0]!.raw).toContain('Plain text part');
      expect(received[0]!.raw).toContain('<p>HTML part</p>');
    } finally {
      await mailer.stop();
      mailer.close();
      await standIn.close();
    }
  });

  it('never sends a message twice when two server processes deliver the same queue', async () => {
    const port = await freePortForTest();
    const received: StandInMessage[] = [];
    const standIn = await startMailStandIn({
      port,
      mailDir: `${ctx.config.dataDir}/mail-c`,
      onMessage: (m) => received.push(m),
    });
    const a = new Mailer({ host: '127.0.0.1', port, from: 'a@rhotrace.example' });
    const b = new Mailer({ host: '127.0.0.1', port, from: 'b@rhotrace.example' });
    try {
      await OutgoingEmail.destroy({ where: {} });
      for (let i = 0; i < 30; i += 1) {
        await OutgoingEmail.create({
          toAddress: `m${i}@test.rhotrace.example`,
          subject: `s${i}`,
          textBody: 't',
          htmlBody: '<p>h</p>',
          state: 'queued',
          lastError: null,
          nextAttemptAt: new Date(Date.now() - 1000),
          sentAt: null,
          relatedEntity: null,
          relatedId: null,
        });
      }
      const [sentA, sentB] = await Promise.all([a.deliverDue(), b.deliverDue()]);
      expect(sentA + sentB).toBe(30);
      const addresses = received.flatMap((m) => m.to).sort();
      expect(new Set(addresses).size).toBe(30);
      expect(addresses).toHaveLength(30);
      expect(await OutgoingEmail.count({ where: { state: 'sent' } })).toBe(30);
    } finally {
      a.close();
      b.close();
      await standIn.close();
    }
  });
});
