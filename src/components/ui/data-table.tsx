import { useEffect, useRef, useState, type ReactNode, type RefObject } from 'react';
import { cn } from './cn';

/**
 * The look every register table shares (plain {@link DataTable} and the sortable
 * `SortableTable`): a labelled region that scrolls sideways on narrow screens, a
 * screen-reader caption, and the first column held in place so each row stays identifiable.
 */
export function TableFrame({ label, caption, head, children, className }: {
  /** The region's accessible name. */
  label: string | undefined;
  caption: ReactNode;
  /** The header row(s). */
  head: ReactNode;
  /** The body rows. */
  children: ReactNode;
  className?: string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const more = useMoreToTheRight(ref);
  return (
    <div className="relative">
      {more && (
        <p className="mb-1 text-right text-xs text-ink-500" aria-hidden>
          More columns: scroll the table sideways →
        </p>
      )}
      <div ref={ref} className={cn('relative overflow-x-auto rounded-lg border border-ink-200 bg-white', className)} tabIndex={0} role="region" aria-label={label}>
        <table className="min-w-full border-collapse text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">{head}</thead>
          <tbody>{children}</tbody>
        </table>
      </div>
      {more && <div aria-hidden className="pointer-events-none absolute right-0 bottom-0 h-[calc(100%-1.25rem)] w-8 rounded-r-lg bg-linear-to-l from-ink-900/15 to-transparent" />}
    </div>
  );
}

/**
 * True while a scrolling box has columns hidden to its right, so the table can say so: wide
 * registers on a phone (or a narrow window) otherwise look complete when they are not.
 */
function useMoreToTheRight(ref: RefObject<HTMLDivElement | null>): boolean {
  const [more, setMore] = useState(false);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const update = () => setMore(el.scrollWidth - el.clientWidth - el.scrollLeft > 4);
    update();
    el.addEventListener('scroll', update, { passive: true });
    const observer = typeof ResizeObserver === 'undefined' ? null : new ResizeObserver(update);
    observer?.observe(el);
    if (el.firstElementChild) observer?.observe(el.firstElementChild);
    return () => {
      el.removeEventListener('scroll', update);
      observer?.disconnect();
    };
  }, [ref]);
  return more;
}

/** Class names of a {@link TableFrame}'s rows and cells. */
export const tableClasses = {
  /** A column header; the first one stays in place when the table scrolls sideways. */
  columnHeader: (options: { numeric?: boolean; first?: boolean }, className?: string) =>
    cn('border-b border-ink-200 px-3 py-2 align-bottom whitespace-nowrap', options.numeric && 'text-right', options.first && 'sticky left-0 z-10 bg-ink-50', className),
  row: 'group border-b border-ink-100 last:border-b-0',
  /** The first cell of a body row (a row header), held in place. */
  rowHeader: (options: { wrap?: boolean }, className?: string) =>
    cn('sticky left-0 z-10 bg-white px-3 py-2.5 text-left align-top group-hover:bg-ink-50', options.wrap ? 'whitespace-normal' : 'whitespace-nowrap', className),
  /** Any other body cell; figures are right-aligned with tabular digits. */
  cell: (options: { numeric?: boolean; wrap?: boolean }, className?: string) =>
    cn('px-3 py-2.5 align-top group-hover:bg-ink-50', options.wrap ? 'whitespace-normal' : 'whitespace-nowrap', options.numeric && 'text-right tabular', className),
};

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
 * place so each row stays identifiable. One DOM for every screen size. For a table people
 * sort or filter, use `SortableTable` (./sortable-table) with TanStack Table.
 */
export function DataTable<T>({ caption, columns, rows, rowKey, className }: {
  caption: ReactNode;
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string | number;
  className?: string;
}) {
  return (
    <TableFrame
      label={typeof caption === 'string' ? caption : undefined}
      caption={caption}
      className={className}
      head={
        <tr>
          {columns.map((column, i) => (
            <th key={column.key} scope="col" className={tableClasses.columnHeader({ numeric: column.numeric, first: i === 0 }, column.className)}>
              {column.header}
            </th>
          ))}
        </tr>
      }
    >
      {rows.map((row) => (
        <tr key={rowKey(row)} className={tableClasses.row}>
          {columns.map((column, i) =>
            i === 0 ? (
              <th key={column.key} scope="row" className={tableClasses.rowHeader({ wrap: column.wrap }, cn('font-medium', column.className))}>
                {column.wrap ? <div className="w-32 sm:w-auto sm:max-w-72 sm:min-w-40">{column.cell(row)}</div> : column.cell(row)}
              </th>
            ) : (
              <td key={column.key} className={tableClasses.cell({ numeric: column.numeric, wrap: column.wrap }, column.className)}>
                {column.wrap ? <div className="max-w-72 min-w-40">{column.cell(row)}</div> : column.cell(row)}
              </td>
            ),
          )}
        </tr>
      ))}
    </TableFrame>
  );
}
