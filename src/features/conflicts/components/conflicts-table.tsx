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
});
const helper = createColumnHelper<typeof features, ConflictRowDto>();

function Sub({ children }: { children: React.ReactNode }) {
  return <span className="block text-xs font-normal text-ink-500 normal-case">{children}</span>;
}

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
              <Sub key={p.pitId}>{p.kind === 'launch' ? 'launch pit' : 'receiving pit'}</Sub>
            ))}
          </span>
        );
      },
    }),
    helper.accessor((r) => r.station ?? undefined, {
      id: 'station',
      header: () => (
        <>
          Station<Sub>offset, {u}</Sub>
        </>
      ),
      sortFn: 'basic',
      sortUndefined: 'last',
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex flex-col">
            <span>{stationText(r, frame.stationStyle)}</span>
            <Sub>{formatOffset(r.offset, r.side, frame.unit)}</Sub>
          </span>
        );
      },
    }),
    helper.accessor((r) => r.lineTop ?? undefined, {
      id: 'top',
      header: () => (
        <>
          Top of line<Sub>{u}, {frame.datum}</Sub>
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
          Clearance<Sub>measured / required, {u}</Sub>
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
            <Sub>of {formatLength(r.required, frame.unit)}</Sub>
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
          Assignee<Sub>due</Sub>
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
            {r.dueDate && <Sub>{late ? <span className="font-semibold text-danger-700">overdue {formatCalendarDate(r.dueDate)}</span> : formatCalendarDate(r.dueDate)}</Sub>}
          </span>
        );
      },
    }),
    helper.accessor((r) => r.ownerNotifiedAt ?? undefined, {
      id: 'owner',
      header: () => (
        <>
          Owner told<Sub>answer due</Sub>
        </>
      ),
      sortFn: 'alphanumeric',
      sortUndefined: 'last',
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex flex-col">
            <span>{formatCalendarDate(r.ownerNotifiedAt)}</span>
            {r.answerDueAt && <Sub>{formatCalendarDate(r.answerDueAt)}</Sub>}
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
  const shown = table.getRowModel().rows;
  return (
    <div className="relative overflow-x-auto rounded-lg border border-ink-200 bg-white" tabIndex={0} role="region" aria-label="Conflicts">
      <table className="min-w-full border-collapse text-sm">
        <caption className="sr-only">Conflicts; column headers sort</caption>
        <thead className="bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header, i) => {
                const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className={cn('border-b border-ink-200 px-3 py-2 align-bottom whitespace-nowrap', numeric && 'text-right', i === 0 && 'sticky left-0 z-10 bg-ink-50')}
                  >
                    <button
                      type="button"
                      onClick={header.column.getToggleSortingHandler()}
                      className={cn('inline-flex min-h-8 items-end gap-1 text-left uppercase hover:text-ink-900', numeric && 'flex-row-reverse text-right')}
                    >
                      <span>
                        <table.FlexRender header={header} />
                      </span>
                      <span aria-hidden className="text-ink-400">
                        {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                      </span>
                    </button>
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {shown.map((row) => (
            <tr key={row.id} className="group border-b border-ink-100 last:border-b-0">
              {row.getAllCells().map((cell, i) => {
                const numeric = (cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                return i === 0 ? (
                  <th key={cell.id} scope="row" className="sticky left-0 z-10 bg-white px-3 py-2.5 text-left align-top whitespace-nowrap group-hover:bg-ink-50">
                    <table.FlexRender cell={cell} />
                  </th>
                ) : (
                  <td key={cell.id} className={cn('px-3 py-2.5 align-top whitespace-nowrap group-hover:bg-ink-50', numeric && 'text-right tabular')}>
                    <table.FlexRender cell={cell} />
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
