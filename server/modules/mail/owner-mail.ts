import type { EntityManager } from '@mikro-orm/sqlite';
import type { ConflictRowDto, MailOwnersResultDto, OwnerMailPlanDto } from '@shared/api';
import { ACTIVE_CONFLICT_STATUSES } from '@shared/conflicts';
import { CONFLICT_STATUS_LABELS, LINE_KIND_LABELS, UNIT_LABELS } from '@shared/domain';
import type { MailOwnersInput } from '@shared/schemas/mail';
import { badRequest } from '../../errors';
import { logActivity } from '../activity/activity.service';
import { ConflictEvent } from '../conflicts/conflict-event.entity';
import { Conflict } from '../conflicts/conflict.entity';
import { loadConflictRegister } from '../conflicts/conflict-rows';
import { conflictCsv, conflictList } from '../exports/conflict-list';
import { exportFrame, filterNames } from '../exports/export-data';
import { slug } from '../exports/export-header';
import type { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { MAIL_CAUTION, textDateTime, textLength, textStation } from './format';
import { enqueueMail } from './outbox';

interface Planned extends Omit<OwnerMailPlanDto, 'outboxId'> {
  rows: ConflictRowDto[];
  /** The header's Rows line of the attachment: the filter in words, with the contact. */
  info: [string, string];
}

const contactOf = (row: ConflictRowDto) => row.line.contactEmail?.trim().toLowerCase() ?? '';

/**
 * Who gets what: the conflicts in the chosen statuses grouped by their line's contact address
 * (one message per address, covering every owner that address answers for). Lines without a
 * contact are reported as skipped, by owner. The rows are the register's (`loadConflictRegister`),
 * and each attachment is the conflict list CSV of the exports for that status filter and contact,
 * stating the register's last check.
 */
export async function planOwnerMail(
  em: EntityManager,
  project: Project,
  input: MailOwnersInput,
  now: Date,
): Promise<{ plans: Planned[]; skipped: MailOwnersResultDto['skipped']; checkedAt: Date | null }> {
  const statuses = input.statuses ?? [...ACTIVE_CONFLICT_STATUSES];
  const register = await loadConflictRegister(em, project);
  const names = filterNames(register.rows);
  const { rows } = conflictList(register, { status: statuses }, names);
  const byContact = new Map<string, ConflictRowDto[]>();
  const noContact = new Map<string, ConflictRowDto[]>();
  for (const row of rows) {
    const to = contactOf(row);
    if (to) byContact.set(to, [...(byContact.get(to) ?? []), row]);
    else noContact.set(row.line.owner, [...(noContact.get(row.line.owner) ?? []), row]);
  }
  const wanted = input.contacts?.map((c) => c.trim().toLowerCase());
  if (wanted) {
    const errors = wanted.flatMap((c, i) => (byContact.has(c) ? [] : [{ path: `contacts.${i}`, message: `no conflict in the chosen statuses is on a line with the contact ${c}` }]));
    if (errors.length > 0) throw badRequest('Some contacts have no conflicts to send.', errors);
  }
  const day = now.toISOString().slice(0, 10);
  const plans: Planned[] = [...byContact.entries()]
    .filter(([to]) => !wanted || wanted.includes(to))
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([to, list]) => {
      const { info } = conflictList(register, { status: statuses }, names, { keep: (r) => contactOf(r) === to, words: `owner contact = ${to}` });
      const owners = [...new Set(list.map((r) => r.line.owner))].sort();
      const lines = [...new Map(list.map((r) => [r.line.id, { id: r.line.id, label: r.line.label }])).values()].sort((a, b) => a.label.localeCompare(b.label));
      return {
        to,
        owners,
        lines,
        conflicts: list.map((r) => ({ id: r.id, number: r.number })),
        subject: `${project.name}: ${list.length} conflict${list.length === 1 ? '' : 's'} with ${owners.join(', ')} lines`,
        attachmentName: `conflicts-${slug(project.name)}-${slug(owners[0] ?? to)}-${day}.csv`,
        rows: list,
        info,
      };
    });
  const skipped = [...noContact.entries()].map(([owner, list]) => ({
    owner,
    lines: [...new Set(list.map((r) => r.line.label))],
    conflicts: list.map((r) => r.number),
    reason: 'No contact e-mail on the line. Add one under Lines to include this owner.',
  }));
  return { plans, skipped, checkedAt: register.checkedAt };
}

function messageText(project: Project, plan: Planned, sender: User, note: string | null | undefined, checkedAt: Date | null): string {
  const u = project.unit;
  const lines = plan.rows.map(
    (r) =>
      `  ${r.number}  ${r.line.label} (${LINE_KIND_LABELS[r.line.kind]}) × ${r.bore.name}${r.pits.length ? ' and pit' : ''}, ` +
      `station ${textStation(r.station, project.stationStyle)}: clearance ${textLength(r.clearance, u)}, required ${textLength(r.required, u)}; ${CONFLICT_STATUS_LABELS[r.status]}`,
  );
  return [
    'Hello,',
    '',
    ...(note ? [note, ''] : []),
    `The proposed work on ${project.name} (${project.client}) comes closer than the required clearance to lines of ${plan.owners.join(', ')} ${plan.rows.length === 1 ? 'in one place' : `in ${plan.rows.length} places`}.`,
    `The attached list (${plan.attachmentName}) gives each conflict with its station and offset, top of line, required and measured clearance, and where it stands:`,
    '',
    ...lines,
    '',
    `Grid ${project.crsCode}; lengths in ${UNIT_LABELS[u]}; elevations ${project.verticalDatum}; last clearance check ${textDateTime(checkedAt)}.`,
    '',
    `Please reply to ${sender.name} <${sender.email}> with your requirements, a waiver, or comments.`,
    '',
    MAIL_CAUTION,
    '',
    `— ${sender.name}, sent from Threadline`,
  ].join('\n');
}

/**
 * Queue one message per recipient with the list attached (CSV), set each conflict's "owner
 * told" date where unset and write an `owner_mailed` history entry, all in one transaction.
 */
export async function sendOwnerMail(em: EntityManager, project: Project, user: User, input: MailOwnersInput, now = new Date()): Promise<MailOwnersResultDto> {
  const { plans, skipped, checkedAt } = await planOwnerMail(em, project, input, now);
  if (input.mode === 'preview') {
    return { mode: 'preview', recipients: plans.map(({ rows: _rows, info: _info, ...p }) => ({ ...p, outboxId: null })), skipped };
  }
  const frame = exportFrame(project, user, { basis: 'register', at: checkedAt }, now);
  if (plans.length === 0) throw badRequest('There is nobody to send to: no conflict in the chosen statuses is on a line with a contact e-mail.');
  return em.transactional(async (tem) => {
    const recipients: OwnerMailPlanDto[] = [];
    for (const plan of plans) {
      const message = await enqueueMail(tem, {
        project,
        purpose: 'owner_conflicts',
        to: plan.to,
        subject: plan.subject,
        text: messageText(project, plan, user, input.message, checkedAt),
        replyTo: user.email,
        createdBy: user,
        attachments: [{ filename: plan.attachmentName, contentType: 'text/csv; charset=utf-8', content: Buffer.from(conflictCsv(frame, plan.rows, plan.info), 'utf8') }],
      });
      await tem.flush();
      const conflicts = await tem.find(Conflict, { id: { $in: plan.rows.map((r) => r.id) }, project });
      for (const c of conflicts) {
        if (!c.ownerNotifiedAt) c.ownerNotifiedAt = now;
        tem.persist(new ConflictEvent(c, 'owner_mailed', `Conflict list e-mailed to ${plan.to}.`, { to: plan.to, outboxId: message!.id, attachment: plan.attachmentName }, tem.getReference(User, user.id)));
      }
      const { rows: _rows, info: _info, ...dto } = plan;
      recipients.push({ ...dto, outboxId: message!.id });
    }
    logActivity(tem, {
      project,
      user,
      entity: 'mail',
      entityId: null,
      action: 'owners',
      before: null,
      after: { recipients: recipients.map((r) => r.to), conflicts: recipients.flatMap((r) => r.conflicts.map((c) => c.number)) },
    });
    await tem.flush();
    return { mode: 'send' as const, recipients, skipped };
  });
}
