import type { ConflictDto } from '@shared/api';
import type { Conflict } from './conflict.entity';

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
  };
}
