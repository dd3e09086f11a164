import type { ReactNode } from 'react';
import { isApiError, type ApiError } from '@/lib/api-client';
import { cn } from './cn';

type Tone = 'info' | 'caution' | 'danger' | 'success';

const TONES: Record<Tone, string> = {
  info: 'border-brand-200 bg-brand-50 text-brand-900',
  caution: 'border-caution-300 bg-caution-50 text-caution-900',
  danger: 'border-danger-100 bg-danger-50 text-danger-800',
  success: 'border-ok-100 bg-ok-50 text-ok-700',
};

/** A boxed message. Danger alerts are announced (`role="alert"`), others are polite status. */
export function Alert({ tone = 'info', title, children, className }: { tone?: Tone; title?: ReactNode; children?: ReactNode; className?: string }) {
  return (
    <div role={tone === 'danger' ? 'alert' : 'status'} className={cn('rounded-md border px-4 py-3 text-sm', TONES[tone], className)}>
      {title && <p className="font-semibold">{title}</p>}
      {children && <div className={cn(title ? 'mt-1' : undefined, 'space-y-1')}>{children}</div>}
    </div>
  );
}

/** Plain words for the statuses people meet. */
function explainStatus(error: ApiError): string | null {
  if (error.isStale) {
    return 'Someone else saved a change to this record after you opened it. The form now shows the record as it stands; check it, make your change again and save.';
  }
  switch (error.status) {
    case 0:
      return null;
    case 403:
      return 'Your role does not allow this. Ask a project manager or the administrator if you need it.';
    case 404:
      return 'It may have been deleted, or you are not a member of this project.';
    default:
      return error.status >= 500 ? 'The server failed to answer. Try again; if it keeps happening, tell the administrator.' : null;
  }
}

/**
 * Our headings for failed requests. The server's problem titles are the HTTP reason phrases
 * ("Unauthorized", "Conflict"), which read oddly to a crew — and "Conflict" is also our word for
 * a clearance short of its requirement.
 */
const PROBLEM_HEADINGS: Record<number, string> = {
  400: 'Not accepted: check these values',
  401: 'Not signed in',
  403: 'Not allowed for your role',
  404: 'Not found',
  409: 'Not saved',
  413: 'Too large',
  415: 'File type not accepted',
  429: 'Too many attempts',
  500: 'Server error',
};

/**
 * Shows a failed request: our heading for its status, the problem's detail, and its field errors
 * except those a form already shows beside its inputs (`fields`).
 */
export function ProblemAlert({ error, fields = [], className }: { error: unknown; fields?: readonly string[]; className?: string }) {
  if (!error) return null;
  if (!isApiError(error)) {
    return (
      <Alert tone="danger" title="Something went wrong" className={className}>
        <p>{error instanceof Error ? error.message : String(error)}</p>
      </Alert>
    );
  }
  const { problem } = error;
  const explanation = explainStatus(error);
  const fieldErrors = error.fieldErrors.filter((e) => !fields.includes(e.path));
  // A stale version gets our own wording: the form has already been refilled with the current record.
  const title = error.isStale ? 'Not saved: someone else changed this first' : (PROBLEM_HEADINGS[problem.status] ?? problem.title);
  const detail = error.isStale ? null : problem.detail;
  return (
    <Alert tone="danger" title={title} className={className}>
      {detail && detail !== title && <p>{detail}</p>}
      {explanation && <p>{explanation}</p>}
      {fieldErrors.length > 0 && (
        <ul className="list-disc pl-5">
          {fieldErrors.map((e) => (
            <li key={`${e.path}:${e.message}`}>
              {e.path ? <code className="font-mono text-xs">{e.path}</code> : null} {e.message}
            </li>
          ))}
        </ul>
      )}
    </Alert>
  );
}
