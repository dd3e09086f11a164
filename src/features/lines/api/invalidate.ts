import type { QueryClient } from '@tanstack/react-query';
import { AFFECTED_BY_LINE_WRITES, lineKeys } from './keys';

/** After any write to a line: refresh every line query and what depends on lines (plan & profile, registers, counts). */
export function invalidateAfterLineWrite(queryClient: QueryClient): Promise<unknown> {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: lineKeys.all }),
    ...AFFECTED_BY_LINE_WRITES.map((key) => queryClient.invalidateQueries({ queryKey: [...key] })),
  ]);
}
