import { useId, type ComponentProps, type ReactNode } from 'react';
import { fieldMessage } from '@/lib/form';
import { cn } from './cn';

type FieldError = { message?: string } | undefined;

const CONTROL =
  'block w-full rounded-md border bg-white px-3 text-base text-ink-900 shadow-xs placeholder:text-ink-400 disabled:bg-ink-100 disabled:text-ink-500 sm:text-sm';

function controlClasses(error: FieldError, className?: string): string {
  return cn(
    CONTROL,
    error ? 'border-danger-600 focus-visible:outline-danger-600' : 'border-ink-300 focus-visible:outline-brand-500',
    className,
  );
}

interface FieldShellProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: FieldError;
  required?: boolean;
  className?: string;
  children: ReactNode;
}

/** Label above, control, then a hint or the error message that names the field. */
export function FieldShell({ id, label, hint, error, required, className, children }: FieldShellProps) {
  return (
    <div className={cn('flex flex-col gap-1', className)}>
      {/* The label holds only the field's name (tests and screen readers find fields by it); the required mark sits beside it. */}
      <div className="flex items-baseline gap-0.5">
        <label htmlFor={id} className="text-sm font-medium text-ink-800">
          {label}
        </label>
        {required && (
          <span className="text-sm text-danger-600" aria-hidden title="Required">
            *
          </span>
        )}
      </div>
      {children}
      {error ? (
        <p id={`${id}-error`} className="text-sm text-danger-700">
          {fieldMessage(label, error.message)}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="text-xs text-ink-500">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

/** The id of the hint or error a control is described by. */
export function describedBy(id: string, error: FieldError, hint: ReactNode): string | undefined {
  if (error) return `${id}-error`;
  if (hint) return `${id}-hint`;
  return undefined;
}

type CommonProps = { label: string; hint?: ReactNode; error?: FieldError; wrapperClassName?: string };

/** A labelled text input; pass `register(...)` props straight in. */
export function TextField({ label, hint, error, wrapperClassName, className, id: givenId, required, ...props }: CommonProps & ComponentProps<'input'>) {
  const autoId = useId();
  const id = givenId ?? autoId;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} required={required} className={wrapperClassName}>
      <input
        id={id}
        className={controlClasses(error, cn('min-h-11', className))}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        aria-required={required || undefined}
        {...props}
      />
    </FieldShell>
  );
}

/** A labelled number input with its unit shown inside the box. */
export function NumberField({ unit, ...props }: CommonProps & ComponentProps<'input'> & { unit?: string }) {
  const autoId = useId();
  const { label, hint, error, wrapperClassName, className, id: givenId, required, ...rest } = props;
  const id = givenId ?? autoId;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} required={required} className={wrapperClassName}>
      <div className="relative">
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          className={controlClasses(error, cn('min-h-11 tabular', unit && 'pr-16', className))}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(id, error, hint)}
          aria-required={required || undefined}
          {...rest}
        />
        {unit && (
          <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-sm text-ink-500">{unit}</span>
        )}
      </div>
    </FieldShell>
  );
}

/** A labelled select. */
export function SelectField({ label, hint, error, wrapperClassName, className, id: givenId, required, children, ...props }: CommonProps & ComponentProps<'select'>) {
  const autoId = useId();
  const id = givenId ?? autoId;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} required={required} className={wrapperClassName}>
      <select
        id={id}
        className={controlClasses(error, cn('min-h-11 pr-8', className))}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        aria-required={required || undefined}
        {...props}
      >
        {children}
      </select>
    </FieldShell>
  );
}

/** A labelled multi-line text box. */
export function TextAreaField({ label, hint, error, wrapperClassName, className, id: givenId, required, ...props }: CommonProps & ComponentProps<'textarea'>) {
  const autoId = useId();
  const id = givenId ?? autoId;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} required={required} className={wrapperClassName}>
      <textarea
        id={id}
        rows={3}
        className={controlClasses(error, cn('py-2', className))}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        aria-required={required || undefined}
        {...props}
      />
    </FieldShell>
  );
}

/** A labelled checkbox with a generous tap area. */
export function CheckboxField({ label, hint, className, id: givenId, ...props }: { label: string; hint?: ReactNode } & Omit<ComponentProps<'input'>, 'type'>) {
  const autoId = useId();
  const id = givenId ?? autoId;
  return (
    <div className={cn('flex min-h-11 items-start gap-3', className)}>
      <input id={id} type="checkbox" className="mt-1 size-5 accent-brand-700" {...props} />
      <label htmlFor={id} className="text-sm text-ink-800">
        {label}
        {hint && <span className="block text-xs text-ink-500">{hint}</span>}
      </label>
    </div>
  );
}

/** The options of a {@link SelectField}: each value under its label ("usft" → "US survey feet"). */
export function SelectOptions<T extends string>({ values, labels }: { values: readonly T[]; labels: Readonly<Record<T, string>> }) {
  return (
    <>
      {values.map((value) => (
        <option key={value} value={value}>
          {labels[value]}
        </option>
      ))}
    </>
  );
}
