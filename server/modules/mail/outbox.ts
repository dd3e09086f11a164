import type { EntityManager, MikroORM } from '@mikro-orm/sqlite';
import type { OutboxMessageDto } from '@shared/api';
import type { Logger } from 'pino';
import type { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { OutboxMessage, type StoredAttachment } from './outbox-message.entity';
import type { MailSender } from './transport';

/** Largest total of attachments kept with one message (SMTP servers commonly refuse 10–25 MB). */
export const MAX_ATTACHMENT_BYTES = 8 * 1024 * 1024;

/** First retry after 30 s, doubling each time, never more than an hour apart. */
export const RETRY_BASE_MS = 30_000;
export const RETRY_MAX_MS = 60 * 60_000;

/** Delay before the next attempt after `attempts` failed ones (1, 2, 3… → 30 s, 60 s, 120 s … ≤ 1 h). */
export function retryDelayMs(attempts: number): number {
  return Math.min(RETRY_BASE_MS * 2 ** Math.max(0, attempts - 1), RETRY_MAX_MS);
}

export interface NewMessage {
  project: Project | null;
  purpose: string;
  to: string;
  subject: string;
  text: string;
  replyTo?: string | null;
  attachments?: { filename: string; contentType: string; content: Buffer }[];
  createdBy?: User | null;
  dedupeKey?: string | null;
}

/**
 * Put a message in the outbox, inside the caller's unit of work (it is written with the change
 * that caused it, or not at all). With a `dedupeKey` already used, nothing is queued and null
 * is returned.
 */
export async function enqueueMail(em: EntityManager, m: NewMessage): Promise<OutboxMessage | null> {
  if (m.dedupeKey && (await em.count(OutboxMessage, { dedupeKey: m.dedupeKey })) > 0) return null;
  const attachments: StoredAttachment[] = (m.attachments ?? []).map((a) => ({
    filename: a.filename,
    contentType: a.contentType,
    size: a.content.length,
    base64: a.content.toString('base64'),
  }));
  const total = attachments.reduce((s, a) => s + a.size, 0);
  if (total > MAX_ATTACHMENT_BYTES) throw new Error(`attachments of ${total} bytes exceed the outbox limit of ${MAX_ATTACHMENT_BYTES}`);
  const message = new OutboxMessage({ purpose: m.purpose, to: m.to, subject: m.subject, text: m.text });
  message.project = m.project;
  message.replyTo = m.replyTo ?? null;
  message.attachments = attachments;
  message.createdBy = m.createdBy ? em.getReference(User, m.createdBy.id) : null;
  message.dedupeKey = m.dedupeKey ?? null;
  message.nextAttemptAt = new Date(0); // due at once
  em.persist(message);
  return message;
}

export interface DeliveryReport {
  sent: number[];
  /** Messages that failed this time and wait for their next attempt. */
  deferred: number[];
  /** Messages the server refused for good (SMTP 5xx). */
  failed: number[];
}

/** True when the server's answer means retrying the same message cannot succeed (RFC 5321 5yz replies). */
function isPermanent(err: unknown): boolean {
  const e = err as { permanent?: boolean; responseCode?: number };
  if (typeof e?.permanent === 'boolean') return e.permanent;
  return typeof e?.responseCode === 'number' && e.responseCode >= 500 && e.responseCode < 600;
}

function errorText(err: unknown): string {
  const e = err as { code?: string; responseCode?: number; message?: string };
  const parts = [e?.code, e?.responseCode ? String(e.responseCode) : null, e?.message ?? String(err)].filter(Boolean);
  return parts.join(' ').slice(0, 1000);
}

function domainOf(address: string): string {
  const match = /@([^>\s]+)>?\s*$/.exec(address);
  return match?.[1] ?? 'threadline.local';
}

/**
 * Send every queued message that is due at `now`, oldest first, up to `batch`. A message the
 * server accepts is marked sent; a transient failure (server down, 4xx) counts an attempt and
 * waits {@link retryDelayMs}; a permanent refusal (5xx) is marked failed with the server's
 * answer. Each message carries a Message-ID fixed by its outbox id, so a retry after an
 * ambiguous failure is recognisable as the same message.
 */
export async function deliverDue(em: EntityManager, sender: MailSender, from: string, now: Date = new Date(), batch = 20): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: [], deferred: [], failed: [] };
  const due = await em.find(OutboxMessage, { status: 'queued', nextAttemptAt: { $lte: now } }, { orderBy: { nextAttemptAt: 'asc', id: 'asc' }, limit: batch });
  for (const message of due) {
    const messageId = `<threadline.${message.id}.${message.createdAt.getTime()}@${domainOf(from)}>`;
    message.attempts += 1;
    try {
      await sender.sendMail({
        from,
        to: message.to,
        replyTo: message.replyTo ?? undefined,
        subject: message.subject,
        text: message.text,
        messageId,
        attachments: message.attachments.map((a) => ({ filename: a.filename, content: Buffer.from(a.base64, 'base64'), contentType: a.contentType })),
      });
      message.status = 'sent';
      message.sentAt = now;
      message.nextAttemptAt = null;
      message.lastError = null;
      message.messageId = messageId;
      report.sent.push(message.id);
    } catch (err) {
      message.lastError = errorText(err);
      if (isPermanent(err)) {
        message.status = 'failed';
        message.nextAttemptAt = null;
        report.failed.push(message.id);
      } else {
        message.nextAttemptAt = new Date(now.getTime() + retryDelayMs(message.attempts));
        report.deferred.push(message.id);
      }
    }
    await em.flush(); // one message at a time: a crash never forgets a send that happened
  }
  return report;
}

/**
 * The in-process delivery worker: a pass every `intervalMs`, and one soon after each
 * {@link nudge} (routes nudge after queueing). Passes never overlap. Started by server/index.ts,
 * never by createApp, so tests drive {@link deliverDue} themselves with the time they choose.
 */
export class OutboxWorker {
  private timer: NodeJS.Timeout | null = null;
  private nudgeTimer: NodeJS.Timeout | null = null;
  /** Passes run one after another on this chain. */
  private chain: Promise<unknown> = Promise.resolve();

  constructor(
    private readonly options: {
      orm: MikroORM;
      sender: MailSender | null;
      from: string;
      intervalMs: number;
      logger?: Logger;
      /** Extra work for each pass (due-date reminders), run before delivery. */
      beforePass?: (em: EntityManager, now: Date) => Promise<void>;
    },
  ) {}

  get started(): boolean {
    return this.timer !== null;
  }

  start(): void {
    if (this.timer) return;
    this.timer = setInterval(() => void this.pass(), this.options.intervalMs);
    this.timer.unref();
    void this.pass();
  }

  /** Ask for a pass soon (no-op unless started). */
  nudge(): void {
    if (!this.timer || this.nudgeTimer) return;
    this.nudgeTimer = setTimeout(() => {
      this.nudgeTimer = null;
      void this.pass();
    }, 50);
    this.nudgeTimer.unref();
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    if (this.nudgeTimer) clearTimeout(this.nudgeTimer);
    this.timer = null;
    this.nudgeTimer = null;
    await this.chain;
  }

  /** One pass at `now`: reminders, then delivery of what is due. Calls queue behind each other, never overlap. */
  deliverDue(now: Date = new Date()): Promise<DeliveryReport> {
    const run = this.chain.then(async () => {
      const em = this.options.orm.em.fork();
      await this.options.beforePass?.(em, now);
      if (!this.options.sender) return { sent: [], deferred: [], failed: [] };
      return deliverDue(em, this.options.sender, this.options.from, now);
    });
    this.chain = run.catch(() => undefined);
    return run;
  }

  private async pass(): Promise<void> {
    try {
      const report = await this.deliverDue(new Date());
      const log = this.options.logger;
      if (log && report.sent.length + report.deferred.length + report.failed.length > 0) {
        log.info({ sent: report.sent.length, deferred: report.deferred.length, failed: report.failed.length }, 'mail outbox pass');
      }
    } catch (err) {
      this.options.logger?.error({ err }, 'mail outbox pass failed');
    }
  }
}

export function presentOutboxMessage(m: OutboxMessage): OutboxMessageDto {
  return {
    id: m.id,
    projectId: m.project?.id ?? null,
    purpose: m.purpose,
    to: m.to,
    subject: m.subject,
    attachments: m.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, size: a.size })),
    status: m.status,
    attempts: m.attempts,
    nextAttemptAt: m.nextAttemptAt ? m.nextAttemptAt.toISOString() : null,
    lastError: m.lastError,
    sentAt: m.sentAt ? m.sentAt.toISOString() : null,
    createdAt: m.createdAt.toISOString(),
  };
}
