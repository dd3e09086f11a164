import { useEffect, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { matchesConflictFilter } from '@shared/conflicts';
import { UNIT_LABELS } from '@shared/domain';
import { can } from '@shared/permissions';
import { SafetyCautions } from '@/components/safety-cautions';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState, Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useConflicts } from '@/features/conflicts/api/get-conflicts';
import { ConflictFilters, filterFromSearch, filterToSearch } from '@/features/conflicts/components/conflict-filters';
import { ConflictsTable } from '@/features/conflicts/components/conflicts-table';
import { OwnerMailPanel } from '@/features/mail/components/owner-mail-panel';
import { LAST_PROJECT_KEY } from '../landing';
import { useWorkspace } from './workspace-context';

/**
 * Conflicts: the register (SPEC §8 columns), filtered by the address bar (the same parameters
 * as the list endpoint and the exports), sorted by any column; each row opens its detail.
 * The project manager's landing page; managers mail owners from here.
 */
export default function ConflictsTab() {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const conflicts = useConflicts(project.id);
  const [params, setParams] = useSearchParams();
  const filter = useMemo(() => filterFromSearch(params), [params]);
  const [mailing, setMailing] = useState(false);
  const frame = useMemo(() => ({ projectId: project.id, unit: project.unit, datum: project.verticalDatum, stationStyle: project.stationStyle }), [project]);
  // The register opened last is where a manager lands next time on this device.
  useEffect(() => {
    try {
      globalThis.localStorage?.setItem(LAST_PROJECT_KEY, String(project.id));
    } catch {
      // storage refused (private mode): landing falls back to the busiest project
    }
  }, [project.id]);

  let body;
  if (conflicts.isPending) body = <Loading label="Loading conflicts…" />;
  else if (conflicts.isError) body = <ProblemAlert error={conflicts.error} />;
  else if (conflicts.data.length === 0)
    body = (
      <EmptyState title="No conflicts in the register">
        <p>
          The clearance check runs after every change to bores, pits, lines, test holes and rules. A line lands here when it overlaps a bore, falls short of
          its required clearance, or enters a pit; it stays until it is resolved by redesign or relocation, waived by its owner, or voided.
        </p>
        <p>An empty register does not mean every line is clear: lines with no test hole near a crossing are unverified — see Stake-out for the suggested holes.</p>
      </EmptyState>
    );
  else {
    const rows = conflicts.data.filter((r) => matchesConflictFilter(r, filter));
    body = (
      <div className="space-y-3">
        <ConflictFilters rows={conflicts.data} filter={filter} onChange={(f) => setParams(filterToSearch(f), { replace: true })} />
        <p className="text-sm text-ink-600" aria-live="polite">
          Showing {rows.length} of {conflicts.data.length} {conflicts.data.length === 1 ? 'conflict' : 'conflicts'} · lengths in {UNIT_LABELS[project.unit]}, elevations {project.verticalDatum}
        </p>
        {rows.length === 0 ? (
          <p className="rounded-md border border-ink-200 bg-white px-4 py-6 text-center text-sm text-ink-600">No conflicts match these filters.</p>
        ) : (
          <ConflictsTable rows={rows} frame={frame} />
        )}
      </div>
    );
  }

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-semibold">Conflicts</h2>
        {can(user.role, 'mail.send') && !mailing && (
          <Button variant="secondary" onClick={() => setMailing(true)}>
            Mail owners…
          </Button>
        )}
      </div>
      {mailing && <OwnerMailPanel projectId={project.id} onClose={() => setMailing(false)} />}
      {body}
      <SafetyCautions topics={['design-aid']} title="Before relying on a clearance" />
    </div>
  );
}
