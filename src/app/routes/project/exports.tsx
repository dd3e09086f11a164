import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { matchesConflictFilter } from '@shared/conflicts';
import { LINE_KINDS, UNIT_LABELS } from '@shared/domain';
import { SafetyCautions } from '@/components/safety-cautions';
import { ProblemAlert } from '@/components/ui/alert';
import { EmptyState, Loading, Panel } from '@/components/ui/states';
import { useBores } from '@/features/bores/api/get-bores';
import { useConflicts } from '@/features/conflicts/api/get-conflicts';
import { ConflictFilters, filterFromSearch, filterToSearch } from '@/features/conflicts/components/conflict-filters';
import { useExportSummary } from '@/features/exports/api/get-export-summary';
import { useLines } from '@/features/lines/api/get-lines';
import { BundleExport, ConflictListExport, GeojsonExport, StakeoutExport } from '@/features/exports/components/export-panels';
import { formatDateTime } from '@/lib/format';
import { useWorkspace } from './workspace-context';

/**
 * Exports for every role: the conflict list (CSV, XLSX, PDF) of the filtered rows or of
 * everything, the stake-out list (point file, DXF), GeoJSON, and one zip with everything and the
 * photos. The filter is the Conflicts screen's (same address-bar parameters), so a link from the
 * register can carry its filter here.
 */
export default function ExportsTab() {
  const { project } = useWorkspace();
  const summary = useExportSummary(project.id);
  const conflicts = useConflicts(project.id);
  const bores = useBores(project.id);
  const lines = useLines(project.id);
  const [params, setParams] = useSearchParams();
  const filter = useMemo(() => filterFromSearch(params), [params]);
  const filtered = Object.values(filter).some((v) => (Array.isArray(v) ? v.length > 0 : Boolean(v)));
  const query = useMemo(() => Object.fromEntries(filterToSearch(filter)), [filter]);
  const unitText = `${UNIT_LABELS[project.unit]}, elevations ${project.verticalDatum}`;

  if (summary.isPending || conflicts.isPending || bores.isPending) return <Loading label="Counting what there is to export…" />;
  if (summary.isError) return <ProblemAlert error={summary.error} />;
  if (conflicts.isError) return <ProblemAlert error={conflicts.error} />;
  if (bores.isError) return <ProblemAlert error={bores.error} />;

  const s = summary.data;
  const rows = conflicts.data.filter((r) => matchesConflictFilter(r, filter));
  const kinds = LINE_KINDS.filter((k) => (lines.data ?? []).some((l) => l.kind === k));
  const nothing = s.counts.lines === 0 && s.counts.holes === 0 && s.counts.bores === 0;

  return (
    <div className="space-y-4">
      <div className="space-y-1">
        <h2 className="text-lg font-semibold">Exports</h2>
        <p className="text-sm text-ink-700">
          Every file states in its header the CRS ({s.crsCode} {s.crsName}), the unit ({UNIT_LABELS[s.unit]}), the vertical datum ({s.verticalDatum}) and the
          time of the clearance check. Conflict lists carry the register as of its last check (every change that can move a clearance reruns it); the
          stake-out points, GeoJSON and the zip's test-hole sheets recompute the clearances when each file is made (last computed{' '}
          {formatDateTime(s.checkedAt)}).
        </p>
      </div>

      {nothing && (
        <EmptyState title="Nothing to export yet">
          <p>
            This project has no bores, lines or test holes yet. The exports still work and carry their header, but hold no rows: add lines (or import them on
            the Lines tab) and bores first.
          </p>
        </EmptyState>
      )}

      <Panel title="Which conflicts" headingLevel={3}>
        {conflicts.data.length === 0 ? (
          <p className="text-sm text-ink-600">
            The register has no conflicts, so the conflict list exports with its header and no rows. Lines with no test hole near a crossing are unverified,
            not clear: their suggested test holes are in the stake-out list.
          </p>
        ) : (
          <div className="space-y-2">
            <ConflictFilters rows={conflicts.data} filter={filter} onChange={(f) => setParams(filterToSearch(f), { replace: true })} />
            <p className="text-sm font-medium text-ink-800" aria-live="polite">
              {filtered ? `The exports hold the ${rows.length} of ${conflicts.data.length} conflicts this filter shows.` : `The exports hold everything: all ${conflicts.data.length} conflicts.`}
            </p>
          </div>
        )}
      </Panel>

      <div className="grid gap-4 lg:grid-cols-2">
        <ConflictListExport
          projectId={project.id}
          query={query}
          rowsText={
            <>
              {filtered ? `${rows.length} of ${conflicts.data.length}` : `All ${conflicts.data.length}`} conflicts with the register’s columns: station range and offset,
              owner and contact, kind, size, material, quality level, test holes, top of line, required and measured clearance, status, resolution and dates.
              Lengths in {unitText}.
            </>
          }
        />
        <StakeoutExport projectId={project.id} bores={bores.data} summary={s} unitText={unitText} />
        <GeojsonExport projectId={project.id} kinds={kinds} />
        <BundleExport projectId={project.id} filter={filter} filtered={filtered} photoCount={s.counts.photos} />
      </div>

      <SafetyCautions topics={['design-aid', 'one-call', 'tolerance-zone']} title="Before anyone relies on an exported figure" />
    </div>
  );
}
