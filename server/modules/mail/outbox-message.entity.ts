import { Entity, Enum, Index, ManyToOne, Property, Unique, DateTimeType } from '@mikro-orm/core';
import { BaseEntity } from '../base.entity';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

export const OUTBOX_STATUSES = ['queued', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];

/** An attachment kept with its message (base64 in the row: lists and sheets, not photo archives). */
export interface StoredAttachment {
  filename: string;
  contentType: string;
  size: number;
  base64: string;
}

/**
 * A message waiting for, or accepted by, the SMTP server. Every message the product sends is
 * written here first, in the transaction of the change that caused it; the delivery worker
 * sends due messages and retries with exponential backoff, so nothing is lost while mail is down.
 * `failed` is a permanent rejection (an SMTP 5xx reply); an administrator can queue it again.
 */
@Entity({ tableName: 'outbox_messages' })
@Index({ properties: ['status', 'nextAttemptAt'] })
export class OutboxMessage extends BaseEntity {
  @ManyToOne({ entity: () => Project, nullable: true, deleteRule: 'set null' })
  project: Project | null = null;

  /** What the message is for: `owner_conflicts`, `assignment`, `due_reminder`. */
  @Property({ type: 'string', length: 40 })
  purpose: string;

  /** Recipient address(es), comma separated. */
  @Property({ type: 'text', fieldName: 'to_address' })
  to: string;

  @Property({ type: 'string', length: 254, nullable: true })
  replyTo: string | null = null;

  @Property({ type: 'string', length: 300 })
  subject: string;

  @Property({ type: 'text' })
  text: string;

  @Property({ type: 'json' })
  attachments: StoredAttachment[] = [];

  @Enum({ items: () => OUTBOX_STATUSES, type: 'string' })
  status: OutboxStatus = 'queued';

  @Property({ type: 'integer' })
  attempts: number = 0;

  /** When the worker may try next (null once sent or failed for good). */
  @Property({ type: DateTimeType, nullable: true })
  nextAttemptAt: Date | null = new Date();

  @Property({ type: 'text', nullable: true })
  lastError: string | null = null;

  @Property({ type: DateTimeType, nullable: true })
  sentAt: Date | null = null;

  /** Message-ID the message was sent with. */
  @Property({ type: 'string', length: 300, nullable: true })
  messageId: string | null = null;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  createdBy: User | null = null;

  /** Set for messages that must go once only (e.g. `due:<conflictId>:<date>`): a second enqueue is skipped. */
  @Property({ type: 'string', length: 160, nullable: true })
  @Unique()
  dedupeKey: string | null = null;

  constructor(init: { purpose: string; to: string; subject: string; text: string }) {
    super();
    this.purpose = init.purpose;
    this.to = init.to;
    this.subject = init.subject;
    this.text = init.text;
  }
}
