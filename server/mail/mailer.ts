/**
 * Sending e-mail. One mailer per database (so each test app has its own outbox): real SMTP
 * when SMTP_HOST is set, else the built-in capture server, started on first use.
 *
 * `send` never throws and never delays the request that caused it: failures are logged.
 * Tests (and anything that must see the outbox) await `idle()`.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import type { DataSource } from 'typeorm';
import type { Logger } from '../config/logger.js';
import { startFakeSmtp, type CapturedMail, type FakeSmtp } from './fake-smtp.js';
import { mailConfigFromEnv, type MailConfig } from './mail-config.js';
import { parseMessage } from './mime.js';
import { OutboxEntity } from './outbox.entity.js';

export interface MailMessage {
  to: string | string[];
  subject: string;
  text: string;
  html: string;
  /** what the message is about (kept in the outbox): invite, reset, submitted, returned, approved */
  kind: string;
}

export interface Mailer {
  readonly config: MailConfig;
  send(message: MailMessage): void;
  /** Resolves when every message sent so far has been delivered (or has failed). */
  idle(): Promise<void>;
  close(): Promise<void>;
}

/** Stores one captured message in the outbox. */
export async function storeCaptured(ds: DataSource, mail: CapturedMail): Promise<void> {
  const parsed = parseMessage(mail.raw);
  await ds.getRepository(OutboxEntity).insert({
    fromAddress: mail.from,
    toJson: JSON.stringify(mail.to),
    subject: parsed.subject,
    text: parsed.text,
    html: parsed.html,
    kind: parsed.headers.get('x-trestle-kind') ?? '',
  });
}

function createMailer(ds: DataSource, logger: Logger, config: MailConfig): Mailer {
  let fake: FakeSmtp | null = null;
  let transport: Promise<Transporter> | null = null;
  const pending = new Set<Promise<void>>();

  const getTransport = () =>
    (transport ??= (async () => {
      if (config.host) {
        return nodemailer.createTransport({
          host: config.host,
          port: config.port,
          secure: config.port === 465,
          auth: config.user ? { user: config.user, pass: config.pass ?? '' } : undefined,
        });
      }
      fake = await startFakeSmtp((mail) => storeCaptured(ds, mail));
      logger.info(`mail: no SMTP_HOST, capturing messages on 127.0.0.1:${fake.port} into the outbox`);
      return nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, secure: false, ignoreTLS: true });
    })());

  return {
    config,
    send(message) {
      const p = (async () => {
        const t = await getTransport();
        await t.sendMail({
          from: config.from,
          to: message.to,
          subject: message.subject,
          text: message.text,
          html: message.html,
          headers: { 'X-Trestle-Kind': message.kind },
        });
      })()
        .catch((err: unknown) => logger.error(`mail "${message.subject}" could not be sent`, err))
        .finally(() => pending.delete(p));
      pending.add(p);
    },
    async idle() {
      while (pending.size > 0) await Promise.all([...pending]);
    },
    async close() {
      await this.idle();
      if (transport) (await transport).close();
      if (fake) await (fake as FakeSmtp).close();
    },
  };
}

const mailers = new Map<DataSource, Mailer>();

/** The mailer of this database (created on first call; `config` only counts the first time). */
export function mailerFor(ds: DataSource, logger: Logger, config: MailConfig = mailConfigFromEnv()): Mailer {
  let m = mailers.get(ds);
  if (!m) {
    m = createMailer(ds, logger, config);
    mailers.set(ds, m);
  }
  return m;
}

/** Shutdown hook: flush and close every mailer. */
export async function closeMailers(): Promise<void> {
  const all = [...mailers.values()];
  mailers.clear();
  await Promise.all(all.map((m) => m.close()));
}
