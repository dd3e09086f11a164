import type { ReactNode } from 'react';

/**
 * The table a stale save shows: one row per field, what the person typed beside what is saved
 * now. The rows are the caller's (plain values for bores and pits, a choice per field for test
 * holes); this draws the frame, the caption and the header every such table shares.
 */
export function CompareTable({ children }: { children: ReactNode }) {
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Your values and the saved values</caption>
        <thead className="text-left text-xs font-semibold text-ink-600 uppercase">
          <tr>
            <th scope="col" className="py-1 pr-2">
              Field
            </th>
            <th scope="col" className="py-1 pr-2">
              Yours
            </th>
            <th scope="col" className="py-1">
              Saved now
            </th>
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
