import type { QueryClient } from '@tanstack/react-query';
import { AFFECTED_BY_HOLE_WRITES, holeKeys } from './keys';

/** After any write to a hole: refresh every hole query (lists, details, photos, activity, clearances) and what depends on holes. */
export function invalidateAfterHoleWrite(queryClient: QueryClient): Promise<unknown> {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: holeKeys.all }),
    ...AFFECTED_BY_HOLE_WRITES.map((key) => queryClient.invalidateQueries({ queryKey: [...key] })),
  ]);
}
