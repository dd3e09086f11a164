import { useState } from 'react';
import type { AdminMailDto, CapturedMailDto, OutboxMessageDto } from '@shared/api';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { DataTable, type Column } from '@/components/ui/data-table';
import { Badge, EmptyState, Loading, Panel } from '@/components/ui/states';
import { formatDateTime } from '@/lib/format';
import { useCapturedMail } from '../api/get-captured-mail';
import { useRetryOutbox } from '../api/retry-outbox';

const STATUS_TONES: Record<OutboxMessageDto['status'], string> = {
  queued: 'bg-caution-100 text-caution-800',
  sent: 'bg-ok-100 text-ok-700',
  failed: 'bg-danger-100 text-danger-800',
};

const PURPOSES: Record<string, string> = {
  owner_conflicts: 'Conflicts to owner',
  assignment: 'Assignment',
  due_date: 'Due date changed',
  due_reminder: 'Due reminder',
};

function bytes(n: number): string {
  return n < 1024 ? `${n} B` : `${(n / 1024).toFixed(1)} kB`;
}

/** How mail leaves: real server, the development catcher, or nowhere yet. */
export function MailModeNote({ data }: { data: AdminMailDto }) {
  return (
    <p className="text-sm text-ink-700">
      {data.mode === 'smtp' && <>Mail goes to the SMTP server set in the environment, from {data.from}.</>}
      {data.mode === 'capture' && (
        <>
          Development mode: every message goes to Threadline’s own mail catcher on {data.captureAddress} and nowhere else. Set SMTP_URL (or SMTP_HOST…) to send
          real mail.
        </>
      )}
      {data.mode === 'off' && <>No mail server is set (SMTP_URL or SMTP_HOST): messages wait in the outbox and leave once one is configured.</>}
    </p>
  );
}

export function OutboxTable({ messages }: { messages: OutboxMessageDto[] }) {
  const retry = useRetryOutbox();
  const columns: Column<OutboxMessageDto>[] = [
    { key: 'id', header: 'No.', cell: (m) => `#${m.id}` },
    { key: 'status', header: 'Status', cell: (m) => <Badge className={STATUS_TONES[m.status]}>{m.status}</Badge> },
    { key: 'to', header: 'To', cell: (m) => m.to },
    { key: 'subject', header: 'Subject', wrap: true, cell: (m) => m.subject },
    { key: 'purpose', header: 'For', cell: (m) => PURPOSES[m.purpose] ?? m.purpose },
    { key: 'att', header: 'Attachments', cell: (m) => m.attachments.map((a) => `${a.filename} (${bytes(a.size)})`).join(', ') || '—' },
    { key: 'attempts', header: 'Attempts', numeric: true, cell: (m) => m.attempts },
    {
      key: 'when',
      header: 'Sent / next try',
      cell: (m) => (m.status === 'sent' ? formatDateTime(m.sentAt) : m.nextAttemptAt ? `next ${formatDateTime(m.nextAttemptAt)}` : '—'),
    },
    { key: 'error', header: 'Last error', wrap: true, cell: (m) => m.lastError ?? '—' },
    {
      key: 'actions',
      header: <span className="sr-only">Actions</span>,
      cell: (m) =>
        m.status === 'failed' ? (
          <Button size="sm" variant="secondary" busy={retry.isPending && retry.variables === m.id} onClick={() => retry.mutate(m.id)}>
            Send again
          </Button>
        ) : null,
    },
  ];
  return (
    <>
      {retry.error && <ProblemAlert error={retry.error} />}
      <DataTable caption="Outbox" columns={columns} rows={messages} rowKey={(m) => m.id} />
    </>
  );
}

function CapturedDetail({ id }: { id: number }) {
  const detail = useCapturedMail(id);
  if (detail.isPending) return <Loading label="Opening message…" />;
  if (detail.isError) return <ProblemAlert error={detail.error} />;
  return <pre className="mt-2 max-h-96 overflow-auto rounded-md bg-ink-50 p-3 text-xs whitespace-pre-wrap">{detail.data.text ?? '(no text part)'}</pre>;
}

export function CapturedList({ messages }: { messages: CapturedMailDto[] }) {
  const [open, setOpen] = useState<number | null>(null);
  if (messages.length === 0) {
    return (
      <EmptyState title="No messages caught yet">
        <p>Messages the product sends (to owners, assignees) appear here once the outbox has delivered them.</p>
      </EmptyState>
    );
  }
  return (
    <ul className="space-y-2" aria-label="Captured messages">
      {messages.map((m) => (
        <li key={m.id} className="rounded-md border border-ink-200 bg-white p-3">
          <div className="flex flex-wrap items-start justify-between gap-2">
            <div className="min-w-0">
              <p className="font-medium">{m.subject ?? '(no subject)'}</p>
              <p className="text-sm text-ink-600">
                To {m.to.join(', ') || m.envelopeTo.join(', ')} · from {m.from ?? m.envelopeFrom ?? '—'} · {formatDateTime(m.receivedAt)} · {bytes(m.size)}
              </p>
              {m.attachments.length > 0 && <p className="text-sm text-ink-600">Attached: {m.attachments.map((a) => a.filename ?? a.contentType).join(', ')}</p>}
            </div>
            <Button size="sm" variant="ghost" aria-expanded={open === m.id} onClick={() => setOpen(open === m.id ? null : m.id)}>
              {open === m.id ? 'Hide text' : 'Show text'}
            </Button>
          </div>
          {open === m.id && <CapturedDetail id={m.id} />}
        </li>
      ))}
    </ul>
  );
}

/** Admin → Mail: the mode, the outbox with counts, and (in development) the caught messages. */
export function AdminMail({ data }: { data: AdminMailDto }) {
  return (
    <div className="space-y-4">
      <MailModeNote data={data} />
      <p className="text-sm text-ink-700">
        {data.counts.queued} queued · {data.counts.sent} sent · {data.counts.failed} refused by the server. Messages wait in the outbox until the mail server
        accepts them; failed attempts are retried after 30 s, then 1, 2, 4… minutes, at most an hour apart.
      </p>
      {data.mode === 'capture' && (
        <Panel title="Caught by the development mail server">
          <CapturedList messages={data.captured} />
        </Panel>
      )}
      <Panel title="Outbox">
        {data.outbox.length === 0 ? <p className="text-sm text-ink-600">No message has been sent yet.</p> : <OutboxTable messages={data.outbox} />}
      </Panel>
    </div>
  );
}
