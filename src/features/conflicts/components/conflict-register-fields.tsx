import type { ConflictRowDto } from '@shared/api';
import { conflictDetailsSchema, type ConflictDetailsInput } from '@shared/schemas/conflict';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { applyServerErrors, useZodForm } from '@/lib/form';
import { useUpdateConflict } from '../api/update-conflict';
import { formatCalendarDate, toDateInput } from './conflict-status';

const FIELDS = ['responsibleParty', 'ownerNotifiedAt', 'answerDueAt', 'resolutionNote', 'notes'] as const;

function Read({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[minmax(8rem,40%)_1fr] gap-2 border-b border-ink-100 py-1.5 last:border-b-0">
      <dt className="text-sm text-ink-600">{label}</dt>
      <dd className="text-sm whitespace-pre-wrap text-ink-900">{children}</dd>
    </div>
  );
}

/** Responsible party, owner told / answer due, resolution and notes; only changed fields are sent. */
export function ConflictRegisterFields({ row, projectId, canEdit }: { row: ConflictRowDto; projectId: number; canEdit: boolean }) {
  const update = useUpdateConflict(projectId, row.id);
  const values = {
    responsibleParty: row.responsibleParty ?? '',
    ownerNotifiedAt: toDateInput(row.ownerNotifiedAt) || null,
    answerDueAt: toDateInput(row.answerDueAt) || null,
    resolutionNote: row.resolutionNote ?? '',
    notes: row.notes ?? '',
    version: row.version,
  };
  const { register, handleSubmit, setError, formState: { errors, dirtyFields, isDirty } } = useZodForm(conflictDetailsSchema, { values });
  const onSubmit = handleSubmit((v) => {
    const input: ConflictDetailsInput = { version: v.version };
    for (const key of FIELDS) if (dirtyFields[key]) (input as Record<string, unknown>)[key] = v[key];
    update.mutate(input, { onError: (error) => applyServerErrors(error, setError, FIELDS) });
  });
  const dateOrNull = { setValueAs: (v: unknown) => (v === '' || v == null ? null : v) };

  if (!canEdit) {
    return (
      <Panel title="Register" headingLevel={3}>
        <dl>
          <Read label="Responsible party">{row.responsibleParty ?? '—'}</Read>
          <Read label="Owner told">{formatCalendarDate(row.ownerNotifiedAt)}</Read>
          <Read label="Answer due">{formatCalendarDate(row.answerDueAt)}</Read>
          <Read label="Closed">{formatCalendarDate(row.closedAt)}</Read>
          <Read label="Notes">{row.notes ?? '—'}</Read>
        </dl>
      </Panel>
    );
  }
  return (
    <Panel title="Register" headingLevel={3}>
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        {update.error && <ProblemAlert error={update.error} fields={FIELDS} />}
        {update.isSuccess && !isDirty && <Alert tone="success">Saved.</Alert>}
        <TextField label="Responsible party" hint="Who must act: the owner, the designer, the contractor…" error={errors.responsibleParty} {...register('responsibleParty')} />
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label="Owner told" type="date" hint="Set when the list is e-mailed to the owner." error={errors.ownerNotifiedAt} {...register('ownerNotifiedAt', dateOrNull)} />
          <TextField label="Answer due" type="date" error={errors.answerDueAt} {...register('answerDueAt', dateOrNull)} />
        </div>
        <p className="text-sm text-ink-600">Closed: {formatCalendarDate(row.closedAt)} <span className="text-xs">(set by a closing status move)</span></p>
        <TextAreaField label="Resolution note" error={errors.resolutionNote} {...register('resolutionNote')} />
        <TextAreaField label="Notes" error={errors.notes} {...register('notes')} />
        <Button type="submit" busy={update.isPending} disabled={!isDirty}>
          Save register fields
        </Button>
      </form>
    </Panel>
  );
}
