import nodemailer from 'nodemailer';
import type { MailConfig } from './mail-config';

/** What the outbox needs of a mail transport: nodemailer's transporter fits. */
export interface MailSender {
  sendMail(message: {
    from: string;
    to: string;
    replyTo?: string;
    subject: string;
    text: string;
    messageId?: string;
    attachments?: { filename: string; content: Buffer; contentType: string }[];
  }): Promise<{ messageId?: string; response?: string }>;
  close?(): void;
}

/** Timeouts short enough that a dead server costs one worker pass a few seconds, not minutes. */
const TIMEOUTS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 };

/** A transport to the SMTP server of the environment (SMTP_URL or SMTP_HOST…). */
export function smtpSender(smtp: NonNullable<MailConfig['smtp']>): MailSender {
  if (smtp.url) return nodemailer.createTransport({ url: smtp.url, ...TIMEOUTS });
  return nodemailer.createTransport({
    host: smtp.host ?? 'localhost',
    port: smtp.port,
    secure: smtp.secure,
    auth: smtp.user ? { user: smtp.user, pass: smtp.pass ?? '' } : undefined,
    ...TIMEOUTS,
  });
}

/** A plain (no TLS, no auth) transport to an SMTP server on this machine: the built-in catcher, or a test's server. */
export function loopbackSender(port: number, host = '127.0.0.1'): MailSender {
  return nodemailer.createTransport({ host, port, secure: false, ignoreTLS: true, ...TIMEOUTS });
}
