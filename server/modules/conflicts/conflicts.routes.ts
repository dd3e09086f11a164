import type { EntityManager } from '@mikro-orm/sqlite';
import type { ConflictDto, ConflictEventDto, ConflictRowDto } from '@shared/api';
import { conflictMoveProblem, isClosedConflictStatus } from '@shared/conflicts';
import {
  conflictAssignmentSchema,
  conflictCommentSchema,
  conflictDetailsSchema,
  conflictListQuerySchema,
  conflictStatusSchema,
} from '@shared/schemas/conflict';
import type { AppConfig } from '../../config';
import { AppError, badRequest, forbidden, notFound } from '../../errors';
import { updateAudited } from '../../http/audited';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import type { MailRuntime } from '../mail/mail-runtime';
import { ProjectMember } from '../projects/project-member.entity';
import type { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { queueAssignmentMail } from './conflict-mail';
import { presentConflict } from './conflict.presenter';
import { listConflictRows } from './conflict-rows';
import { ConflictEvent } from './conflict-event.entity';
import { Conflict } from './conflict.entity';

async function findConflict(em: EntityManager, project: Project, params: Record<string, string>): Promise<Conflict> {
  const conflict = await em.findOne(Conflict, { id: idOf(params, 'conflictId', 'Conflict'), project }, { populate: ['bore', 'line', 'assignee'] });
  if (!conflict) throw notFound('Conflict');
  return conflict;
}

function presentEvent(e: ConflictEvent, conflictId: number): ConflictEventDto {
  return {
    id: e.id,
    conflictId,
    kind: e.kind,
    note: e.note,
    data: e.data,
    byId: e.by?.id ?? null,
    byName: e.by?.name ?? null,
    at: e.createdAt.toISOString(),
  };
}

/** `2027-03-04` → midnight UTC of that day; a full date-time as given. */
const toDate = (v: string | null | undefined): Date | null | undefined => (v == null ? v : new Date(v.length === 10 ? `${v}T00:00:00.000Z` : v));
const sameTime = (a: Date | null, b: Date | null) => (a?.getTime() ?? null) === (b?.getTime() ?? null);

/**
 * The conflict register of a project: the list (SPEC §8 rows, filtered), one row, status moves
 * with a reason (rules in shared/conflicts.ts), assignment with a mail to the assignee, the
 * working fields, comments and the full history.
 */
export function conflictRoutes(registry: RouteMeta[], config: AppConfig, mail: MailRuntime | null = null): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/conflicts', registry, config);

  api.get('/', { access: 'project.read', query: conflictListQuerySchema }, async ({ em, project, query }): Promise<ConflictRowDto[]> => listConflictRows(em, project, query));

  api.get('/:conflictId', { access: 'project.read' }, async ({ em, project, params }): Promise<ConflictRowDto> => {
    const [row] = await listConflictRows(em, project, {}, [idOf(params, 'conflictId', 'Conflict')]);
    if (!row) throw notFound('Conflict');
    return row;
  });

  api.patch('/:conflictId/status', { access: 'conflict.status', body: conflictStatusSchema }, async ({ em, project, user, params, body }) => {
    const conflict = await findConflict(em, project, params);
    const from = conflict.status;
    if (body.version === conflict.version) {
      const problem = conflictMoveProblem(from, body.status, user.role);
      if (problem) throw problem.kind === 'role' ? forbidden(problem.message) : new AppError(409, 'invalid_move', problem.message);
    }
    return updateAudited(
      { em, project, user, entity: 'conflict' },
      conflict,
      body.version,
      (c, tem) => {
        c.status = body.status;
        c.statusSetByPerson = true;
        const closing = isClosedConflictStatus(body.status);
        c.closedAt = closing ? (c.closedAt ?? new Date()) : null;
        if (body.resolutionNote !== undefined) c.resolutionNote = body.resolutionNote || null;
        else if (closing && !c.resolutionNote) c.resolutionNote = body.reason;
        tem.persist(new ConflictEvent(c, 'status', body.reason, { from, to: body.status }, tem.getReference(User, user.id)));
      },
      presentConflict,
      'status',
    );
  });

  api.patch('/:conflictId/assignment', { access: 'conflict.assign', body: conflictAssignmentSchema }, async ({ em, project, user, params, body }): Promise<ConflictDto> => {
    const conflict = await findConflict(em, project, params);
    let assignee: User | null = null;
    if (body.assigneeId !== null) {
      assignee = await em.findOne(User, body.assigneeId);
      const member = assignee && (assignee.role === 'admin' || (await em.count(ProjectMember, { project, user: assignee })) > 0);
      if (!assignee || !assignee.active || !member) throw badRequest('The assignee must be an active member of this project.', [{ path: 'assigneeId', message: 'is not an active member of this project' }]);
    }
    const dueDate = toDate(body.dueDate) ?? null;
    const before = { assigneeId: conflict.assignee?.id ?? null, assigneeName: conflict.assignee?.name ?? null, dueDate: conflict.dueDate?.toISOString() ?? null };
    const newAssignee = assignee !== null && assignee.id !== before.assigneeId;
    const dueChanged = !sameTime(conflict.dueDate, dueDate);
    const dto = await updateAudited(
      { em, project, user, entity: 'conflict' },
      conflict,
      body.version,
      async (c, tem) => {
        c.assignee = assignee ? tem.getReference(User, assignee.id) : null;
        c.dueDate = dueDate;
        if (!newAssignee && !dueChanged && before.assigneeId === (assignee?.id ?? null)) return;
        const after = { assigneeId: assignee?.id ?? null, assigneeName: assignee?.name ?? null, dueDate: dueDate?.toISOString() ?? null };
        const note = assignee
          ? `Assigned to ${assignee.name}${dueDate ? `, due ${dueDate.toISOString().slice(0, 10)}` : ', no due date'}.`
          : 'Assignment removed.';
        tem.persist(new ConflictEvent(c, 'assignment', note, { before, after }, tem.getReference(User, user.id)));
        // Tell the assignee (not when people assign themselves): a new assignment, or a moved due date.
        if (assignee && assignee.id !== user.id && (newAssignee || dueChanged)) {
          await queueAssignmentMail(tem, { project, conflict: c, assignee, by: user, change: newAssignee ? 'assigned' : 'due_changed', publicUrl: config.mail.publicUrl });
        }
      },
      presentConflict,
      'assign',
    );
    mail?.nudge();
    return dto;
  });

  api.patch('/:conflictId', { access: 'conflict.status', body: conflictDetailsSchema }, async ({ em, project, user, params, body }) => {
    const conflict = await findConflict(em, project, params);
    const { version, ...fields } = body;
    return updateAudited(
      { em, project, user, entity: 'conflict' },
      conflict,
      version,
      (c, tem) => {
        const changes: Record<string, { before: unknown; after: unknown }> = {};
        const setText = (key: 'responsibleParty' | 'resolutionNote' | 'notes', v: string | null | undefined) => {
          if (v === undefined) return;
          const next = v || null;
          if ((c[key] ?? null) !== next) changes[key] = { before: c[key] ?? null, after: next };
          c[key] = next;
        };
        const setDate = (key: 'ownerNotifiedAt' | 'answerDueAt', v: string | null | undefined) => {
          const next = toDate(v);
          if (next === undefined) return;
          if (!sameTime(c[key], next)) changes[key] = { before: c[key]?.toISOString() ?? null, after: next?.toISOString() ?? null };
          c[key] = next;
        };
        setText('responsibleParty', fields.responsibleParty);
        setText('resolutionNote', fields.resolutionNote);
        setText('notes', fields.notes);
        setDate('ownerNotifiedAt', fields.ownerNotifiedAt);
        setDate('answerDueAt', fields.answerDueAt);
        if (Object.keys(changes).length > 0) {
          tem.persist(new ConflictEvent(c, 'details', `Changed ${Object.keys(changes).join(', ')}.`, { changes }, tem.getReference(User, user.id)));
        }
      },
      presentConflict,
    );
  });

  api.post('/:conflictId/comments', { access: 'conflict.comment', body: conflictCommentSchema }, async ({ em, project, user, params, body, status }): Promise<ConflictEventDto> => {
    const conflict = await findConflict(em, project, params);
    const event = new ConflictEvent(conflict, 'comment', body.text, null, em.getReference(User, user.id));
    await em.persistAndFlush(event);
    event.by = user;
    status(201);
    return presentEvent(event, conflict.id);
  });

  api.get('/:conflictId/history', { access: 'project.read' }, async ({ em, project, params }): Promise<ConflictEventDto[]> => {
    const conflict = await findConflict(em, project, params);
    const events = await em.find(ConflictEvent, { conflict }, { populate: ['by'], orderBy: { createdAt: 'asc', id: 'asc' } });
    return events.map((e) => presentEvent(e, conflict.id));
  });

  return api;
}
