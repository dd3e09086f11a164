import { CONFLICT_STATUS_LABELS, type ClearanceStatus } from '@shared/domain';
import type { ConflictDto } from '@shared/api';
import { DataTable, type Column } from '@/components/ui/data-table';
import { Badge } from '@/components/ui/states';
import { formatDate } from '@/lib/format';

/** Our names for the computed status of a line against a bore, worst first. */
export const CLEARANCE_STATUS_LABELS: Record<ClearanceStatus, string> = {
  overlap: 'Overlap',
  conflict: 'Short of requirement',
  marginal: 'Within allowance',
  unverified: 'Unverified',
  clear: 'Clear',
};

const TONES: Record<ClearanceStatus, string> = {
  overlap: 'bg-danger-600 text-white',
  conflict: 'bg-danger-100 text-danger-800',
  marginal: 'bg-caution-100 text-caution-800',
  unverified: 'bg-ink-200 text-ink-800',
  clear: 'bg-ok-100 text-ok-700',
};

export function ClearanceStatusBadge({ status }: { status: ClearanceStatus }) {
  return <Badge className={TONES[status]}>{CLEARANCE_STATUS_LABELS[status]}</Badge>;
}

/** The conflict register, read-only for now. */
export function ConflictsTable({ conflicts, lineLabel, boreName }: { conflicts: ConflictDto[]; lineLabel: (id: number) => string; boreName: (id: number) => string }) {
  const columns: Column<ConflictDto>[] = [
    { key: 'id', header: 'No.', cell: (c) => `C-${c.id}` },
    { key: 'line', header: 'Line', cell: (c) => lineLabel(c.lineId) },
    { key: 'bore', header: 'Bore', cell: (c) => boreName(c.boreId) },
    { key: 'computed', header: 'Last check', cell: (c) => <ClearanceStatusBadge status={c.computedStatus} /> },
    { key: 'status', header: 'Register status', cell: (c) => CONFLICT_STATUS_LABELS[c.status] },
    { key: 'due', header: 'Answer due', cell: (c) => formatDate(c.dueDate) },
    { key: 'found', header: 'Found', cell: (c) => formatDate(c.createdAt) },
  ];
  return <DataTable caption="Conflicts" columns={columns} rows={conflicts} rowKey={(c) => c.id} />;
}
