import type { ConflictDto } from '@shared/api';
import type { Conflict } from './conflict.entity';

const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

export function presentConflict(c: Conflict): ConflictDto {
  return {
    id: c.id,
    projectId: c.project.id,
    boreId: c.bore.id,
    lineId: c.line.id,
    computedStatus: c.computedStatus,
    figures: c.figures,
    status: c.status,
    assigneeId: c.assignee?.id ?? null,
    dueDate: c.dueDate ? c.dueDate.toISOString() : null,
    resolutionNote: c.resolutionNote ?? null,
    version: c.version,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
    checkedAt: c.checkedAt.toISOString(),
    statusSetByPerson: c.statusSetByPerson,
    responsibleParty: c.responsibleParty ?? null,
    ownerNotifiedAt: iso(c.ownerNotifiedAt),
    answerDueAt: iso(c.answerDueAt),
    closedAt: iso(c.closedAt),
    notes: c.notes ?? null,
  };
}
