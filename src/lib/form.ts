import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type FieldValues, type Path, type UseFormProps, type UseFormSetError } from 'react-hook-form';
import type { z } from 'zod';
import { isApiError } from './api-client';

/**
 * Form helpers shared by every feature: zod schemas from shared/ as the resolver, plain-language
 * messages, and server 400 field errors mapped back onto the inputs.
 */

/** Messages for the cases the shared schemas leave to zod's defaults (empty or non-numeric input). */
export const formErrorMap: z.core.$ZodErrorMap = (issue) => {
  if (issue.code === 'invalid_type') {
    if (issue.input === undefined || issue.input === null || issue.input === '') return 'is required';
    if (issue.expected === 'number') return 'must be a number, with a point for decimals (2.5) and no thousands separators';
  }
  if (issue.code === 'invalid_format' && issue.format === 'email') return 'must be an e-mail address like name@example.com';
  if (issue.code === 'invalid_value') return 'choose one of the listed options';
  return undefined;
};

/** `useForm` bound to a shared zod schema. Inputs are the schema's input type, submit gets its output. */
export function useZodForm<S extends z.ZodType<FieldValues, FieldValues>>(
  schema: S,
  options?: Omit<UseFormProps<z.input<S>, unknown, z.output<S>>, 'resolver'>,
) {
  return useForm<z.input<S>, unknown, z.output<S>>({
    mode: 'onTouched',
    ...options,
    resolver: zodResolver(schema, { error: formErrorMap }),
  });
}

/**
 * For `register(name, { setValueAs })`: empty input → null, otherwise a number (NaN fails
 * validation). A comma is never read: "2,5" may be a decimal comma (2.5) or a thousands
 * separator (25), and guessing wrong puts a line ten times too deep, so it is refused.
 */
export function asNumberOrNull(value: unknown): number | null {
  if (value === '' || value === null || value === undefined) return null;
  if (typeof value === 'number') return value;
  const text = String(value).trim();
  return text === '' ? null : Number(text);
}

/** Like {@link asNumberOrNull} but empty → undefined, so a required number says "is required". */
export function asNumberOrUndefined(value: unknown): number | undefined {
  const n = asNumberOrNull(value);
  return n === null ? undefined : n;
}

/** Empty text → null (for optional text fields the schemas accept as nullish). */
export function asTextOrNull(value: unknown): string | null {
  if (typeof value !== 'string') return null;
  return value.trim() === '' ? null : value;
}

/** A field message that names the field: "Email is required", "Password: Too long". */
export function fieldMessage(label: string, message: string | undefined): string {
  if (!message) return `${label} is not valid`;
  const first = message.charAt(0);
  return first === first.toLowerCase() && first !== first.toUpperCase() ? `${label} ${message}` : `${label}: ${message}`;
}

/**
 * Put the field errors of a server answer (a 400, or a 409 on a unique value) onto the form.
 * Returns the errors that match no field (shown with the form's general error).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly string[],
): { path: string; message: string }[] {
  if (!isApiError(error)) return [];
  const unmatched: { path: string; message: string }[] = [];
  for (const fieldError of error.fieldErrors) {
    if (fields.includes(fieldError.path)) {
      setError(fieldError.path as Path<T>, { type: 'server', message: fieldError.message });
    } else {
      unmatched.push(fieldError);
    }
  }
  return unmatched;
}
