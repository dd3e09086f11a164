import type { ReactNode } from 'react';
import { FlexRender, type RowData, type Table, type TableFeatures } from '@tanstack/react-table';
import { column_getCanSort, column_getIsSorted, column_getToggleSortingHandler, row_getVisibleCells } from '@tanstack/react-table/static-functions';
import { cn } from './cn';
import { TableFrame, tableClasses } from './data-table';

/**
 * What a column of a {@link SortableTable} may say about itself. Register it on the table's
 * features (`tableFeatures({ ..., columnMeta: {} as SortableColumnMeta })`) so `meta` is typed.
 */
export interface SortableColumnMeta {
  /** Right-align the header and the figures (tabular digits). */
  numeric?: boolean;
}

function metaOf(meta: unknown): SortableColumnMeta {
  return (meta as SortableColumnMeta | undefined) ?? {};
}

const SORT_ARIA = { asc: 'ascending', desc: 'descending' } as const;
const SORT_MARK = { asc: '▲', desc: '▼' } as const;

/**
 * The body of a register table made with TanStack Table (`useTable`): the header row, where a
 * sortable column's header is a button that shows and toggles its order (`aria-sort` on the
 * header cell), and the rows the table's row model gives — sorted and filtered by the table,
 * hidden columns left out. Same frame as {@link TableFrame}: a labelled region scrolling
 * sideways with the first column held in place. With `emptyText`, a table with no rows to show
 * gives way to that sentence ("No holes match these filters.").
 *
 * It reads the table through TanStack's static functions, so any feature set works as long as
 * it has `rowSortingFeature`; columns without a sort function (display columns) get a plain
 * header.
 */
export function SortableTable<TFeatures extends TableFeatures, TData extends RowData>({ table, label, caption, emptyText, rowClassName }: {
  table: Table<TFeatures, TData>;
  /** The region's accessible name ("Conflicts"). */
  label: string;
  /** The screen-reader caption ("Conflicts; column headers sort"). */
  caption: string;
  emptyText?: string;
  /** Extra classes for a body row, from its data (a row that differs in kind, e.g. not yet on the server). */
  rowClassName?: (row: TData) => string | undefined;
}) {
  const rows = table.getRowModel().rows;
  if (emptyText !== undefined && rows.length === 0) {
    return <p className="rounded-md border border-ink-200 bg-white px-4 py-6 text-center text-sm text-ink-600">{emptyText}</p>;
  }
  return (
    <TableFrame
      label={label}
      caption={caption}
      head={table.getHeaderGroups().map((group) => (
        <tr key={group.id}>
          {group.headers.map((header, i) => {
            const { numeric } = metaOf(header.column.columnDef.meta);
            const sorted = column_getIsSorted(header.column);
            return (
              <th key={header.id} scope="col" aria-sort={sorted ? SORT_ARIA[sorted] : undefined} className={tableClasses.columnHeader({ numeric, first: i === 0 })}>
                {column_getCanSort(header.column) ? (
                  <button
                    type="button"
                    onClick={column_getToggleSortingHandler(header.column)}
                    className={cn('inline-flex min-h-8 items-end gap-1 text-left uppercase hover:text-ink-900', numeric && 'flex-row-reverse text-right')}
                  >
                    <span>
                      <FlexRender header={header} />
                    </span>
                    <span aria-hidden className="text-ink-400">
                      {sorted ? SORT_MARK[sorted] : '↕'}
                    </span>
                  </button>
                ) : (
                  <FlexRender header={header} />
                )}
              </th>
            );
          })}
        </tr>
      ))}
    >
      {rows.map((row) => (
        <tr key={row.id} className={cn(tableClasses.row, rowClassName?.(row.original))}>
          {row_getVisibleCells(row).map((cell, i) => {
            const { numeric } = metaOf(cell.column.columnDef.meta);
            return i === 0 ? (
              <th key={cell.id} scope="row" className={tableClasses.rowHeader({})}>
                <FlexRender cell={cell} />
              </th>
            ) : (
              <td key={cell.id} className={tableClasses.cell({ numeric })}>
                <FlexRender cell={cell} />
              </td>
            );
          })}
        </tr>
      ))}
    </TableFrame>
  );
}

/** A second, smaller line under a header or a cell's main text ("offset, ft", "surveyed"). */
export function CellNote({ children }: { children: ReactNode }) {
  return <span className="block text-xs font-normal text-ink-500 normal-case">{children}</span>;
}
