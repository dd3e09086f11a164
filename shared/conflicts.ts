/**
 * The conflict register's rules, shared by server and client: which status moves a person may
 * make, which roles may make them, and the list filter (the same filter the list endpoint, the
 * screen and the exports apply).
 */
import type { ConflictRowDto } from './api';
import { CONFLICT_STATUS_LABELS, type ClearanceStatus, type ConflictStatus, type LineKind, type Role } from './domain';
import { can } from './permissions';

/** Statuses that close a conflict (they set its closed date). */
export const CLOSED_CONFLICT_STATUSES = ['resolved_redesign', 'resolved_relocation', 'waived', 'void'] as const satisfies readonly ConflictStatus[];

/** Statuses still needing work: the "active" list and the projects' open-conflict counts. */
export const ACTIVE_CONFLICT_STATUSES = ['open', 'in_review'] as const satisfies readonly ConflictStatus[];

export function isClosedConflictStatus(status: ConflictStatus): boolean {
  return (CLOSED_CONFLICT_STATUSES as readonly ConflictStatus[]).includes(status);
}

/**
 * The moves a person may make from each status (every move carries a reason):
 * - open and in review may go to each other or to any closing status;
 * - a closed conflict may only be reopened (back to open or in review), never moved straight
 *   from one closing status to another, so the register shows why it was reopened.
 */
export const CONFLICT_MOVES: Record<ConflictStatus, readonly ConflictStatus[]> = {
  open: ['in_review', 'resolved_redesign', 'resolved_relocation', 'waived', 'void'],
  in_review: ['open', 'resolved_redesign', 'resolved_relocation', 'waived', 'void'],
  resolved_redesign: ['open', 'in_review'],
  resolved_relocation: ['open', 'in_review'],
  waived: ['open', 'in_review'],
  void: ['open', 'in_review'],
};

/**
 * Target statuses that need more than the `conflict.status` permission. A waiver is the line
 * owner's written acceptance of less than the required clearance: the project manager (or an
 * administrator) records it, not the designer.
 */
export const CONFLICT_STATUS_ROLES: Partial<Record<ConflictStatus, readonly Role[]>> = {
  waived: ['admin', 'manager'],
};

/** Why a move is refused: the role may not make it, or the workflow does not allow it from here. */
export interface ConflictMoveProblem {
  kind: 'role' | 'workflow';
  message: string;
}

/** Why a role may not move a conflict from one status to another, or null when it may. */
export function conflictMoveProblem(from: ConflictStatus, to: ConflictStatus, role: Role): ConflictMoveProblem | null {
  if (!can(role, 'conflict.status')) return { kind: 'role', message: 'Your role does not allow changing a conflict’s status.' };
  if (from === to) return { kind: 'workflow', message: `The conflict is already “${CONFLICT_STATUS_LABELS[to]}”.` };
  if (!CONFLICT_MOVES[from].includes(to)) {
    return { kind: 'workflow', message: 'A closed conflict can only be reopened (to open or in review) before it is closed another way.' };
  }
  const roles = CONFLICT_STATUS_ROLES[to];
  if (roles && !roles.includes(role)) return { kind: 'role', message: 'Only the project manager or an administrator records a waiver.' };
  return null;
}

/** The moves a role may make from a status (empty for roles without `conflict.status`). */
export function allowedConflictMoves(from: ConflictStatus, role: Role): ConflictStatus[] {
  return CONFLICT_MOVES[from].filter((to) => conflictMoveProblem(from, to, role) === null);
}

/** Kinds of history entries, with our labels. */
export const CONFLICT_EVENT_LABELS: Record<string, string> = {
  found: 'Found by the clearance check',
  worsened: 'Worsened',
  eased: 'Eased',
  cleared: 'Cleared by the clearance check',
  failed_again: 'Failing again',
  status: 'Status changed',
  comment: 'Comment',
  assignment: 'Assignment',
  details: 'Details edited',
  owner_mailed: 'Owner e-mailed',
};

/** The list filter (all parts optional; a part with several values matches any of them). */
export interface ConflictFilter {
  status?: ConflictStatus[];
  computedStatus?: ClearanceStatus[];
  boreId?: number[];
  kind?: LineKind[];
  /** User ids, or 'none' for unassigned. */
  assignee?: (number | 'none')[];
  /** Free text: conflict number, line label, owner, bore name. */
  q?: string;
}

/** What the filter reads of a conflict: the register's rows and the export rows both have it. */
export interface FilterableConflict {
  number: string;
  status: ConflictStatus;
  computedStatus: ClearanceStatus;
  boreId: number;
  boreName: string;
  line: { kind: LineKind; label: string; owner: string };
  assigneeId: number | null;
  assigneeName: string | null;
  responsibleParty: string | null;
}

/** True when a conflict passes the filter (the one rule for the screen and the exports). */
export function matchesFilterable(row: FilterableConflict, filter: ConflictFilter): boolean {
  if (filter.status?.length && !filter.status.includes(row.status)) return false;
  if (filter.computedStatus?.length && !filter.computedStatus.includes(row.computedStatus)) return false;
  if (filter.boreId?.length && !filter.boreId.includes(row.boreId)) return false;
  if (filter.kind?.length && !filter.kind.includes(row.line.kind)) return false;
  if (filter.assignee?.length && !filter.assignee.includes(row.assigneeId ?? 'none')) return false;
  const q = filter.q?.trim().toLowerCase();
  if (q) {
    const hay = [row.number, row.line.label, row.line.owner, row.boreName, row.assigneeName ?? '', row.responsibleParty ?? ''].join(' ').toLowerCase();
    if (!hay.includes(q)) return false;
  }
  return true;
}

/** True when a register row passes the filter. */
export function matchesConflictFilter(row: ConflictRowDto, filter: ConflictFilter): boolean {
  return matchesFilterable({ ...row, boreName: row.bore.name }, filter);
}
