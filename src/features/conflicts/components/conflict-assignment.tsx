import type { ConflictRowDto } from '@shared/api';
import { ROLE_LABELS, type Role } from '@shared/domain';
import { conflictAssignmentSchema } from '@shared/schemas/conflict';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { applyServerErrors, useZodForm } from '@/lib/form';
import { useAssignConflict } from '../api/assign-conflict';
import { formatCalendarDate, toDateInput } from './conflict-status';

export interface AssigneeOption {
  id: number;
  name: string;
  role: Role;
  active: boolean;
}

/** Who works the conflict and by when; the assignee is told by e-mail (through the outbox). */
export function ConflictAssignment({ row, projectId, canAssign, people }: { row: ConflictRowDto; projectId: number; canAssign: boolean; people: AssigneeOption[] }) {
  const assign = useAssignConflict(projectId, row.id);
  const { register, handleSubmit, setError, formState: { errors, isDirty } } = useZodForm(conflictAssignmentSchema, {
    values: { assigneeId: row.assigneeId, dueDate: row.dueDate ? toDateInput(row.dueDate) : null, version: row.version },
  });
  const onSubmit = handleSubmit((values) => assign.mutate(values, { onError: (error) => applyServerErrors(error, setError, ['assigneeId', 'dueDate']) }));

  if (!canAssign) {
    return (
      <Panel title="Assignment" headingLevel={3}>
        <p className="text-sm">
          {row.assigneeName ? `${row.assigneeName}${row.dueDate ? `, due ${formatCalendarDate(row.dueDate)}` : ''}` : 'Not assigned.'}
        </p>
        <p className="mt-1 text-xs text-ink-500">The project manager assigns conflicts.</p>
      </Panel>
    );
  }
  return (
    <Panel title="Assignment" headingLevel={3}>
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        {assign.error && <ProblemAlert error={assign.error} fields={['assigneeId', 'dueDate']} />}
        {assign.isSuccess && !isDirty && <Alert tone="success">Saved. A new assignee or due date is e-mailed to the assignee.</Alert>}
        <SelectField label="Assignee" error={errors.assigneeId} {...register('assigneeId', { setValueAs: (v) => (v === '' || v === null ? null : Number(v)) })}>
          <option value="">Nobody</option>
          {people
            .filter((p) => p.active || p.id === row.assigneeId)
            .map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} — {ROLE_LABELS[p.role]}
              </option>
            ))}
        </SelectField>
        <TextField label="Due date" type="date" error={errors.dueDate} {...register('dueDate', { setValueAs: (v) => (v === '' ? null : v) })} />
        <Button type="submit" busy={assign.isPending} disabled={!isDirty}>
          Save assignment
        </Button>
      </form>
    </Panel>
  );
}
