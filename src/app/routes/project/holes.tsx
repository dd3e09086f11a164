import { useMemo, useState } from 'react';
import { HOLE_STATUSES, type HoleStatus } from '@shared/domain';
import { SafetyCautions } from '@/components/safety-cautions';
import { ProblemAlert } from '@/components/ui/alert';
import { EmptyState, Loading } from '@/components/ui/states';
import { useBores } from '@/features/bores/api/get-bores';
import { useHoles } from '@/features/holes/api/get-holes';
import { HOLE_STATUS_LABELS, HolesTable, type HoleTableContext } from '@/features/holes/components/holes-table';
import { useLines } from '@/features/lines/api/get-lines';
import { FilterChips } from '@/components/ui/filter-chips';
import { useWorkspace } from './workspace-context';

/** Test holes: the cautions, a status filter and the table. */
export default function HolesTab() {
  const { project, units } = useWorkspace();
  const holes = useHoles(project.id);
  const lines = useLines(project.id);
  const bores = useBores(project.id);
  const [status, setStatus] = useState<HoleStatus | 'all'>('all');

  const ctx: HoleTableContext = useMemo(
    () => ({
      ...units,
      lines: new Map((lines.data ?? []).map((l) => [l.id, { label: l.label, kind: l.kind }])),
      bores: new Map((bores.data ?? []).map((b) => [b.id, b.name])),
    }),
    [units, lines.data, bores.data],
  );

  let body;
  if (holes.isPending) body = <Loading label="Loading test holes…" />;
  else if (holes.isError) body = <ProblemAlert error={holes.error} />;
  else if (holes.data.length === 0)
    body = (
      <EmptyState title="No test holes yet">
        <p>
          A test hole (pothole) exposes a buried line so its depth, size and material can be measured and surveyed. Each hole records the line it
          exposes; an excavation exposing several lines gets one record per line under the same number.
        </p>
        <p>Logging holes from a phone comes with the field logging form, which is not built yet.</p>
      </EmptyState>
    );
  else {
    const counts = Object.fromEntries(HOLE_STATUSES.map((s) => [s, holes.data.filter((h) => h.status === s).length])) as Record<HoleStatus, number>;
    const shown = status === 'all' ? holes.data : holes.data.filter((h) => h.status === status);
    body = (
      <div className="space-y-3">
        <FilterChips
          label="Filter by status"
          value={status}
          onChange={setStatus}
          options={[{ value: 'all' as const, label: 'All', count: holes.data.length }, ...HOLE_STATUSES.map((s) => ({ value: s, label: HOLE_STATUS_LABELS[s], count: counts[s] }))]}
        />
        {shown.length === 0 ? (
          <p className="rounded-md bg-white px-4 py-6 text-center text-sm text-ink-600">No holes are {HOLE_STATUS_LABELS[status as HoleStatus].toLowerCase()}.</p>
        ) : (
          <HolesTable holes={shown} ctx={ctx} />
        )}
        <p className="text-xs text-ink-500">
          Depths are below ground, to the reference shown. Elevations are in {project.verticalDatum}; a surveyed top of line wins over ground − depth.
        </p>
      </div>
    );
  }

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-lg font-semibold">Test holes</h2>
        {lines.isError && <p className="text-sm text-danger-700">Line names could not be loaded; lines are shown by number.</p>}
      </div>
      <SafetyCautions />
      {body}
    </div>
  );
}
