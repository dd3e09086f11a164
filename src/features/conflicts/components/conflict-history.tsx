import type { ConflictEventDto } from '@shared/api';
import { CONFLICT_EVENT_LABELS } from '@shared/conflicts';
import { CONFLICT_STATUS_LABELS, type ConflictStatus } from '@shared/domain';
import { conflictCommentSchema } from '@shared/schemas/conflict';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { EmptyState, Loading, Panel } from '@/components/ui/states';
import { applyServerErrors, useZodForm } from '@/lib/form';
import { formatDateTime } from '@/lib/format';
import { useAddConflictComment } from '../api/add-conflict-comment';
import { useConflictHistory } from '../api/get-conflict-history';

const FIELD_LABELS: Record<string, string> = {
  responsibleParty: 'responsible party',
  ownerNotifiedAt: 'owner told',
  answerDueAt: 'answer due',
  resolutionNote: 'resolution note',
  notes: 'notes',
};

function Detail({ e }: { e: ConflictEventDto }) {
  const data = e.data ?? {};
  if (e.kind === 'status' && typeof data.from === 'string' && typeof data.to === 'string') {
    return (
      <p className="text-sm font-medium">
        {CONFLICT_STATUS_LABELS[data.from as ConflictStatus]} → {CONFLICT_STATUS_LABELS[data.to as ConflictStatus]}
      </p>
    );
  }
  if (e.kind === 'details' && data.changes && typeof data.changes === 'object') {
    return <p className="text-sm">Changed {Object.keys(data.changes).map((k) => FIELD_LABELS[k] ?? k).join(', ')}.</p>;
  }
  return null;
}

function CommentForm({ projectId, conflictId }: { projectId: number; conflictId: number }) {
  const add = useAddConflictComment(projectId, conflictId);
  const { register, handleSubmit, reset, setError, formState: { errors } } = useZodForm(conflictCommentSchema, { defaultValues: { text: '' } });
  const onSubmit = handleSubmit((values) =>
    add.mutate(values, { onSuccess: () => reset({ text: '' }), onError: (error) => applyServerErrors(error, setError, ['text']) }),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-2 border-t border-ink-100 pt-3">
      {add.error && <ProblemAlert error={add.error} fields={['text']} />}
      <TextAreaField label="Comment" error={errors.text} {...register('text')} />
      <Button type="submit" size="sm" busy={add.isPending}>
        Add comment
      </Button>
    </form>
  );
}

/** Everything that happened to a conflict, oldest first: checks, moves, assignments, mail, comments. */
export function ConflictHistory({ projectId, conflictId, canComment }: { projectId: number; conflictId: number; canComment: boolean }) {
  const history = useConflictHistory(projectId, conflictId);
  return (
    <Panel title="History" headingLevel={3}>
      {history.isPending ? (
        <Loading label="Loading history…" />
      ) : history.isError ? (
        <ProblemAlert error={history.error} />
      ) : history.data.length === 0 ? (
        <EmptyState title="No history yet" />
      ) : (
        <ol className="space-y-3" aria-label="Conflict history">
          {history.data.map((e) => (
            <li key={e.id} className="border-l-2 border-ink-200 pl-3">
              <p className="text-xs text-ink-500">
                {formatDateTime(e.at)} · {e.byName ?? 'Clearance check'}
              </p>
              <p className="text-sm font-semibold text-ink-900">{CONFLICT_EVENT_LABELS[e.kind] ?? e.kind}</p>
              <Detail e={e} />
              {e.note && <p className="text-sm whitespace-pre-wrap text-ink-800">{e.note}</p>}
            </li>
          ))}
        </ol>
      )}
      {canComment && <div className="mt-3"><CommentForm projectId={projectId} conflictId={conflictId} /></div>}
    </Panel>
  );
}
