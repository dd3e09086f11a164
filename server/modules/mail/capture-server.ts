import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { CapturedMailDetailDto, CapturedMailDto } from '@shared/api';

/** A message caught by the development SMTP server. */
export interface CapturedMail {
  id: number;
  receivedAt: Date;
  envelopeFrom: string | null;
  envelopeTo: string[];
  raw: Buffer;
  from: string | null;
  to: string[];
  subject: string | null;
  text: string | null;
  attachments: { filename: string | null; contentType: string; size: number }[];
}

type Parsed = Pick<CapturedMail, 'from' | 'to' | 'subject' | 'text' | 'attachments'>;

/**
 * Parse with mailparser. It is a development dependency, and this server runs only outside
 * production, so it is loaded on demand; without it the envelope and size are still shown.
 */
async function parse(raw: Buffer): Promise<Parsed> {
  try {
    const { simpleParser } = await import('mailparser');
    const mail = await simpleParser(raw);
    const addresses = (v: typeof mail.to) => (v ? (Array.isArray(v) ? v : [v]).flatMap((a) => a.value.map((x) => x.address ?? '')).filter(Boolean) : []);
    return {
      from: mail.from?.text ?? null,
      to: addresses(mail.to),
      subject: mail.subject ?? null,
      text: mail.text ?? null,
      attachments: mail.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, size: a.size })),
    };
  } catch {
    return { from: null, to: [], subject: null, text: null, attachments: [] };
  }
}

/**
 * The built-in SMTP server of development: listens on loopback only, takes every message
 * without authentication or TLS, and keeps the last `keep` in memory for Admin → Mail.
 * Nothing it receives goes anywhere else.
 */
export class CaptureServer {
  private readonly messages: CapturedMail[] = [];
  private nextId = 1;
  private server: SMTPServer | null = null;
  private port = 0;

  private constructor(
    private readonly host: string,
    private readonly keep: number,
  ) {}

  /** Start listening on `host:port` (port 0: any free port). */
  static async start(options: { port?: number; host?: string; keep?: number } = {}): Promise<CaptureServer> {
    const capture = new CaptureServer(options.host ?? '127.0.0.1', options.keep ?? 500);
    await capture.listen(options.port ?? 0);
    return capture;
  }

  private listen(port: number): Promise<void> {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['AUTH', 'STARTTLS'],
      logger: false,
      size: 30 * 1024 * 1024,
      banner: 'Threadline development mail catcher',
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('error', (err) => callback(err));
        stream.on('end', () => {
          const raw = Buffer.concat(chunks);
          const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : null;
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          void parse(raw).then((parsed) => {
            this.messages.unshift({ id: this.nextId++, receivedAt: new Date(), envelopeFrom, envelopeTo, raw, ...parsed });
            if (this.messages.length > this.keep) this.messages.length = this.keep;
            callback();
          });
        });
      },
    });
    this.server = server;
    return new Promise((resolve, reject) => {
      server.server.once('error', reject);
      server.listen(port, this.host, () => {
        this.port = (server.server.address() as AddressInfo).port;
        resolve();
      });
    });
  }

  get address(): { host: string; port: number } {
    return { host: this.host, port: this.port };
  }

  /** Newest first. */
  list(): CapturedMail[] {
    return [...this.messages];
  }

  get(id: number): CapturedMail | undefined {
    return this.messages.find((m) => m.id === id);
  }

  close(): Promise<void> {
    const server = this.server;
    this.server = null;
    return new Promise((resolve) => (server ? server.close(() => resolve()) : resolve()));
  }
}

export function presentCaptured(m: CapturedMail): CapturedMailDto {
  return {
    id: m.id,
    receivedAt: m.receivedAt.toISOString(),
    envelopeFrom: m.envelopeFrom,
    envelopeTo: m.envelopeTo,
    from: m.from,
    to: m.to,
    subject: m.subject,
    attachments: m.attachments,
    size: m.raw.length,
  };
}

export function presentCapturedDetail(m: CapturedMail): CapturedMailDetailDto {
  return { ...presentCaptured(m), text: m.text };
}
