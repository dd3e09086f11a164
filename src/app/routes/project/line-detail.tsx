import { useState, type ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { HoleDto, LineDto } from '@shared/api';
import { UNIT_LABELS } from '@shared/domain';
import { can } from '@shared/permissions';
import { KindSwatch } from '@/components/kind-swatch';
import { QUALITY_LEVEL_MEANINGS, QualityLevelBadge } from '@/components/quality-level';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { Badge, Loading, Panel } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { ClearanceStatusBadge } from '@/features/conflicts/components/conflict-status';
import { useHoles } from '@/features/holes/api/get-holes';
import { HoleStatusBadge } from '@/features/holes/components/hole-status';
import { useDeleteLine } from '@/features/lines/api/delete-line';
import { useLine } from '@/features/lines/api/get-line';
import { LineForm } from '@/features/lines/components/line-form';
import { LINE_STATUS_LABELS, lineSize } from '@/features/lines/components/lines-table';
import { useClearances } from '@/features/plan/api/get-clearances';
import { isApiError } from '@/lib/api-client';
import { formatCoordinate, formatLength, polylineLength } from '@/lib/format';
import { NotFound } from '../not-found';
import { useWorkspace } from './workspace-context';

/** One existing line: its record, plan path, the test holes on it and its clearance to each bore; designers edit or delete it. */
export default function LineDetailPage() {
  const lineId = Number(useParams().lineId);
  if (!Number.isInteger(lineId) || lineId <= 0) return <NotFound />;
  return <LineDetail lineId={lineId} />;
}

function LineDetail({ lineId }: { lineId: number }) {
  const { project } = useWorkspace();
  const line = useLine(project.id, lineId);
  let body;
  if (line.isPending) body = <Loading label="Loading the line…" />;
  else if (line.isError) body = <ProblemAlert error={line.error} />;
  else body = <LineBody line={line.data} />;
  return (
    <div className="space-y-4">
      <ButtonLink to=".." relative="path" variant="ghost" size="sm" className="-ml-3">
        ← Lines
      </ButtonLink>
      {body}
    </div>
  );
}

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-medium text-ink-500">{term}</dt>
      <dd className="text-sm break-words text-ink-900">{children}</dd>
    </div>
  );
}

/** A refused delete (409 in_use): the server's reason, with the holes that hold the line as links. */
function DeleteRefused({ error, holes }: { error: unknown; holes: HoleDto[] }) {
  const { project } = useWorkspace();
  if (!isApiError(error) || error.problem.code !== 'in_use') return <ProblemAlert error={error} />;
  const numbers = error.problem.holds?.holes ?? [];
  const conflicts = error.problem.holds?.conflicts ?? [];
  return (
    <Alert tone="danger" title="This line is kept">
      <p>{error.problem.detail}</p>
      {numbers.length > 0 && (
        <p>
          Test holes on it:{' '}
          {numbers.map((n, i) => {
            const hole = holes.find((h) => h.number === n);
            return (
              <span key={`${n}-${i}`}>
                {i > 0 && ', '}
                {hole ? (
                  <Link to={`/projects/${project.id}/holes/${hole.id}`} className="font-semibold underline">
                    {n}
                  </Link>
                ) : (
                  n
                )}
              </span>
            );
          })}
          .
        </p>
      )}
      {conflicts.length > 0 && (
        <p>
          Conflicts with a history:{' '}
          {conflicts.map((id, i) => (
            <span key={id}>
              {i > 0 && ', '}
              <Link to={`/projects/${project.id}/conflicts/${id}`} className="font-semibold underline">
                C-{id}
              </Link>
            </span>
          ))}
          .
        </p>
      )}
    </Alert>
  );
}

function LineBody({ line }: { line: LineDto }) {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const navigate = useNavigate();
  const holes = useHoles(project.id);
  const clearances = useClearances(project.id);
  const remove = useDeleteLine(project.id, line.id);
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState(false);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const mayWrite = can(user.role, 'line.write');
  const unit = project.unit;

  const onLine = (holes.data ?? []).filter((h) => h.lineId === line.id).sort((a, b) => a.number.localeCompare(b.number, undefined, { numeric: true }));
  const perBore = (clearances.data?.report.bores ?? []).flatMap((b) => b.lines.filter((l) => l.lineId === line.id).map((l) => ({ bore: b, clearance: l })));

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        <h2 className="text-xl font-semibold break-words">{line.label}</h2>
        <KindSwatch kind={line.kind} />
        <Badge className={line.status === 'active' ? 'bg-ok-50 text-ok-700' : undefined}>{LINE_STATUS_LABELS[line.status]}</Badge>
      </div>

      {saved && !editing && <Alert tone="success">Changes saved. The clearances are checked again against every bore.</Alert>}
      {line.kind === 'unknown' && (
        <Alert tone="caution" title="Unidentified line: treat it as live">
          <p>
            A line on no record, logged where a crew exposed it. {mayWrite ? 'Edit it to extend its plan path as more test holes find it, and give its kind and owner once identified.' : 'A design engineer extends its path and identifies it.'}
          </p>
        </Alert>
      )}

      {mayWrite && !editing && (
        <div className="flex flex-wrap gap-2">
          <Button
            className="min-h-12"
            onClick={() => {
              setEditing(true);
              setSaved(false);
              setConfirmDelete(false);
              remove.reset();
            }}
          >
            Edit line
          </Button>
          {confirmDelete ? (
            <>
              <Button
                variant="danger"
                className="min-h-12"
                busy={remove.isPending}
                onClick={() => remove.mutate(undefined, { onSuccess: () => navigate('..', { relative: 'path', state: { deleted: line.label } }) })}
              >
                Delete this line
              </Button>
              <Button
                variant="secondary"
                className="min-h-12"
                onClick={() => {
                  setConfirmDelete(false);
                  remove.reset();
                }}
              >
                Keep it
              </Button>
            </>
          ) : (
            <Button variant="ghost" className="min-h-12" onClick={() => setConfirmDelete(true)}>
              Delete…
            </Button>
          )}
        </div>
      )}
      {confirmDelete && !remove.error && (
        <p className="text-sm text-ink-700">Deleting takes the line off every clearance check. A line that has test holes, or conflicts people have worked on, is kept.</p>
      )}
      {remove.error && <DeleteRefused error={remove.error} holes={holes.data ?? []} />}

      {editing ? (
        <Panel title="Edit line">
          <LineForm
            project={project}
            line={line}
            onDone={() => {
              setEditing(false);
              setSaved(true);
            }}
            onCancel={() => setEditing(false)}
          />
        </Panel>
      ) : (
        <>
          <Panel title="Record">
            <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-3">
              <Fact term="Owner">{line.owner}</Fact>
              <Fact term="Contact e-mail">{line.contactEmail ?? '—'}</Fact>
              <Fact term="Outside size">{lineSize(line, unit)}</Fact>
              <Fact term="Material">{line.material ?? '—'}</Fact>
              <Fact term="Quality level">
                <span className="inline-flex flex-wrap items-center gap-2">
                  <QualityLevelBadge level={line.qualityLevel} /> <span className="text-xs text-ink-600">{QUALITY_LEVEL_MEANINGS[line.qualityLevel]}</span>
                </span>
              </Fact>
              <Fact term="Record depth to top">{formatLength(line.recordDepth, unit)} below ground</Fact>
              <Fact term="Owner’s clearance">
                {line.requiredVertical == null && line.requiredHorizontal == null
                  ? 'Project rule for the kind'
                  : `V ${formatLength(line.requiredVertical, unit)} · H ${formatLength(line.requiredHorizontal, unit)}`}
              </Fact>
              <Fact term="Grid and heights">
                {project.crsCode}, {UNIT_LABELS[unit]}, {project.verticalDatum}
              </Fact>
              <Fact term="Version">
                {line.version}, saved {new Date(line.updatedAt).toLocaleString()}
              </Fact>
            </dl>
            {line.notes && <p className="mt-3 text-sm whitespace-pre-line text-ink-700">{line.notes}</p>}
          </Panel>

          <Panel title={`Plan path (${line.path.length} vertices, ${formatLength(polylineLength(line.path), unit)})`}>
            <ol className="space-y-1 text-sm tabular" aria-label="Plan path vertices">
              {line.path.map(([e, n], i) => (
                <li key={i} className="grid grid-cols-[1.5rem_minmax(0,1fr)] gap-x-2">
                  <span className="text-right text-ink-500">{i + 1}</span>
                  <span className="flex flex-wrap gap-x-4">
                    <span>E {formatCoordinate(e, unit)}</span>
                    <span>N {formatCoordinate(n, unit)}</span>
                  </span>
                </li>
              ))}
            </ol>
            <p className="mt-2 text-xs text-ink-500">Grid coordinates in {project.crsCode}, {UNIT_LABELS[unit]}.</p>
          </Panel>
        </>
      )}

      <Panel title={`Test holes on this line (${onLine.length})`}>
        {holes.isPending ? (
          <Loading label="Loading test holes…" />
        ) : holes.isError ? (
          <ProblemAlert error={holes.error} />
        ) : onLine.length === 0 ? (
          <p className="text-sm text-ink-600">No test hole has exposed this line yet: its record depth stands in and its clearances count as unverified.</p>
        ) : (
          <ul className="divide-y divide-ink-100" aria-label="Test holes on this line">
            {onLine.map((h) => (
              <li key={h.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2 text-sm">
                <Link to={`/projects/${project.id}/holes/${h.id}`} className="font-semibold text-brand-700 underline-offset-2 hover:underline">
                  {h.number}
                </Link>
                <HoleStatusBadge status={h.status} />
                <span className="text-ink-600">depth to top {formatLength(h.depthToTop, unit)}</span>
              </li>
            ))}
          </ul>
        )}
      </Panel>

      <Panel title="Clearance to each bore">
        {clearances.isPending ? (
          <Loading label="Loading the clearance check…" />
        ) : clearances.isError ? (
          <ProblemAlert error={clearances.error} />
        ) : perBore.length === 0 ? (
          <p className="text-sm text-ink-600">No bore crosses or runs near this line.</p>
        ) : (
          <ul className="divide-y divide-ink-100" aria-label="Clearance to each bore">
            {perBore.map(({ bore, clearance }) => (
              <li key={bore.boreId} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2 text-sm">
                <span className="font-medium">{bore.name}</span>
                <ClearanceStatusBadge status={clearance.status} />
                <span className="text-ink-600">
                  {clearance.relation === 'crossing' ? 'crossing' : 'near'} · clearance {formatLength(clearance.clearance, unit)} of {formatLength(clearance.required, unit)} required
                  {clearance.verified ? ' · verified by test holes' : ''}
                </span>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-xs text-ink-500">As of the last clearance check. Confirm by test holes before digging, and follow local codes and the owner’s requirements.</p>
      </Panel>
    </div>
  );
}
