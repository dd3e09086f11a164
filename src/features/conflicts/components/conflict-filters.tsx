import { useId } from 'react';
import type { ConflictRowDto } from '@shared/api';
import { ACTIVE_CONFLICT_STATUSES } from '@shared/conflicts';
import { CLEARANCE_STATUSES, CONFLICT_STATUS_LABELS, CONFLICT_STATUSES, LINE_KIND_LABELS, type ConflictStatus, type LineKind } from '@shared/domain';
import { conflictListQuerySchema, type ConflictListQuery } from '@shared/schemas/conflict';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { FilterChips } from '@/components/ui/filter-chips';
import { CLEARANCE_STATUS_LABELS } from './conflict-status';

/** The filter from the address bar (`?status=open,in_review&boreId=3`); anything unreadable is dropped. */
export function filterFromSearch(params: URLSearchParams): ConflictListQuery {
  const raw: Record<string, string> = {};
  for (const key of ['status', 'computedStatus', 'boreId', 'kind', 'assignee', 'q']) {
    const v = params.get(key);
    if (v) raw[key] = v;
  }
  const parsed = conflictListQuerySchema.safeParse(raw);
  return parsed.success ? parsed.data : {};
}

/** The filter as address-bar parameters, in the list endpoint's (and the exports') format. */
export function filterToSearch(filter: ConflictListQuery): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filter)) {
    if (Array.isArray(value) ? value.length > 0 : value) params.set(key, Array.isArray(value) ? value.join(',') : String(value));
  }
  return params;
}

type StatusChoice = 'all' | 'active' | ConflictStatus;

function statusChoice(filter: ConflictListQuery): StatusChoice {
  const s = filter.status ?? [];
  if (s.length === 0) return 'all';
  if (s.length === 2 && ACTIVE_CONFLICT_STATUSES.every((a) => s.includes(a))) return 'active';
  return s.length === 1 ? s[0]! : 'all';
}

function Select({ label, value, onChange, children, className }: { label: string; value: string; onChange: (v: string) => void; children: React.ReactNode; className?: string }) {
  const id = useId();
  return (
    <div className={cn('flex min-w-0 flex-col gap-1', className)}>
      <label htmlFor={id} className="text-sm font-medium text-ink-800">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className="min-h-11 w-full min-w-0 rounded-md border border-ink-300 bg-white px-2 text-base sm:text-sm">
        <option value="">All</option>
        {children}
      </select>
    </div>
  );
}

/** Status chips with counts, and selects for bore, line kind, assignee and check result, plus a search box. */
export function ConflictFilters({ rows, filter, onChange }: { rows: ConflictRowDto[]; filter: ConflictListQuery; onChange: (f: ConflictListQuery) => void }) {
  const searchId = useId();
  const set = (patch: Partial<ConflictListQuery>) => onChange({ ...filter, ...patch });
  const count = (pred: (r: ConflictRowDto) => boolean) => rows.filter(pred).length;
  const bores = [...new Map(rows.map((r) => [r.bore.id, r.bore.name])).entries()].sort((a, b) => a[1].localeCompare(b[1]));
  const kinds = [...new Set(rows.map((r) => r.line.kind))] as LineKind[];
  const assignees = [...new Map(rows.filter((r) => r.assigneeId != null).map((r) => [r.assigneeId!, r.assigneeName ?? `User ${r.assigneeId}`])).entries()].sort((a, b) => a[1].localeCompare(b[1]));
  const choice = statusChoice(filter);
  const any = Object.values(filter).some((v) => (Array.isArray(v) ? v.length > 0 : Boolean(v)));

  return (
    <div className="space-y-2">
      <FilterChips<StatusChoice>
        label="Filter by status"
        value={choice}
        onChange={(v) => set({ status: v === 'all' ? undefined : v === 'active' ? [...ACTIVE_CONFLICT_STATUSES] : [v] })}
        options={[
          { value: 'all', label: 'All', count: rows.length },
          { value: 'active', label: 'Open or in review', count: count((r) => r.status === 'open' || r.status === 'in_review') },
          ...CONFLICT_STATUSES.map((s) => ({ value: s, label: CONFLICT_STATUS_LABELS[s], count: count((r) => r.status === s) })),
        ]}
      />
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-[minmax(12rem,2fr)_repeat(4,minmax(8rem,1fr))] sm:items-end">
        <div className="col-span-2 flex flex-col gap-1 sm:col-span-1">
          <label htmlFor={searchId} className="text-sm font-medium text-ink-800">
            Search conflicts
          </label>
          <input
            id={searchId}
            type="search"
            value={filter.q ?? ''}
            onChange={(e) => set({ q: e.target.value || undefined })}
            placeholder="Number, line, owner, bore…"
            className="min-h-11 rounded-md border border-ink-300 bg-white px-3 text-base sm:text-sm"
          />
        </div>
        <Select label="Bore" value={filter.boreId?.[0] != null ? String(filter.boreId[0]) : ''} onChange={(v) => set({ boreId: v ? [Number(v)] : undefined })}>
          {bores.map(([id, name]) => (
            <option key={id} value={id}>
              {name}
            </option>
          ))}
        </Select>
        <Select label="Line kind" value={filter.kind?.[0] ?? ''} onChange={(v) => set({ kind: v ? [v as LineKind] : undefined })}>
          {kinds.map((k) => (
            <option key={k} value={k}>
              {LINE_KIND_LABELS[k]}
            </option>
          ))}
        </Select>
        <Select label="Assignee" value={filter.assignee?.[0] != null ? String(filter.assignee[0]) : ''} onChange={(v) => set({ assignee: v ? [v === 'none' ? 'none' : Number(v)] : undefined })}>
          <option value="none">Unassigned</option>
          {assignees.map(([id, name]) => (
            <option key={id} value={id}>
              {name}
            </option>
          ))}
        </Select>
        <Select label="Last check" value={filter.computedStatus?.[0] ?? ''} onChange={(v) => set({ computedStatus: v ? [v as (typeof CLEARANCE_STATUSES)[number]] : undefined })}>
          {CLEARANCE_STATUSES.map((s) => (
            <option key={s} value={s}>
              {CLEARANCE_STATUS_LABELS[s]}
            </option>
          ))}
        </Select>
      </div>
      {any && (
        <Button variant="ghost" size="sm" onClick={() => onChange({})}>
          Clear filters
        </Button>
      )}
    </div>
  );
}
