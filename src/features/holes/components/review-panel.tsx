import { useState } from 'react';
import type { HoleDto } from '@shared/api';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { useReviewHole } from '../api/review-hole';
import { HOLE_STATUS_LABELS } from '../utils/labels';

type Decision = 'accept' | 'send_back' | 'reopen';

/**
 * The designer's review: accept (the hole is then locked), send back to the crew with a reason,
 * or reopen a reviewed hole with a reason. The server checks the version the designer saw.
 */
export function ReviewPanel({ hole, projectId }: { hole: HoleDto; projectId: number }) {
  const review = useReviewHole(projectId, hole.id);
  const [asking, setAsking] = useState<'send_back' | 'reopen' | null>(null);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | null>(null);
  const [last, setLast] = useState<Decision | null>(null);

  const decide = (decision: Decision) => {
    setLast(decision);
    if (decision !== 'accept') {
      if (!reason.trim()) {
        setReasonError('Reason is required: say what the crew or the surveyor should check.');
        return;
      }
      if (reason.trim().length > 500) {
        setReasonError('Reason: keep it under 500 characters.');
        return;
      }
    }
    setReasonError(null);
    review.mutate(decision === 'accept' ? { decision, version: hole.version } : { decision, reason: reason.trim(), version: hole.version }, {
      onSuccess: () => {
        setAsking(null);
        setReason('');
      },
    });
  };

  const staleOrState = isApiError(review.error) && review.error.status === 409;
  const reviewable = hole.status === 'dug' || hole.status === 'surveyed';

  return (
    <div className="space-y-3">
      {review.isSuccess && last && (
        <Alert tone="success">
          {last === 'accept' ? 'Accepted: the hole is reviewed and locked.' : last === 'send_back' ? 'Sent back to the crew with your reason.' : 'Reopened: the hole can be edited again.'}
        </Alert>
      )}
      {hole.status === 'planned' && <p className="text-sm text-ink-600">Nothing to review yet: the hole has not been dug.</p>}
      {reviewable && (
        <>
          {hole.status === 'dug' && (
            <Alert tone="caution">
              <p>This hole has no surveyed top of line yet. Accepting now locks it with the crew’s measurements (ground − depth).</p>
            </Alert>
          )}
          {asking !== 'send_back' ? (
            <div className="flex flex-wrap gap-2">
              <Button className="min-h-12" busy={review.isPending && last === 'accept'} onClick={() => decide('accept')}>
                Accept and lock
              </Button>
              <Button variant="secondary" className="min-h-12" onClick={() => setAsking('send_back')}>
                Send back…
              </Button>
            </div>
          ) : (
            <ReasonForm
              label="Reason for sending back"
              submit="Send back"
              reason={reason}
              error={reasonError}
              busy={review.isPending}
              onReason={setReason}
              onSubmit={() => decide('send_back')}
              onCancel={() => setAsking(null)}
            />
          )}
        </>
      )}
      {hole.status === 'reviewed' &&
        (asking !== 'reopen' ? (
          <Button variant="secondary" className="min-h-12" onClick={() => setAsking('reopen')}>
            Reopen…
          </Button>
        ) : (
          <ReasonForm
            label="Reason for reopening"
            submit="Reopen"
            reason={reason}
            error={reasonError}
            busy={review.isPending}
            onReason={setReason}
            onSubmit={() => decide('reopen')}
            onCancel={() => setAsking(null)}
          />
        ))}
      {review.error &&
        (staleOrState ? (
          <Alert tone="danger" title="Not done: the hole changed since you opened it">
            <p>
              {isApiError(review.error) ? review.error.problem.detail : ''} It is now {HOLE_STATUS_LABELS[hole.status].toLowerCase()} (version {hole.version}). Check it and decide
              again.
            </p>
          </Alert>
        ) : (
          <ProblemAlert error={review.error} />
        ))}
    </div>
  );
}

function ReasonForm({
  label,
  submit,
  reason,
  error,
  busy,
  onReason,
  onSubmit,
  onCancel,
}: {
  label: string;
  submit: string;
  reason: string;
  error: string | null;
  busy: boolean;
  onReason: (v: string) => void;
  onSubmit: () => void;
  onCancel: () => void;
}) {
  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        onSubmit();
      }}
      className="space-y-2"
    >
      <TextAreaField label={label} required maxLength={500} value={reason} onChange={(e) => onReason(e.target.value)} error={error ? { message: error.replace(/^Reason:? ?/, '') } : undefined} autoFocus />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" className="min-h-12" busy={busy}>
          {submit}
        </Button>
        <Button variant="secondary" className="min-h-12" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
