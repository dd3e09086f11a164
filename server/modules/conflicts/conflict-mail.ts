import type { EntityManager } from '@mikro-orm/sqlite';
import { ACTIVE_CONFLICT_STATUSES } from '@shared/conflicts';
import { CONFLICT_STATUS_LABELS, LINE_KIND_LABELS, UNIT_LABELS } from '@shared/domain';
import { textDate, textLength, textOffset, textStation, MAIL_CAUTION } from '../mail/format';
import { enqueueMail } from '../mail/outbox';
import type { OutboxMessage } from '../mail/outbox-message.entity';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';
import { Conflict } from './conflict.entity';
import { conflictNumber, presentConflictRow } from './conflict-rows';

/** A few lines describing a conflict (bore, line and user must be loaded). */
export function conflictSummary(c: Conflict, project: Project): string[] {
  const row = presentConflictRow(c, []);
  const u = project.unit;
  return [
    `${row.number}: ${row.line.label} (${LINE_KIND_LABELS[row.line.kind]}, ${row.line.owner}) against ${row.bore.name}`,
    `Station ${textStation(row.station, project.stationStyle)}, offset ${textOffset(row.offset, row.side, u)}`,
    `Clearance ${textLength(row.clearance, u)}, required ${textLength(row.required, u)}; top of line ${textLength(row.lineTop, u)} ${project.verticalDatum}`,
    ...row.pits.map((p) => `${p.kind === 'launch' ? 'Launch' : 'Receiving'} pit: ${p.enters ? 'the line enters the footprint' : `the line is ${textLength(p.planGap, u)} from the footprint`}`),
    `Register status: ${CONFLICT_STATUS_LABELS[row.status]}${row.dueDate ? `, due ${textDate(row.dueDate)}` : ''}`,
  ];
}

function link(publicUrl: string | null, project: Project, c: Conflict): string[] {
  return publicUrl ? ['', `Open it in Threadline: ${publicUrl}/projects/${project.id}/conflicts/${c.id}`] : [];
}

/**
 * Tell an assignee, through the outbox, that a conflict is theirs or that its due date moved.
 * Queued in the caller's transaction.
 */
export async function queueAssignmentMail(
  em: EntityManager,
  a: { project: Project; conflict: Conflict; assignee: User; by: User; change: 'assigned' | 'due_changed'; publicUrl: string | null },
): Promise<OutboxMessage | null> {
  const { project, conflict, assignee, by } = a;
  const number = conflictNumber(conflict.id);
  const due = conflict.dueDate ? textDate(conflict.dueDate) : null;
  const subject =
    a.change === 'assigned'
      ? `${number} assigned to you: ${conflict.line.label} × ${conflict.bore.name}${due ? `, due ${due}` : ''}`
      : `${number}: due date ${due ? `now ${due}` : 'removed'} (${conflict.line.label} × ${conflict.bore.name})`;
  const text = [
    `Hello ${assignee.name},`,
    '',
    a.change === 'assigned'
      ? `${by.name} assigned you a conflict on ${project.name}${due ? `, due ${due}` : ''}.`
      : `${by.name} ${due ? `set the due date of this conflict to ${due}` : 'removed the due date of this conflict'} on ${project.name}.`,
    '',
    ...conflictSummary(conflict, project),
    ...link(a.publicUrl, project, conflict),
    '',
    `Lengths in ${UNIT_LABELS[project.unit]}; grid ${project.crsCode}; elevations ${project.verticalDatum}.`,
    '',
    MAIL_CAUTION,
  ].join('\n');
  return enqueueMail(em, { project, purpose: a.change === 'assigned' ? 'assignment' : 'due_date', to: assignee.email, subject, text, replyTo: by.email, createdBy: by });
}

/**
 * Queue one reminder per assigned, still-active conflict whose due date is within a day of
 * `now` (or past): once per due date (a new due date gets a new reminder). Run by the
 * delivery worker before each pass.
 */
export async function queueDueReminders(em: EntityManager, now: Date, publicUrl: string | null): Promise<number> {
  const horizon = new Date(now.getTime() + 24 * 3600_000);
  const due = await em.find(
    Conflict,
    { assignee: { active: true }, dueDate: { $ne: null, $lte: horizon }, status: { $in: [...ACTIVE_CONFLICT_STATUSES] } },
    { populate: ['project', 'bore', 'line', 'assignee'] },
  );
  let queued = 0;
  for (const c of due) {
    const assignee = c.assignee!;
    const date = textDate(c.dueDate);
    const overdue = c.dueDate!.getTime() < now.getTime() - 24 * 3600_000;
    const message = await enqueueMail(em, {
      project: c.project,
      purpose: 'due_reminder',
      to: assignee.email,
      subject: `${overdue ? 'Overdue' : 'Due'} ${date}: ${conflictNumber(c.id)} ${c.line.label} × ${c.bore.name}`,
      text: [
        `Hello ${assignee.name},`,
        '',
        `This conflict on ${c.project.name} is assigned to you and ${overdue ? 'was' : 'is'} due ${date}.`,
        '',
        ...conflictSummary(c, c.project),
        ...link(publicUrl, c.project, c),
        '',
        MAIL_CAUTION,
      ].join('\n'),
      dedupeKey: `due:${c.id}:${date}`,
    });
    if (message) queued++;
  }
  if (queued > 0) await em.flush();
  return queued;
}
