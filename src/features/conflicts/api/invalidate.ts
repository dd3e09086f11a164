import type { QueryClient } from '@tanstack/react-query';
import { AFFECTED_BY_CONFLICT_WRITES, conflictKeys } from './keys';

/** After any write to a conflict: refresh the register (lists, details, history) and what counts conflicts. */
export function invalidateAfterConflictWrite(queryClient: QueryClient): Promise<unknown> {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: conflictKeys.all }),
    ...AFFECTED_BY_CONFLICT_WRITES.map((key) => queryClient.invalidateQueries({ queryKey: [...key] })),
  ]);
}
