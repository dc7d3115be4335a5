/**
 * The capture SMTP server for development and tests: listens on 127.0.0.1 on a free port,
 * accepts any sender and recipient without authentication, and hands every message to
 * `onMessage`. Never used when SMTP_HOST is set.
 */
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

export interface CapturedMail {
  from: string;
  to: string[];
  raw: string;
}

export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

/** Largest message the capture server accepts. */
const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

export async function startFakeSmtp(onMessage: (mail: CapturedMail) => Promise<void>): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: MAX_MESSAGE_BYTES,
    banner: 'Trestle capture server',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        const to = session.envelope.rcptTo.map((r) => r.address);
        onMessage({ from, to, raw: Buffer.concat(chunks).toString('utf8') }).then(
          () => callback(),
          (err: unknown) => callback(err instanceof Error ? err : new Error(String(err))),
        );
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  // Never keep the process alive just for the capture server.
  (server as unknown as { server: { unref(): void } }).server.unref();
  const port = ((server as unknown as { server: { address(): AddressInfo } }).server.address()).port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
