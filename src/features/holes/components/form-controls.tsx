import { useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from '@/components/ui/cn';
import { fieldMessage } from '@/lib/form';
import { describedBy, FieldShell } from '@/components/ui/field';

type FieldError = { message?: string } | undefined;

/**
 * A number input with its unit (and, for elevations, the vertical datum) in a box beside it,
 * a decimal keypad on phones, and the label, hint and error wired for assistive technology.
 */
export function MeasureField({
  label,
  unit,
  datum,
  hint,
  error,
  required,
  className,
  id: givenId,
  ...props
}: { label: string; unit: string; datum?: string; hint?: ReactNode; error?: FieldError; className?: string } & Omit<ComponentProps<'input'>, 'className'>) {
  const autoId = useId();
  const id = givenId ?? autoId;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} required={required} className={className}>
      <div className="flex">
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(id, error, hint)}
          aria-required={required || undefined}
          className={cn(
            'block min-h-12 w-full min-w-0 rounded-l-md border bg-white px-3 text-base text-ink-900 shadow-xs tabular placeholder:text-ink-400 disabled:bg-ink-100 sm:min-h-11 sm:text-sm',
            error ? 'border-danger-600 focus-visible:outline-danger-600' : 'border-ink-300 focus-visible:outline-brand-500',
          )}
          {...props}
        />
        <span className="inline-flex shrink-0 items-center rounded-r-md border border-l-0 border-ink-300 bg-ink-50 px-2.5 text-sm whitespace-nowrap text-ink-600">
          {unit}
          {datum && <span className="ml-1 text-xs text-ink-500">{datum}</span>}
        </span>
      </div>
    </FieldShell>
  );
}

/**
 * A single choice shown as a row of big buttons (native radios underneath, so the group has a
 * name and each option a label). Pass `register(name)` props as `inputProps`.
 */
export function SegmentedChoice<T extends string>({
  legend,
  options,
  inputProps,
  error,
  hint,
  className,
}: {
  legend: string;
  options: readonly { value: T; label: ReactNode; description?: string }[];
  inputProps: Omit<ComponentProps<'input'>, 'type' | 'value'>;
  error?: FieldError;
  hint?: ReactNode;
  className?: string;
}) {
  const id = useId();
  return (
    <fieldset className={cn('min-w-0', className)} aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}>
      <legend className="mb-1 text-sm font-medium text-ink-800">{legend}</legend>
      <div className="flex flex-wrap gap-2">
        {options.map((o) => (
          <label
            key={o.value}
            title={o.description}
            className="relative inline-flex min-h-12 min-w-12 flex-1 cursor-pointer items-center justify-center rounded-md border border-ink-300 bg-white px-3 text-center text-sm font-medium text-ink-800 select-none has-checked:border-brand-700 has-checked:bg-brand-700 has-checked:text-white has-focus-visible:outline-2 has-focus-visible:outline-offset-2 has-focus-visible:outline-brand-500 sm:min-h-11 sm:flex-none"
          >
            <input type="radio" value={o.value} className="sr-only" {...inputProps} />
            {o.label}
          </label>
        ))}
      </div>
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm text-danger-700">
          {fieldMessage(legend, error.message)}
        </p>
      ) : hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-500">
          {hint}
        </p>
      ) : null}
    </fieldset>
  );
}

/** A titled group of fields in the logging form. */
export function FormSection({ title, children, description }: { title: string; children: ReactNode; description?: ReactNode }) {
  return (
    <fieldset className="space-y-4 rounded-lg border border-ink-200 bg-white p-4">
      <legend className="px-1 text-base font-semibold text-ink-900">{title}</legend>
      {description && <div className="-mt-2 text-sm text-ink-600">{description}</div>}
      {children}
    </fieldset>
  );
}
