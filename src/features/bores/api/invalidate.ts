import type { QueryClient } from '@tanstack/react-query';
import { boreKeys, pitKeys } from './keys';

/**
 * Other features' caches a bore or pit write changes (the server recomputes the clearance
 * register in the same transaction): the conflict register, every clearance report, the project
 * counts and the activity log. By key root, so this feature imports no other feature.
 */
export const AFFECTED_BY_BORE_WRITES = [['clearances'], ['conflicts'], ['projects'], ['activity'], ['holes', 'clearances']] as const;

/** After any write to a bore or a pit: refresh bores, pits and what depends on them. */
export function invalidateAfterBoreWrite(queryClient: QueryClient): Promise<unknown> {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: boreKeys.all }),
    queryClient.invalidateQueries({ queryKey: pitKeys.all }),
    ...AFFECTED_BY_BORE_WRITES.map((key) => queryClient.invalidateQueries({ queryKey: [...key] })),
  ]);
}
