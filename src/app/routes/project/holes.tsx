import { useEffect, useMemo, useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useLocation } from 'react-router-dom';
import { can } from '@shared/permissions';
import { SafetyCautions } from '@/components/safety-cautions';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useBores } from '@/features/bores/api/get-bores';
import { useClearances } from '@/features/holes/api/get-clearances';
import { useHoles } from '@/features/holes/api/get-holes';
import { invalidateAfterHoleWrite } from '@/features/holes/api/invalidate';
import { HolesTable, type HoleTableContext } from '@/features/holes/components/holes-table';
import { registerRows } from '@/features/holes/utils/kept-rows';
import { worstStatusByLine } from '@/features/holes/utils/labels';
import { useLines } from '@/features/lines/api/get-lines';
import { formatDateTime } from '@/lib/format';
import { useWorkspace } from './workspace-context';
import { ImportUnsentButton } from '@/features/outbox/components/import-unsent';
import { useOutbox } from '@/features/outbox/use-outbox';

/**
 * Test holes: the register with filters, clearance status and CSV export; links to log a hole and
 * to import survey shots. Holes of this project kept on this phone (the outbox) and not on the
 * server yet are listed too, marked, until the server's copy replaces them (same client id).
 */
export default function HolesTab() {
  const { project, units } = useWorkspace();
  const user = useSignedInUser();
  const location = useLocation();
  const holes = useHoles(project.id);
  const lines = useLines(project.id);
  const bores = useBores(project.id);
  const clearances = useClearances(project.id);
  const outbox = useOutbox();
  const queryClient = useQueryClient();
  const deleted = (location.state as { deleted?: string } | null)?.deleted;

  // A kept hole the server has now kept (sent by the header's "Send now", an import or the
  // background sender) but that this list does not hold yet: read the list again, once per hole.
  const refreshedFor = useRef(new Set<string>());
  useEffect(() => {
    if (!holes.data || !outbox) return;
    const onServer = new Set(holes.data.map((h) => h.clientId));
    const arrived = outbox.filter((r) => r.projectId === project.id && r.holeId != null && !onServer.has(r.clientId) && !refreshedFor.current.has(r.clientId));
    if (arrived.length === 0) return;
    for (const r of arrived) refreshedFor.current.add(r.clientId);
    void invalidateAfterHoleWrite(queryClient);
  }, [holes.data, outbox, project.id, queryClient]);

  const ctx: HoleTableContext = useMemo(
    () => ({
      ...units,
      projectId: project.id,
      lines: new Map((lines.data ?? []).map((l) => [l.id, { label: l.label, kind: l.kind, qualityLevel: l.qualityLevel }])),
      bores: new Map((bores.data ?? []).map((b) => [b.id, b.name])),
      clearances: worstStatusByLine(clearances.data?.report),
      clearancesKnown: clearances.isSuccess,
    }),
    [units, project.id, lines.data, bores.data, clearances.data, clearances.isSuccess],
  );
  const rows = useMemo(() => registerRows(holes.data ?? [], outbox ?? [], ctx), [holes.data, outbox, ctx]);
  const serverCount = holes.data?.length ?? 0;

  const canLog = can(user.role, 'hole.create');
  const canImport = can(user.role, 'hole.survey');

  const table =
    rows.length > 0 ? (
      <HolesTable
        rows={rows}
        ctx={ctx}
        frame={{
          projectName: project.name,
          crsCode: project.crsCode,
          unit: project.unit,
          verticalDatum: project.verticalDatum,
          clearancesCheckedAt: clearances.data?.checkedAt ?? null,
          total: serverCount,
          fileStem: project.name.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 40).toLowerCase() || 'project',
        }}
      />
    ) : null;

  let body;
  if (holes.isPending) body = <Loading label="Loading test holes…" />;
  else if (holes.isError)
    // The server's list could not be read (no signal and no copy on the phone): holes kept here still show.
    body = (
      <div className="space-y-3">
        <ProblemAlert error={holes.error} />
        {table}
      </div>
    );
  else if (rows.length === 0)
    body = (
      <EmptyState
        title="No test holes yet"
        action={
          canLog ? (
            <ButtonLink to="new" className="min-h-12">
              Log the first test hole
            </ButtonLink>
          ) : undefined
        }
      >
        <p>
          A test hole (pothole) exposes a buried line so its depth, size and material can be measured and surveyed. Each hole records the line it
          exposes; an excavation exposing several lines gets one record per line under the same number.
        </p>
        {!canLog && <p>Field crews and designers log holes; surveyors add their as-surveyed values.</p>}
      </EmptyState>
    );
  else
    body = (
      <div className="space-y-3">
        {table}
        <p className="text-xs text-ink-500">
          Depths are below ground, to the reference shown. Elevations are in {project.verticalDatum}; a surveyed top of line wins over ground − depth and
          is marked “surveyed”. Clearance status is the line’s worst against any bore
          {clearances.data ? `, checked ${formatDateTime(clearances.data.checkedAt)}` : ''}.
        </p>
        {clearances.isError && <p className="text-xs text-danger-700">The clearance report could not be loaded, so the clearance column is empty.</p>}
      </div>
    );

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-semibold">Test holes</h2>
        <div className="flex flex-wrap gap-2">
          {canImport && (
            <ButtonLink to="import" variant="secondary">
              Import survey shots
            </ButtonLink>
          )}
          {canLog && <ImportUnsentButton />}
          {canLog && <ButtonLink to="new">Log a test hole</ButtonLink>}
        </div>
      </div>
      {deleted && <Alert tone="success">Test hole {deleted} was deleted.</Alert>}
      {lines.isError && <p className="text-sm text-danger-700">Line names could not be loaded; lines are shown by number.</p>}
      <SafetyCautions />
      {body}
    </div>
  );
}
