import type { ReactNode } from 'react';
import { cn } from './cn';

/** One column of a {@link DataTable}. */
export interface Column<T> {
  /** Stable key for React. */
  key: string;
  header: ReactNode;
  cell: (row: T) => ReactNode;
  /** Right-align figures. */
  numeric?: boolean;
  /** Let long text wrap (within a readable width) instead of keeping one line. */
  wrap?: boolean;
  className?: string;
}

/**
 * A read-only table that scrolls sideways on narrow screens, with the first column held in
 * place so each row stays identifiable. One DOM for every screen size.
 */
export function DataTable<T>({ caption, columns, rows, rowKey, className }: {
  caption: ReactNode;
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string | number;
  className?: string;
}) {
  return (
    <div className={cn('relative overflow-x-auto rounded-lg border border-ink-200 bg-white', className)} tabIndex={0} role="region" aria-label={typeof caption === 'string' ? caption : undefined}>
      <table className="min-w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
          <tr>
            {columns.map((column, i) => (
              <th
                key={column.key}
                scope="col"
                className={cn(
                  'border-b border-ink-200 px-3 py-2 align-bottom whitespace-nowrap',
                  column.numeric && 'text-right',
                  i === 0 && 'sticky left-0 z-10 bg-ink-50',
                  column.className,
                )}
              >
                {column.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={rowKey(row)} className="group border-b border-ink-100 last:border-b-0">
              {columns.map((column, i) =>
                i === 0 ? (
                  <th
                    key={column.key}
                    scope="row"
                    className={cn('sticky left-0 z-10 bg-white px-3 py-2.5 text-left align-top font-medium group-hover:bg-ink-50', column.wrap ? 'whitespace-normal' : 'whitespace-nowrap', column.className)}
                  >
                    {column.wrap ? <div className="w-32 sm:w-auto sm:max-w-72 sm:min-w-40">{column.cell(row)}</div> : column.cell(row)}
                  </th>
                ) : (
                  <td
                    key={column.key}
                    className={cn('px-3 py-2.5 align-top group-hover:bg-ink-50', column.wrap ? 'whitespace-normal' : 'whitespace-nowrap', column.numeric && 'text-right tabular', column.className)}
                  >
                    {column.wrap ? <div className="max-w-72 min-w-40">{column.cell(row)}</div> : column.cell(row)}
                  </td>
                ),
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
