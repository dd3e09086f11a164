import type { AdminMailDto, CapturedMailDetailDto, MailOwnersResultDto, OutboxMessageDto } from '@shared/api';
import { mailOwnersSchema } from '@shared/schemas/mail';
import type { AppConfig } from '../../config';
import { conflict, notFound } from '../../errors';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import { logActivity } from '../activity/activity.service';
import { presentCaptured, presentCapturedDetail } from './capture-server';
import type { MailRuntime } from './mail-runtime';
import { presentOutboxMessage } from './outbox';
import { OutboxMessage } from './outbox-message.entity';
import { sendOwnerMail } from './owner-mail';

/** Mailing the line owners of a project their conflicts. */
export function projectMailRoutes(registry: RouteMeta[], config: AppConfig, mail: MailRuntime | null = null): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/mail', registry, config);

  api.post('/owners', { access: 'mail.send', body: mailOwnersSchema }, async ({ em, project, user, body }): Promise<MailOwnersResultDto> => {
    const result = await sendOwnerMail(em, project, user, body);
    if (result.mode === 'send') mail?.nudge();
    return result;
  });

  return api;
}

/** Admin → Mail: how mail leaves, the outbox, and the development catcher's messages. */
export function adminMailRoutes(registry: RouteMeta[], config: AppConfig, mail: MailRuntime | null = null): ApiRouter {
  const api = new ApiRouter('/api/admin/mail', registry, config);

  api.get('/', { access: 'mail.admin' }, async ({ em }): Promise<AdminMailDto> => {
    const outbox = await em.find(OutboxMessage, {}, { orderBy: { id: 'desc' }, limit: 200 });
    const conn = em.getConnection();
    const rows = await conn.execute<{ status: string; n: number }[]>('select status, count(*) as n from outbox_messages group by status');
    const counts = { queued: 0, sent: 0, failed: 0 };
    for (const r of rows) if (r.status in counts) counts[r.status as keyof typeof counts] = Number(r.n);
    const address = mail?.capture?.address;
    return {
      mode: mail?.mode ?? (config.mail.smtp ? 'smtp' : 'off'),
      from: config.mail.from,
      captureAddress: address ? `${address.host}:${address.port}` : null,
      counts,
      outbox: outbox.map(presentOutboxMessage),
      captured: (mail?.capture?.list() ?? []).slice(0, 200).map(presentCaptured),
    };
  });

  api.get('/captured/:capturedId', { access: 'mail.admin' }, ({ params }): CapturedMailDetailDto => {
    const found = mail?.capture?.get(idOf(params, 'capturedId', 'Captured message'));
    if (!found) throw notFound('Captured message');
    return presentCapturedDetail(found);
  });

  api.post('/outbox/:outboxId/retry', { access: 'mail.admin' }, async ({ em, user, params }): Promise<OutboxMessageDto> => {
    const message = await em.findOne(OutboxMessage, idOf(params, 'outboxId', 'Message'));
    if (!message) throw notFound('Message');
    if (message.status === 'sent') throw conflict('This message was sent already.');
    const before = presentOutboxMessage(message);
    message.status = 'queued';
    message.nextAttemptAt = new Date();
    logActivity(em, { project: message.project, user, entity: 'outbox', entityId: message.id, action: 'retry', before, after: presentOutboxMessage(message) });
    await em.flush();
    mail?.nudge();
    return presentOutboxMessage(message);
  });

  return api;
}
