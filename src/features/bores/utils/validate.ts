import type { z } from 'zod';
import { formErrorMap as errorMap } from '@/lib/form';

/** Problems by dotted path ("alignment.1.0"), as the server's 400 `errors[].path` names them. */
export type PathErrors = Record<string, string>;

/**
 * Check a body against a shared schema. Returns the parsed body, or the first problem of each
 * path (the same paths the server answers with).
 */
export function validate<S extends z.ZodType>(schema: S, input: unknown): { data: z.output<S>; errors: null } | { data: null; errors: PathErrors } {
  const result = schema.safeParse(input, { error: errorMap });
  if (result.success) return { data: result.data, errors: null };
  const errors: PathErrors = {};
  for (const issue of result.error.issues) {
    const path = issue.path.map(String).join('.');
    if (!(path in errors)) errors[path] = issue.message;
  }
  return { data: null, errors };
}

/**
 * The problems of one list of pairs for the shared vertex editor, from the flat paths: `path.i.0`
 * or `path.i.station` for a cell (by `keys`), `path.i` for a row, `path` for the list.
 */
export function pairErrors(errors: PathErrors, path: string, keys: readonly [string, string] = ['0', '1']) {
  return {
    cellError: (i: number, column: 0 | 1) => errors[`${path}.${i}.${keys[column]}`],
    rowError: (i: number) => errors[`${path}.${i}`],
    listError: errors[path],
  };
}
