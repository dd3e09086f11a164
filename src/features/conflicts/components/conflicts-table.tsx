import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, sortFn_basic, tableFeatures, useTable } from '@tanstack/react-table';
import type { ConflictRowDto } from '@shared/api';
import { CLEARANCE_STATUSES, CONFLICT_STATUSES, type LinearUnit, type StationStyle } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { QualityLevelBadge } from '@/components/quality-level';
import { cn } from '@/components/ui/cn';
import { CellNote, SortableTable, type SortableColumnMeta } from '@/components/ui/sortable-table';
import { formatLength, formatOffset } from '@/lib/format';
import { ClearanceStatusBadge, ConflictStatusBadge, formatCalendarDate, isPastDate } from './conflict-status';

export { CLEARANCE_STATUS_LABELS, ClearanceStatusBadge } from './conflict-status';

export interface ConflictTableFrame {
  projectId: number;
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
}

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
  columnMeta: {} as SortableColumnMeta,
});
const helper = createColumnHelper<typeof features, ConflictRowDto>();

function stationText(r: ConflictRowDto, style: StationStyle): string {
  if (r.stationFrom == null || r.stationTo == null) return r.station == null ? '—' : formatStation(r.station, style);
  const from = formatStation(r.stationFrom, style);
  const to = formatStation(r.stationTo, style);
  return from === to ? from : `${from} – ${to}`;
}

function buildColumns(frame: ConflictTableFrame) {
  const u = UNIT_SYMBOLS[frame.unit];
  return helper.columns([
    helper.accessor('id', {
      id: 'number',
      header: 'No.',
      sortFn: 'basic',
      cell: (info) => (
        <Link to={`/projects/${frame.projectId}/conflicts/${info.getValue()}`} className="font-semibold text-brand-700 underline-offset-2 hover:underline">
          {info.row.original.number}
        </Link>
      ),
    }),
    helper.accessor((r) => r.line.label, {
      id: 'line',
      header: 'Line',
      sortFn: 'alphanumeric',
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex max-w-60 min-w-40 flex-col whitespace-normal">
            <span className="font-medium">{r.line.label}</span>
            <span className="text-xs text-ink-600">
              <KindSwatch kind={r.line.kind} />
            </span>
            <span className="text-xs text-ink-500">{r.line.owner}</span>
          </span>
        );
      },
    }),
    helper.accessor((r) => r.line.qualityLevel, { id: 'ql', header: 'QL', sortFn: 'alphanumeric', cell: (info) => <QualityLevelBadge level={info.getValue()} /> }),
    helper.accessor((r) => r.bore.name, {
      id: 'bore',
      header: 'Bore / pit',
      sortFn: 'alphanumeric',
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex flex-col">
            <span>{r.bore.name}</span>
            {r.pits.map((p) => (
              <CellNote key={p.pitId}>{p.kind === 'launch' ? 'launch pit' : 'receiving pit'}</CellNote>
            ))}
          </span>
        );
      },
    }),
    helper.accessor((r) => r.station ?? undefined, {
      id: 'station',
      header: () => (
        <>
          Station<CellNote>offset, {u}</CellNote>
        </>
      ),
      sortFn: 'basic',
      sortUndefined: 'last',
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex flex-col">
            <span>{stationText(r, frame.stationStyle)}</span>
            <CellNote>{formatOffset(r.offset, r.side, frame.unit)}</CellNote>
          </span>
        );
      },
    }),
    helper.accessor((r) => r.lineTop ?? undefined, {
      id: 'top',
      header: () => (
        <>
          Top of line<CellNote>{u}, {frame.datum}</CellNote>
        </>
      ),
      sortFn: 'basic',
      sortUndefined: 'last',
      meta: { numeric: true },
      cell: (info) => formatLength(info.row.original.lineTop, frame.unit),
    }),
    helper.accessor((r) => r.margin ?? undefined, {
      id: 'clearance',
      header: () => (
        <>
          Clearance<CellNote>measured / required, {u}</CellNote>
        </>
      ),
      sortFn: 'basic',
      sortUndefined: 'last',
      meta: { numeric: true },
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex flex-col items-end">
            <span className={cn(r.clearance != null && r.clearance < 0 && 'font-semibold text-danger-700')}>{formatLength(r.clearance, frame.unit)}</span>
            <CellNote>of {formatLength(r.required, frame.unit)}</CellNote>
          </span>
        );
      },
    }),
    helper.accessor((r) => CLEARANCE_STATUSES.indexOf(r.computedStatus), {
      id: 'computed',
      header: 'Last check',
      sortFn: 'basic',
      cell: (info) => <ClearanceStatusBadge status={info.row.original.computedStatus} />,
    }),
    helper.accessor((r) => CONFLICT_STATUSES.indexOf(r.status), {
      id: 'status',
      header: 'Status',
      sortFn: 'basic',
      cell: (info) => <ConflictStatusBadge status={info.row.original.status} />,
    }),
    helper.accessor((r) => r.assigneeName ?? undefined, {
      id: 'assignee',
      header: () => (
        <>
          Assignee<CellNote>due</CellNote>
        </>
      ),
      sortFn: 'alphanumeric',
      sortUndefined: 'last',
      cell: (info) => {
        const r = info.row.original;
        const late = isPastDate(r.dueDate) && (r.status === 'open' || r.status === 'in_review');
        return (
          <span className="inline-flex flex-col">
            <span>{r.assigneeName ?? <span className="text-ink-500">Unassigned</span>}</span>
            {r.dueDate && <CellNote>{late ? <span className="font-semibold text-danger-700">overdue {formatCalendarDate(r.dueDate)}</span> : formatCalendarDate(r.dueDate)}</CellNote>}
          </span>
        );
      },
    }),
    helper.accessor((r) => r.ownerNotifiedAt ?? undefined, {
      id: 'owner',
      header: () => (
        <>
          Owner told<CellNote>answer due</CellNote>
        </>
      ),
      sortFn: 'alphanumeric',
      sortUndefined: 'last',
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex flex-col">
            <span>{formatCalendarDate(r.ownerNotifiedAt)}</span>
            {r.answerDueAt && <CellNote>{formatCalendarDate(r.answerDueAt)}</CellNote>}
          </span>
        );
      },
    }),
    helper.accessor('createdAt', { id: 'found', header: 'Found', sortFn: 'alphanumeric', cell: (info) => formatCalendarDate(info.getValue()) }),
  ]);
}

/** The conflict register: every column sorts (the rows come already filtered). */
export function ConflictsTable({ rows, frame }: { rows: ConflictRowDto[]; frame: ConflictTableFrame }) {
  const columns = useMemo(() => buildColumns(frame), [frame]);
  const table = useTable({
    features,
    columns,
    data: rows,
    getRowId: (r) => String(r.id),
    initialState: { sorting: [{ id: 'computed', desc: false }] },
    enableSortingRemoval: false,
  });
  return <SortableTable table={table} label="Conflicts" caption="Conflicts; column headers sort" />;
}
