import { useId, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  columnFilteringFeature,
  columnVisibilityFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_equals,
  filterFn_includesString,
  globalFilteringFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  tableFeatures,
  useTable,
  type Row,
} from '@tanstack/react-table';
import type { HoleDto } from '@shared/api';
import { HOLE_STATUSES, LINE_KIND_LABELS, QUALITY_LEVELS, type HoleStatus, type LineKind, type LinearUnit, type QualityLevel, type StationStyle } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { QualityLevelBadge } from '@/components/quality-level';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { CellNote, SortableTable, type SortableColumnMeta } from '@/components/ui/sortable-table';
import { FilterChips } from '@/components/ui/filter-chips';
import { Badge } from '@/components/ui/states';
import { formatCoordinate, formatDateTime, formatLength, formatOffset } from '@/lib/format';
import { OutboxStatusBadge } from '@/features/outbox/components/outbox-status';
import type { OutboxStatus } from '@/features/outbox/outbox-store';
import { holesCsv, type CsvFrame } from '../utils/holes-csv';
import { CLEARANCE_LABELS, HOLE_STATUS_LABELS, REFERENCE_LABELS, SOURCE_LABELS, clearanceRank, type LineClearanceSummary } from '../utils/labels';
import { ClearanceBadge, HoleStatusBadge } from './hole-status';

/** One table row: the hole with what the table shows and sorts by, worked out once. */
export interface HoleRow {
  hole: HoleDto;
  number: string;
  status: HoleStatus;
  statusOrder: number;
  lineId: number;
  lineLabel: string;
  lineKind: LineKind | null;
  // Blanks are `undefined`, not null: TanStack Table's `sortUndefined: 'last'` places only
  // undefined, so a null would sort first ascending.
  qualityLevel: QualityLevel | undefined;
  clearance: LineClearanceSummary | null;
  /** Rank of the clearance status for sorting (worst first); lines near no bore sort last. */
  clearanceOrder: number | undefined;
  ground: number | undefined;
  groundSurveyed: boolean;
  depth: number | undefined;
  top: number | undefined;
  topSource: 'surveyed' | 'ground − depth' | null;
  boreName: string | null;
  dugAt: string | undefined;
  crew: string | undefined;
  photos: number;
  /** Text the search box looks through. */
  search: string;
  /**
   * Set on a hole kept on this phone (the outbox) that the server does not have yet: it has no
   * page to open, its status is the record's, and it is left out of the CSV export.
   */
  kept?: KeptInfo;
}

/** What the register shows of a kept record: its state in the outbox, as the header's list shows it. */
export interface KeptInfo {
  clientId: string;
  status: OutboxStatus;
  /** The server's words when it refused the hole. */
  reason?: string;
  /** The label of the new unidentified line the hole was logged on, if so. */
  newLine: string | null;
  /** A photo the server refused, with its reason. */
  photoProblem?: string;
}

/** The status chip's and filter's value for kept rows (beside the hole statuses). */
export const KEPT_FILTER = 'kept';
export const KEPT_CHIP_LABEL = 'Kept on this phone';
export const KEPT_BADGE = 'Kept on this phone — not sent';

/** The status filter: a hole status matches only holes the server has; `kept` matches only kept ones. */
export function statusMatches(row: Pick<HoleRow, 'status' | 'kept'>, value: unknown): boolean {
  if (value == null) return true;
  if (value === KEPT_FILTER) return row.kept != null;
  return row.kept == null && row.status === value;
}

/**
 * What the CSV export writes of the rows shown: kept holes are not on the server, so the file (a
 * record of the register) leaves them out, and its filter line says how many it left out.
 */
export function exportableRows(shown: readonly HoleRow[]): { rows: HoleRow[]; leftOut: string } {
  const rows = shown.filter((r) => !r.kept);
  const n = shown.length - rows.length;
  return { rows, leftOut: n > 0 ? `${n} ${n === 1 ? 'hole' : 'holes'} kept on this phone and not sent left out` : '' };
}

/** A kept record's state: the badge, then what the outbox says (sending, refused with the reason). */
function KeptStatus({ kept }: { kept: KeptInfo }) {
  return (
    <span className="inline-flex max-w-64 flex-col items-start gap-1 whitespace-normal">
      <Badge className="border border-dashed border-caution-700 bg-caution-100 text-caution-900" title="Not on the server yet: sent from this phone when the signal returns">
        {KEPT_BADGE}
      </Badge>
      {kept.status === 'local' ? (
        <span className="text-xs text-ink-600">waiting for signal · see the unsent list at the top</span>
      ) : (
        <OutboxStatusBadge status={kept.status} reason={kept.reason} />
      )}
      {kept.photoProblem && <OutboxStatusBadge status="refused" reason={kept.photoProblem} />}
    </span>
  );
}

export interface HoleTableContext {
  projectId: number;
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
  lines: Map<number, { label: string; kind: LineKind; qualityLevel: QualityLevel }>;
  bores: Map<number, string>;
  clearances: Map<number, LineClearanceSummary>;
  /** False while the clearance report is loading or failed (the column says so). */
  clearancesKnown: boolean;
}

/** Top of line: the surveyed value wins; else ground − depth when the depth was taken to the top. */
export function topOfLine(hole: HoleDto): { value: number; source: 'surveyed' | 'ground − depth' } | null {
  if (hole.surveyedTopElevation != null) return { value: hole.surveyedTopElevation, source: 'surveyed' };
  const ground = hole.surveyedGroundElevation ?? hole.groundElevation;
  if (ground != null && hole.depthToTop != null && hole.depthReference === 'top') return { value: ground - hole.depthToTop, source: 'ground − depth' };
  return null;
}

export function toRows(holes: readonly HoleDto[], ctx: HoleTableContext): HoleRow[] {
  return holes.map((h) => {
    const line = ctx.lines.get(h.lineId);
    const top = topOfLine(h);
    const clearance = ctx.clearances.get(h.lineId) ?? null;
    return {
      hole: h,
      number: h.number,
      status: h.status,
      statusOrder: HOLE_STATUSES.indexOf(h.status),
      lineId: h.lineId,
      lineLabel: line?.label ?? `Line ${h.lineId}`,
      lineKind: line?.kind ?? null,
      qualityLevel: line?.qualityLevel ?? undefined,
      clearance,
      clearanceOrder: clearance ? clearanceRank(clearance.status) : undefined,
      ground: h.surveyedGroundElevation ?? h.groundElevation ?? undefined,
      groundSurveyed: h.surveyedGroundElevation != null,
      depth: h.depthToTop ?? undefined,
      top: top?.value,
      topSource: top?.source ?? null,
      boreName: h.boreId != null ? (ctx.bores.get(h.boreId) ?? `bore ${h.boreId}`) : null,
      dugAt: h.dugAt ?? undefined,
      crew: h.crew ?? undefined,
      photos: h.photoCount,
      search: [h.number, line?.label, line ? LINE_KIND_LABELS[line.kind] : '', h.crew, h.material, h.condition, h.ticketNumber, h.surfaceType, h.notes, HOLE_STATUS_LABELS[h.status]]
        .filter(Boolean)
        .join(' \u0001 ')
        .toLowerCase(),
    };
  });
}

const features = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  globalFilteringFeature,
  columnVisibilityFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
  filterFns: { equals: filterFn_equals, includesString: filterFn_includesString },
  columnMeta: {} as SortableColumnMeta,
});

const helper = createColumnHelper<typeof features, HoleRow>();

function Position({ row, ctx }: { row: HoleRow; ctx: HoleTableContext }) {
  const hole = row.hole;
  const source = SOURCE_LABELS[hole.positionSource];
  const surveyed =
    hole.surveyedEasting != null && hole.surveyedNorthing != null ? (
      <span className="text-xs text-brand-800" title={`Surveyed E ${formatCoordinate(hole.surveyedEasting, ctx.unit)}, N ${formatCoordinate(hole.surveyedNorthing, ctx.unit)}`}>
        surveyed position on file
      </span>
    ) : null;
  const approx = hole.approximate ? (
    <Badge className="mt-0.5 bg-caution-100 text-caution-800" title="Approximate position (phone GPS)">
      approx.{hole.gpsAccuracy != null ? ` ±${formatLength(hole.gpsAccuracy, ctx.unit, 1)}` : ''}
    </Badge>
  ) : null;
  if (hole.station != null && hole.boreId != null) {
    return (
      <span className="inline-flex flex-col">
        <span>
          Sta. {formatStation(hole.station, ctx.stationStyle)}, {formatOffset(hole.offset, hole.offsetSide, ctx.unit)}
        </span>
        <span className="text-xs text-ink-500">
          on {row.boreName} · {source}
        </span>
        {surveyed}
        {approx}
      </span>
    );
  }
  return (
    <span className="inline-flex flex-col">
      <span>E {formatCoordinate(hole.easting, ctx.unit)}</span>
      <span>N {formatCoordinate(hole.northing, ctx.unit)}</span>
      <span className="text-xs text-ink-500">{source}</span>
      {hole.positionSource !== 'survey' && surveyed}
      {approx}
    </span>
  );
}

/** An elevation column (ground, top of line): in the project's unit and datum, sorted with blanks last, with a note on how it was found. */
function elevationColumn(ctx: HoleTableContext, key: 'ground' | 'top', title: string, note: (row: HoleRow) => React.ReactNode) {
  return helper.accessor(key, {
    header: () => (
      <>
        {title}
        <CellNote>
          {UNIT_SYMBOLS[ctx.unit]}, {ctx.datum}
        </CellNote>
      </>
    ),
    sortFn: 'basic',
    sortUndefined: 'last',
    meta: { numeric: true },
    cell: (info) => {
      const r = info.row.original;
      const value = r[key];
      return value == null ? '—' : (
        <span>
          {formatLength(value, ctx.unit)}
          {note(r)}
        </span>
      );
    },
  });
}

function buildColumns(ctx: HoleTableContext) {
  const u = UNIT_SYMBOLS[ctx.unit];
  return helper.columns([
    helper.accessor('number', {
      header: 'Hole',
      sortFn: 'alphanumeric',
      cell: (info) =>
        info.row.original.kept ? (
          // Not on the server yet: no page to open; its state is in the status cell and the header's unsent list.
          <span className="inline-flex flex-col">
            <span className="font-semibold text-ink-800">{info.getValue()}</span>
            <CellNote>not sent</CellNote>
          </span>
        ) : (
          <Link to={`/projects/${ctx.projectId}/holes/${info.row.original.hole.id}`} className="font-semibold text-brand-700 underline-offset-2 hover:underline">
            {info.getValue()}
          </Link>
        ),
    }),
    helper.accessor('statusOrder', {
      id: 'status',
      header: 'Status',
      sortFn: 'basic',
      filterFn: (row: Row<typeof features, HoleRow>, _id: string, value: unknown) => statusMatches(row.original, value),
      cell: (info) => {
        const kept = info.row.original.kept;
        return kept ? <KeptStatus kept={kept} /> : <HoleStatusBadge status={info.row.original.status} />;
      },
    }),
    helper.accessor('lineId', {
      id: 'line',
      header: 'Line exposed',
      filterFn: 'equals',
      sortFn: (a: Row<typeof features, HoleRow>, b: Row<typeof features, HoleRow>) => a.original.lineLabel.localeCompare(b.original.lineLabel),
      cell: (info) => {
        const r = info.row.original;
        return (
          <span className="inline-flex max-w-56 min-w-36 flex-col whitespace-normal">
            <span className="font-medium">{r.lineLabel}</span>
            {r.kept?.newLine != null && <span className="text-xs text-ink-600">new line, made when the hole is sent</span>}
            {r.lineKind && (
              <span className="text-xs text-ink-600">
                <KindSwatch kind={r.lineKind} />
              </span>
            )}
          </span>
        );
      },
    }),
    helper.accessor('lineKind', { id: 'kind', header: 'Kind', filterFn: 'equals', enableHiding: true }),
    helper.accessor('clearanceOrder', {
      id: 'clearance',
      header: () => (
        <>
          Clearance<CellNote>line vs bore, worst</CellNote>
        </>
      ),
      sortFn: 'basic',
      sortUndefined: 'last',
      cell: (info) => {
        const c = info.row.original.clearance;
        if (info.row.original.kept?.newLine != null) return <span className="text-xs text-ink-500">not checked until sent</span>;
        if (!ctx.clearancesKnown) return <span className="text-xs text-ink-500">not available</span>;
        if (!c) return <span className="text-xs text-ink-500" title="The line is not near any bore">near no bore</span>;
        return <ClearanceBadge status={c.status} detail={c.bores.map((b) => `${b.name}: ${CLEARANCE_LABELS[b.status]}`).join('; ')} />;
      },
    }),
    helper.accessor('qualityLevel', {
      id: 'ql',
      header: 'QL',
      filterFn: 'equals',
      sortUndefined: 'last',
      cell: (info) => {
        const ql = info.getValue();
        return ql ? <QualityLevelBadge level={ql} /> : '—';
      },
    }),
    helper.display({ id: 'position', header: () => <>Position<CellNote>{u}</CellNote></>, cell: (info) => <Position row={info.row.original} ctx={ctx} /> }),
    elevationColumn(ctx, 'ground', 'Ground elev.', (r) => r.groundSurveyed && <CellNote>surveyed</CellNote>),
    helper.accessor('depth', {
      header: () => (
        <>
          Depth<CellNote>{u} below ground</CellNote>
        </>
      ),
      sortFn: 'basic',
      sortUndefined: 'last',
      meta: { numeric: true },
      cell: (info) => {
        const h = info.row.original.hole;
        return h.depthToTop == null ? '—' : (
          <span>
            {formatLength(h.depthToTop, ctx.unit)}
            <CellNote>{REFERENCE_LABELS[h.depthReference]}</CellNote>
          </span>
        );
      },
    }),
    elevationColumn(ctx, 'top', 'Top of line elev.', (r) => <CellNote>{r.topSource}</CellNote>),
    helper.accessor('crew', { header: 'Crew', sortFn: 'alphanumeric', sortUndefined: 'last', cell: (info) => <span className="inline-block max-w-48 min-w-32 whitespace-normal">{info.getValue() ?? '—'}</span> }),
    helper.accessor('dugAt', { header: 'Dug at', sortFn: 'alphanumeric', sortUndefined: 'last', cell: (info) => formatDateTime(info.getValue()) }),
    helper.accessor('photos', {
      header: 'Photos',
      sortFn: 'basic',
      meta: { numeric: true },
      cell: (info) =>
        info.row.original.kept ? (
          <span>
            {info.getValue()}
            <CellNote>on this phone</CellNote>
          </span>
        ) : (
          info.getValue()
        ),
    }),
    helper.accessor('search', { header: 'Search', filterFn: 'includesString' }),
  ]);
}

const HIDDEN = { kind: false, search: false };

/** A kept row: tinted caution (every cell, the held first one too) with a dashed rule above. */
const KEPT_ROW_CLASS = 'border-t border-dashed border-t-caution-700 *:bg-caution-50';

export interface HolesTableProps {
  rows: HoleRow[];
  ctx: HoleTableContext;
  frame: Omit<CsvFrame, 'exportedAt' | 'filters'>;
  /** The order on opening (default: by hole number). */
  initialSorting?: { id: string; desc: boolean }[];
  /** Column filters on opening (none by default), e.g. `[{ id: 'status', value: 'kept' }]`. */
  initialFilters?: { id: string; value: unknown }[];
  /** Search text on opening (none by default). */
  initialSearch?: string;
}

/**
 * The test-hole register: sort by any column, filter by status, line, kind and quality level,
 * search, see each line's clearance status, and export the rows shown as CSV.
 */
export function HolesTable({ rows, ctx, frame, initialSorting = [{ id: 'number', desc: false }], initialFilters = [], initialSearch = '' }: HolesTableProps) {
  const columns = useMemo(() => buildColumns(ctx), [ctx]);
  const [moreFilters, setMoreFilters] = useState(false);
  const filtersId = useId();
  const table = useTable({
    features,
    columns,
    data: rows,
    getRowId: (r) => (r.kept ? `kept-${r.kept.clientId}` : String(r.hole.id)),
    initialState: { columnVisibility: HIDDEN, sorting: initialSorting, columnFilters: initialFilters, ...(initialSearch ? { globalFilter: initialSearch } : {}) },
    globalFilterFn: 'includesString',
    getColumnCanGlobalFilter: (column) => column.id === 'search',
    enableSortingRemoval: false,
  });

  const filters = table.state.columnFilters;
  const selectFilters = filters.filter((f) => f.id !== 'status').length;
  const filterOf = (id: string) => filters.find((f) => f.id === id)?.value as string | number | undefined;
  const search = (table.state.globalFilter as string | undefined) ?? '';
  const shown = table.getRowModel().rows;
  const anyFilter = filters.length > 0 || search !== '';

  const status = (filterOf('status') as HoleStatus | typeof KEPT_FILTER | undefined) ?? 'all';
  // Each hole status counts the server's holes only; kept holes have a chip of their own, shown while there are any.
  const keptCount = rows.filter((r) => r.kept).length;
  const counts = Object.fromEntries(HOLE_STATUSES.map((s) => [s, rows.filter((r) => statusMatches(r, s)).length])) as Record<HoleStatus, number>;
  const { rows: exported, leftOut } = exportableRows(shown.map((r) => r.original));
  const lineOptions = useMemo(() => [...new Map(rows.map((r) => [r.lineId, r.lineLabel])).entries()].sort((a, b) => a[1].localeCompare(b[1])), [rows]);
  const kindOptions = useMemo(() => [...new Set(rows.map((r) => r.lineKind).filter((k): k is LineKind => k != null))], [rows]);

  /** The filters in force, in words, for the export header. */
  function filterWords(): string {
    const words: string[] = [];
    if (status === KEPT_FILTER) words.push(`status ${KEPT_CHIP_LABEL}`);
    else if (status !== 'all') words.push(`status ${HOLE_STATUS_LABELS[status]}`);
    const line = filterOf('line');
    if (line != null) words.push(`line ${lineOptions.find(([id]) => id === Number(line))?.[1] ?? line}`);
    const kind = filterOf('kind');
    if (kind != null) words.push(`kind ${LINE_KIND_LABELS[kind as LineKind] ?? kind}`);
    const ql = filterOf('ql');
    if (ql != null) words.push(`quality level ${ql}`);
    if (search) words.push(`search "${search}"`);
    const parts = words.length ? [`filtered: ${words.join(', ')}`] : [];
    if (leftOut) parts.push(leftOut);
    return parts.join('; ');
  }

  function exportCsv() {
    const csv = holesCsv(
      exported,
      { ...frame, exportedAt: new Date().toISOString(), filters: filterWords() },
      { unit: ctx.unit, stationStyle: ctx.stationStyle },
    );
    const blob = new Blob([csv], { type: 'text/csv;charset=utf-8' });
    const url = URL.createObjectURL(blob);
    const a = document.createElement('a');
    a.href = url;
    a.download = `${frame.fileStem}-test-holes-${new Date().toISOString().slice(0, 10)}.csv`;
    document.body.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  }

  return (
    <div className="space-y-3">
      <FilterChips
        label="Filter by status"
        value={status}
        onChange={(v) => table.getColumn('status')?.setFilterValue(v === 'all' ? undefined : v)}
        options={[
          { value: 'all' as const, label: 'All', count: rows.length },
          ...HOLE_STATUSES.map((s) => ({ value: s, label: HOLE_STATUS_LABELS[s], count: counts[s] })),
          ...(keptCount > 0 || status === KEPT_FILTER ? [{ value: KEPT_FILTER, label: KEPT_CHIP_LABEL, count: keptCount }] : []),
        ]}
      />
      <div className="grid grid-cols-[1fr_auto] gap-2 sm:grid-cols-[minmax(12rem,2fr)_repeat(3,minmax(8rem,1fr))] sm:items-end">
        <label className="flex flex-col gap-1 text-sm font-medium text-ink-800">
          Search holes
          <input
            type="search"
            value={search}
            onChange={(e) => table.setGlobalFilter(e.target.value)}
            placeholder="Number, line, crew, material, ticket…"
            className="min-h-11 rounded-md border border-ink-300 bg-white px-3 text-base font-normal sm:text-sm"
          />
        </label>
        <Button
          variant="secondary"
          className="self-end sm:hidden"
          aria-expanded={moreFilters}
          aria-controls={filtersId}
          onClick={() => setMoreFilters(!moreFilters)}
        >
          Filters{selectFilters > 0 ? ` (${selectFilters})` : ''}
        </Button>
        <div id={filtersId} className={cn('col-span-2 grid-cols-2 gap-2 sm:col-span-3 sm:grid sm:grid-cols-3', moreFilters ? 'grid' : 'hidden')}>
          <FilterSelect label="Line" value={filterOf('line')} onChange={(v) => table.getColumn('line')?.setFilterValue(v == null ? undefined : Number(v))} className="col-span-2 sm:col-span-1">
            {lineOptions.map(([id, label]) => (
              <option key={id} value={id}>
                {label}
              </option>
            ))}
          </FilterSelect>
          <FilterSelect label="Kind" value={filterOf('kind')} onChange={(v) => table.getColumn('kind')?.setFilterValue(v ?? undefined)}>
            {kindOptions.map((k) => (
              <option key={k} value={k}>
                {LINE_KIND_LABELS[k]}
              </option>
            ))}
          </FilterSelect>
          <FilterSelect label="Quality level" value={filterOf('ql')} onChange={(v) => table.getColumn('ql')?.setFilterValue(v ?? undefined)}>
            {QUALITY_LEVELS.map((q) => (
              <option key={q} value={q}>
                QL-{q}
              </option>
            ))}
          </FilterSelect>
        </div>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm text-ink-600" aria-live="polite">
          Showing {shown.length} of {rows.length} {rows.length === 1 ? 'hole' : 'holes'}
          {keptCount > 0 && `, ${keptCount} kept on this phone and not sent (left out of the CSV)`}
        </p>
        <div className="flex flex-wrap gap-2">
          {anyFilter && (
            <Button
              variant="ghost"
              size="sm"
              onClick={() => {
                table.resetColumnFilters(true);
                table.setGlobalFilter('');
              }}
            >
              Clear filters
            </Button>
          )}
          <Button variant="secondary" size="sm" onClick={exportCsv} disabled={exported.length === 0}>
            Export CSV ({exported.length})
          </Button>
        </div>
      </div>
      <SortableTable
        table={table}
        label="Test holes"
        caption="Test holes; column headers sort"
        emptyText="No holes match these filters."
        rowClassName={(r) => (r.kept ? KEPT_ROW_CLASS : undefined)}
      />
    </div>
  );
}

function FilterSelect({
  label,
  value,
  onChange,
  children,
  className,
}: {
  label: string;
  value: string | number | undefined;
  onChange: (value: string | null) => void;
  children: React.ReactNode;
  className?: string;
}) {
  return (
    <label className={cn('flex min-w-0 flex-col gap-1 text-sm font-medium text-ink-800', className)}>
      {label}
      <select
        value={value == null ? '' : String(value)}
        onChange={(e) => onChange(e.target.value === '' ? null : e.target.value)}
        className="min-h-11 w-full min-w-0 rounded-md border border-ink-300 bg-white px-2 text-base font-normal sm:text-sm"
      >
        <option value="">All</option>
        {children}
      </select>
    </label>
  );
}

