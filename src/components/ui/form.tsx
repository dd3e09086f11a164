import type { ReactNode } from 'react';
import type { FieldValues, UseFormSetError } from 'react-hook-form';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form';
import { Button } from './button';
import { cn } from './cn';

/**
 * The row of buttons under a form: the primary button (busy while saving), the secondary one
 * (Cancel by default), then anything else (a version number). The primary button submits the
 * form, or, with `onSubmit`, is a plain button that calls it (an editor that is not a <form>).
 */
export function FormActions({
  submitLabel,
  busy,
  submitDisabled,
  onSubmit,
  cancelLabel = 'Cancel',
  onCancel,
  cancelDisabled,
  className,
  children,
}: {
  submitLabel: string;
  busy?: boolean;
  submitDisabled?: boolean;
  onSubmit?: () => void;
  cancelLabel?: string;
  onCancel: () => void;
  cancelDisabled?: boolean;
  className?: string;
  children?: ReactNode;
}) {
  return (
    <div className={cn('flex flex-wrap gap-2', className)}>
      <Button type={onSubmit ? 'button' : 'submit'} onClick={onSubmit} busy={busy} disabled={submitDisabled}>
        {submitLabel}
      </Button>
      <Button variant="secondary" onClick={onCancel} disabled={cancelDisabled}>
        {cancelLabel}
      </Button>
      {children}
    </div>
  );
}

/** A titled group of fields inside a form ("Coordinates and heights"). */
export function FormSection({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="space-y-4 rounded-md border border-ink-200 p-4">
      <legend className="px-1 text-sm font-semibold text-ink-800">{legend}</legend>
      {children}
    </fieldset>
  );
}

/**
 * The `onError` of a form's save: a field problem from the server (400, or 409 on a unique
 * value) goes beside its input (`applyServerErrors`, for the form's `fields`). With `onStale`,
 * a 409 stale version instead hands over the record as it now stands, so the form can show it
 * (and carry its version number) before the person tries again; `ProblemAlert` says why.
 */
export function saveErrorHandler<T extends FieldValues, R>(setError: UseFormSetError<T>, fields: readonly string[], onStale?: (current: R) => void): (error: unknown) => void {
  return (error) => {
    if (onStale && isApiError(error) && error.isStale) {
      const current = error.problem.current as R | undefined;
      if (current) onStale(current);
      return;
    }
    applyServerErrors(error, setError, fields);
  };
}
