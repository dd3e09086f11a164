import type { MikroORM } from '@mikro-orm/sqlite';
import type { Logger } from 'pino';
import type { AppConfig } from '../../config';
import { queueDueReminders } from '../conflicts/conflict-mail';
import { CaptureServer } from './capture-server';
import { OutboxWorker } from './outbox';
import { loopbackSender, smtpSender, type MailSender } from './transport';

/** Outgoing mail as the running server has it: where it goes, the catcher, the worker. */
export interface MailRuntime {
  mode: 'smtp' | 'capture' | 'off';
  from: string;
  capture: CaptureServer | null;
  sender: MailSender | null;
  worker: OutboxWorker;
  /** Ask the worker for a pass soon (after queueing); no-op when the worker is not started. */
  nudge(): void;
  close(): Promise<void>;
}

/**
 * Set up mail from the configuration: a real SMTP server, or (development) the built-in catcher
 * on loopback, or nothing (production without SMTP: messages wait in the outbox). The worker is
 * made here but started by the caller (server/index.ts), so tests control delivery.
 */
export async function startMail(config: AppConfig, orm: MikroORM, logger?: Logger, overrides: { sender?: MailSender } = {}): Promise<MailRuntime> {
  const mail = config.mail;
  let capture: CaptureServer | null = null;
  let sender: MailSender | null = overrides.sender ?? null;
  let mode: MailRuntime['mode'] = 'off';
  if (sender) mode = 'smtp';
  else if (mail.smtp) {
    sender = smtpSender(mail.smtp);
    mode = 'smtp';
  } else if (mail.capture) {
    try {
      capture = await CaptureServer.start({ port: mail.capturePort });
    } catch (err) {
      throw new Error(`The development mail catcher could not listen on 127.0.0.1:${mail.capturePort} (${(err as Error).message}). Set MAIL_CAPTURE_PORT to a free port, or 0.`);
    }
    sender = loopbackSender(capture.address.port);
    mode = 'capture';
    logger?.info({ port: capture.address.port }, 'development mail catcher listening on 127.0.0.1 (see Admin → Mail)');
  } else {
    logger?.warn('No SMTP server configured (SMTP_URL or SMTP_HOST): mail waits in the outbox until one is set.');
  }
  const worker = new OutboxWorker({
    orm,
    sender,
    from: mail.from,
    intervalMs: mail.workerIntervalSeconds * 1000,
    logger,
    beforePass: async (em, now) => {
      await queueDueReminders(em, now, mail.publicUrl);
    },
  });
  return {
    mode,
    from: mail.from,
    capture,
    sender,
    worker,
    nudge: () => worker.nudge(),
    close: async () => {
      await worker.stop();
      sender?.close?.();
      await capture?.close();
    },
  };
}
