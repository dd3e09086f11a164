import { Link, useParams } from 'react-router-dom';
import { can } from '@shared/permissions';
import { SafetyCautions } from '@/components/safety-cautions';
import { ProblemAlert } from '@/components/ui/alert';
import { Loading } from '@/components/ui/states';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useConflict } from '@/features/conflicts/api/get-conflict';
import { ConflictAssignment } from '@/features/conflicts/components/conflict-assignment';
import { ConflictFiguresPanel, ConflictLinePanel } from '@/features/conflicts/components/conflict-figures';
import { ConflictHistory } from '@/features/conflicts/components/conflict-history';
import { ConflictRegisterFields } from '@/features/conflicts/components/conflict-register-fields';
import { ClearanceStatusBadge, ConflictStatusBadge } from '@/features/conflicts/components/conflict-status';
import { ConflictWorkflow } from '@/features/conflicts/components/conflict-workflow';
import { useMembers } from '@/features/members/api/get-members';
import { NotFound } from '../not-found';
import { useWorkspace } from './workspace-context';

/** One conflict: its figures and line, the status workflow, assignment, register fields and full history. */
export default function ConflictDetailRoute() {
  const { project } = useWorkspace();
  const params = useParams();
  const conflictId = Number(params.conflictId);
  if (!Number.isInteger(conflictId) || conflictId <= 0) return <NotFound />;
  return <ConflictDetail projectId={project.id} conflictId={conflictId} />;
}

function ConflictDetail({ projectId, conflictId }: { projectId: number; conflictId: number }) {
  const { project } = useWorkspace();
  const user = useSignedInUser();
  const conflict = useConflict(projectId, conflictId);
  const canAssign = can(user.role, 'conflict.assign');
  const members = useMembers(projectId);
  const frame = { projectId, unit: project.unit, datum: project.verticalDatum, stationStyle: project.stationStyle };

  const back = (
    <Link to={`/projects/${projectId}/conflicts`} className="text-sm text-brand-700 hover:underline">
      ← All conflicts
    </Link>
  );
  if (conflict.isPending) return <Loading label="Loading conflict…" />;
  if (conflict.isError) {
    return (
      <div className="space-y-3">
        {back}
        <ProblemAlert error={conflict.error} />
      </div>
    );
  }
  const row = conflict.data;
  const people = (members.data ?? []).map((m) => ({ id: m.userId, name: m.name, role: m.role, active: m.active }));
  return (
    <div className="space-y-4">
      <div>
        {back}
        <h2 className="mt-1 flex flex-wrap items-center gap-2 text-xl font-semibold">
          {row.number}: {row.line.label} × {row.bore.name}
          <ConflictStatusBadge status={row.status} />
          <ClearanceStatusBadge status={row.computedStatus} />
        </h2>
        <p className="text-sm text-ink-600">
          Found {new Date(row.createdAt).toLocaleDateString('en-US', { dateStyle: 'medium' })} · {row.line.owner}
          {row.assigneeName ? ` · assigned to ${row.assigneeName}` : ''}
        </p>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="space-y-4">
          <ConflictWorkflow row={row} role={user.role} projectId={projectId} />
          <ConflictAssignment row={row} projectId={projectId} canAssign={canAssign} people={people} />
          <ConflictRegisterFields row={row} projectId={projectId} canEdit={can(user.role, 'conflict.status')} />
        </div>
        <div className="space-y-4">
          <ConflictFiguresPanel row={row} frame={frame} />
          <ConflictLinePanel row={row} frame={frame} />
        </div>
      </div>
      <ConflictHistory projectId={projectId} conflictId={conflictId} canComment={can(user.role, 'conflict.comment')} />
      <SafetyCautions topics={['design-aid', 'one-call', 'tolerance-zone']} title="Before relying on a clearance" />
    </div>
  );
}
