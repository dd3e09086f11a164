import { useState } from 'react';
import type { ConflictRowDto } from '@shared/api';
import { allowedConflictMoves, isClosedConflictStatus } from '@shared/conflicts';
import { CONFLICT_STATUS_LABELS, type ConflictStatus, type Role } from '@shared/domain';
import { conflictStatusSchema } from '@shared/schemas/conflict';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { applyServerErrors, asTextOrNull, useZodForm } from '@/lib/form';
import { useMoveConflict } from '../api/move-conflict';
import { ConflictStatusBadge } from './conflict-status';

const MOVE_LABELS: Record<ConflictStatus, string> = {
  open: 'Reopen',
  in_review: 'Start review',
  resolved_redesign: 'Resolved by redesign',
  resolved_relocation: 'Resolved by relocation',
  waived: 'Waived by the owner',
  void: 'Void',
};

const REASON_HINTS: Record<ConflictStatus, string> = {
  open: 'Why it needs work again.',
  in_review: 'What is being checked, and by whom.',
  resolved_redesign: 'The design change, e.g. “bore lowered 3 ft at 11+00, profile rev. B”.',
  resolved_relocation: 'Who moved the line, where to, and the record of it.',
  waived: 'The owner’s written acceptance: who, when, reference.',
  void: 'Why this is not a conflict (e.g. wrong line data, line abandoned and removed).',
};

function MoveForm({ row, to, projectId, onDone, onCancel }: { row: ConflictRowDto; to: ConflictStatus; projectId: number; onDone: () => void; onCancel: () => void }) {
  const move = useMoveConflict(projectId, row.id);
  const closing = isClosedConflictStatus(to);
  const { register, handleSubmit, setError, formState: { errors } } = useZodForm(conflictStatusSchema, {
    defaultValues: { status: to, reason: '', resolutionNote: undefined, version: row.version },
  });
  const onSubmit = handleSubmit((values) =>
    move.mutate(values, {
      onSuccess: onDone,
      onError: (error) => applyServerErrors(error, setError, ['reason', 'resolutionNote']),
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3 rounded-md border border-ink-200 bg-ink-50 p-3" aria-label={`Move to ${CONFLICT_STATUS_LABELS[to]}`}>
      <p className="text-sm font-medium">
        Move to <ConflictStatusBadge status={to} />
      </p>
      {move.error && <ProblemAlert error={move.error} fields={['reason', 'resolutionNote']} />}
      <TextAreaField label="Reason" required hint={REASON_HINTS[to]} error={errors.reason} {...register('reason')} />
      {closing && (
        <TextAreaField
          label="Resolution note"
          hint="Kept on the register as how it was resolved; the reason is used when left empty."
          error={errors.resolutionNote}
          {...register('resolutionNote', { setValueAs: (v) => asTextOrNull(v) ?? undefined })}
        />
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={move.isPending}>
          Move to {CONFLICT_STATUS_LABELS[to]}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/**
 * The status workflow: open → in review → resolved by redesign / by relocation / waived / void,
 * each move with a reason. Only the moves the signed-in role may make are offered; closed
 * conflicts can only be reopened (rules in shared/conflicts.ts).
 */
export function ConflictWorkflow({ row, role, projectId }: { row: ConflictRowDto; role: Role; projectId: number }) {
  const [to, setTo] = useState<ConflictStatus | null>(null);
  const moves = allowedConflictMoves(row.status, role);
  return (
    <Panel title="Status" headingLevel={3}>
      <div className="space-y-3">
        <p className="flex flex-wrap items-center gap-2 text-sm">
          <ConflictStatusBadge status={row.status} />
          {row.statusSetByPerson ? <span className="text-ink-600">set by a person; the clearance check will not change it</span> : <span className="text-ink-600">set by the clearance check</span>}
        </p>
        {row.resolutionNote && (
          <p className="text-sm">
            <span className="font-medium">Resolution:</span> {row.resolutionNote}
          </p>
        )}
        {moves.length === 0 ? (
          <p className="text-sm text-ink-600">Your role does not change a conflict’s status. A design engineer or the project manager does.</p>
        ) : to ? (
          <MoveForm key={to} row={row} to={to} projectId={projectId} onDone={() => setTo(null)} onCancel={() => setTo(null)} />
        ) : (
          <div className="flex flex-wrap gap-2" role="group" aria-label="Move the conflict">
            {moves.map((m) => (
              <Button key={m} variant={m === 'open' || m === 'in_review' ? 'secondary' : 'primary'} size="sm" onClick={() => setTo(m)}>
                {MOVE_LABELS[m]}
              </Button>
            ))}
          </div>
        )}
      </div>
    </Panel>
  );
}
