import nodemailer, { type Transporter } from 'nodemailer';
import { Op, type Transaction } from 'sequelize';
import { OutgoingEmail } from './outgoing-email.model';
import { database } from '../db/connection';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  relatedEntity?: string;
  relatedId?: number | string;
}

export interface MailerOptions {
  host: string;
  port: number;
  from: string;
  /** Delay before the first retry; doubles per attempt up to `maxBackoffMs`. */
  retryBaseMs?: number;
  maxBackoffMs?: number;
}

/**
 * Outgoing e-mail through a queue table: a message is stored in the same transaction as the
 * change that caused it, then delivered over SMTP; failures are retried with back-off, so a
 * mail server outage never loses the change or the message.
 */
export class Mailer {
  private readonly transport: Transporter;
  private timer: NodeJS.Timeout | undefined;
  private running: Promise<number> | undefined;

  constructor(private readonly options: MailerOptions) {
    this.transport = nodemailer.createTransport({
      host: options.host,
      port: options.port,
      secure: false,
      ignoreTLS: true,
      connectionTimeout: 3_000,
      greetingTimeout: 3_000,
      socketTimeout: 5_000,
    });
  }

  /** Queues a message; pass the change's transaction so both commit together. */
  async enqueue(message: MailMessage, transaction?: Transaction): Promise<OutgoingEmail> {
    const row = await OutgoingEmail.create(
      {
        toAddress: message.to,
        subject: message.subject,
        textBody: message.text,
        htmlBody: message.html,
        state: 'queued',
        lastError: null,
        nextAttemptAt: new Date(),
        sentAt: null,
        relatedEntity: message.relatedEntity ?? null,
        relatedId: message.relatedId === undefined ? null : String(message.relatedId),
      },
      { transaction },
    );
    if (transaction) transaction.afterCommit(() => this.kick());
    else this.kick();
    return row;
  }

  /** Sends every queued message that is due; returns how many were sent. */
  deliverDue(): Promise<number> {
    this.running ??= this.deliver().finally(() => {
      this.running = undefined;
    });
    return this.running;
  }

  /**
   * Claims due messages with `FOR UPDATE SKIP LOCKED`, so several API processes sharing one
   * database never send the same message twice, and sends them one by one.
   */
  private async deliver(): Promise<number> {
    const sequelize = database();
    let sent = 0;
    for (let batch = 0; batch < 10; batch += 1) {
      const claimed = await sequelize.transaction(async (transaction) => {
        const due = await OutgoingEmail.findAll({
          where: { state: 'queued', nextAttemptAt: { [Op.lte]: new Date() } },
          order: [['id', 'ASC']],
          limit: 20,
          lock: transaction.LOCK.UPDATE,
          skipLocked: true,
          transaction,
        });
        for (const mail of due) {
          try {
            await this.transport.sendMail({
              from: this.options.from,
              to: mail.toAddress,
              subject: mail.subject,
              text: mail.textBody,
              html: mail.htmlBody,
            });
            await mail.update(
              { state: 'sent', sentAt: new Date(), attempts: mail.attempts + 1 },
              { transaction },
            );
            sent += 1;
          } catch (error) {
            const attempts = mail.attempts + 1;
            const base = this.options.retryBaseMs ?? 2_000;
            const backoff = Math.min(
              base * 2 ** (attempts - 1),
              this.options.maxBackoffMs ?? 300_000,
            );
            await mail.update(
              {
                attempts,
                lastError: error instanceof Error ? error.message : String(error),
                nextAttemptAt: new Date(Date.now() + backoff),
                state: attempts >= 50 ? 'failed' : 'queued',
              },
              { transaction },
            );
          }
        }
        return due.length;
      });
      if (claimed < 20) break;
    }
    return sent;
  }

  private kick(): void {
    setImmediate(() => {
      this.deliverDue().catch(() => undefined);
    });
  }

  /** Retries the queue every `intervalMs` until `stop()`. */
  start(intervalMs = 2_000): void {
    this.stop();
    this.timer = setInterval(() => this.deliverDue().catch(() => undefined), intervalMs);
    this.timer.unref();
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = undefined;
    await this.running?.catch(() => undefined);
  }

  close(): void {
    this.transport.close();
  }
}
