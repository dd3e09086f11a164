/**
 * An SMTP server for tests, independent of the product's own catcher: the `smtp-server`
 * library on loopback, keeping each raw message, read back with `mailparser` (a
 * general-purpose parser), so a test checks what really went over SMTP.
 */
import { createServer, type AddressInfo } from 'node:net';
import { simpleParser, type ParsedMail } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface TestSmtp {
  port: number;
  messages: { envelopeTo: string[]; raw: Buffer }[];
  parsed(): Promise<ParsedMail[]>;
  close(): Promise<void>;
}

/** Start a test SMTP server on `port` (0: any free port). `rejectRcpt` answers 550 to every recipient. */
export async function startTestSmtp(port = 0, options: { rejectRcpt?: boolean } = {}): Promise<TestSmtp> {
  const messages: TestSmtp['messages'] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    onRcptTo(_address, _session, callback) {
      if (options.rejectRcpt) {
        const err = new Error('Mailbox unavailable') as Error & { responseCode: number };
        err.responseCode = 550;
        return callback(err);
      }
      callback();
    },
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        messages.push({ envelopeTo: session.envelope.rcptTo.map((r) => r.address), raw: Buffer.concat(chunks) });
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  return {
    port: (server.server.address() as AddressInfo).port,
    messages,
    parsed: () => Promise.all(messages.map((m) => simpleParser(m.raw))),
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

/** A loopback port with nothing listening on it (SMTP "down"). */
export async function closedPort(): Promise<number> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', () => resolve()));
  const port = (probe.address() as AddressInfo).port;
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  return port;
}
