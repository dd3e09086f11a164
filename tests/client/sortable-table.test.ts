/**
 * The shared register table (src/components/ui/sortable-table.tsx) rendered to HTML with
 * react-dom/server around a real TanStack Table v9 `useTable`: what the conflict and test-hole
 * registers rely on — sort buttons and `aria-sort`, the order the table's row model gives,
 * hidden columns left out, figures right-aligned, the first cell a row header, and the sentence
 * shown when filters leave no rows. The markup of the plain DataTable is checked beside it,
 * since both draw the same frame.
 */
import { createElement, type ReactNode } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import {
  columnFilteringFeature,
  columnVisibilityFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_equals,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  tableFeatures,
  useTable,
  type ColumnFiltersState,
  type SortingState,
} from '@tanstack/react-table';
import { describe, expect, it } from 'vitest';
import { DataTable } from '@/components/ui/data-table';
import { SortableTable, type SortableColumnMeta } from '@/components/ui/sortable-table';

interface Pipe {
  id: number;
  label: string;
  depth: number | null;
  kind: string;
}

const PIPES: Pipe[] = [
  { id: 1, label: 'W-10', depth: 4.5, kind: 'water' },
  { id: 2, label: 'W-2', depth: null, kind: 'water' },
  { id: 3, label: 'G-7', depth: 1.25, kind: 'gas' },
];

const features = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  columnVisibilityFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
  filterFns: { equals: filterFn_equals },
  columnMeta: {} as SortableColumnMeta,
});
const helper = createColumnHelper<typeof features, Pipe>();
const columns = helper.columns([
  helper.accessor('label', { header: 'Line', sortFn: 'alphanumeric' }),
  // `sortUndefined` places undefined, not null: blanks are read as undefined (as the conflict register does).
  helper.accessor((r) => r.depth ?? undefined, { id: 'depth', header: 'Depth', sortFn: 'basic', sortUndefined: 'last', meta: { numeric: true }, cell: (info) => info.getValue() ?? '—' }),
  helper.display({ id: 'note', header: 'Note', cell: (info) => `pipe ${info.row.original.id}` }),
  helper.accessor('kind', { header: 'Kind', filterFn: 'equals' }),
]);

function Pipes({ sorting, filters = [], hidden = {}, emptyText }: { sorting: SortingState; filters?: ColumnFiltersState; hidden?: Record<string, boolean>; emptyText?: string }): ReactNode {
  const table = useTable({
    features,
    columns,
    data: PIPES,
    getRowId: (r) => String(r.id),
    initialState: { sorting, columnFilters: filters, columnVisibility: hidden },
  });
  return createElement(SortableTable<typeof features, Pipe>, { table, label: 'Pipes', caption: 'Pipes; column headers sort', emptyText });
}

const render = (props: Parameters<typeof Pipes>[0]) => renderToStaticMarkup(createElement(Pipes, props));

/** The text of each body row's first cell, in order. */
const firstCells = (html: string) => [...html.matchAll(/<th scope="row"[^>]*>([^<]*)<\/th>/g)].map((m) => m[1]);

describe('the shared sortable register table', () => {
  it('draws a labelled, captioned region whose sortable headers are buttons and says which column is sorted', () => {
    const html = render({ sorting: [{ id: 'label', desc: false }] });
    expect(html).toContain('role="region" aria-label="Pipes"');
    expect(html).toContain('<caption class="sr-only">Pipes; column headers sort</caption>');
    // The sorted column's header says so; the others carry no aria-sort.
    expect(html.match(/aria-sort="[a-z]+"/g)).toEqual(['aria-sort="ascending"']);
    expect(html).toMatch(/<th scope="col" aria-sort="ascending"[^>]*><button type="button"[^>]*><span>Line<\/span><span aria-hidden="true" class="text-ink-400">▲<\/span>/);
    expect(html).toMatch(/<button type="button"[^>]*><span>Depth<\/span><span aria-hidden="true" class="text-ink-400">↕<\/span>/);
    // A display column has nothing to sort by: a plain header, no button.
    expect(html).toMatch(/<th scope="col" class="[^"]*">Note<\/th>/);
  });

  it('lists the rows in the order the table sorted them: labels by natural order, blanks last either way', () => {
    // Natural ("alphanumeric") order puts W-2 before W-10 — common practice for numbered labels.
    expect(firstCells(render({ sorting: [{ id: 'label', desc: false }] }))).toEqual(['G-7', 'W-2', 'W-10']);
    expect(firstCells(render({ sorting: [{ id: 'label', desc: true }] }))).toEqual(['W-10', 'W-2', 'G-7']);
    // The depth column is not first, so read the row headers: 1.25 (G-7), 4.5 (W-10), then the blank (W-2).
    expect(firstCells(render({ sorting: [{ id: 'depth', desc: false }] }))).toEqual(['G-7', 'W-10', 'W-2']);
    expect(firstCells(render({ sorting: [{ id: 'depth', desc: true }] }))).toEqual(['W-10', 'G-7', 'W-2']);
    expect(render({ sorting: [{ id: 'depth', desc: true }] })).toContain('aria-sort="descending"');
  });

  it('right-aligns numeric columns in header and body, and holds the first cell of each row as its header', () => {
    const html = render({ sorting: [{ id: 'label', desc: false }] });
    expect(html).toMatch(/<td class="[^"]*text-right tabular[^"]*">1.25<\/td>/);
    expect(html).toMatch(/<td class="[^"]*whitespace-nowrap[^"]*">pipe 3<\/td>/);
    expect(html).not.toMatch(/<td class="[^"]*text-right[^"]*">pipe 3<\/td>/);
    expect(html).toMatch(/<th scope="row" class="sticky left-0 z-10[^"]*">G-7<\/th>/);
    expect(html).toMatch(/<th scope="col" class="[^"]*text-right[^"]*"><button type="button" class="[^"]*flex-row-reverse text-right"><span>Depth/);
  });

  it('leaves hidden columns out of the header and the rows', () => {
    const shown = render({ sorting: [], hidden: {} });
    const hidden = render({ sorting: [], hidden: { kind: false } });
    expect(shown).toContain('<span>Kind</span>');
    expect(shown).toContain('>gas</td>');
    expect(hidden).not.toContain('Kind');
    expect(hidden).not.toContain('gas');
    expect(hidden.match(/<td /g)).toHaveLength(3 * 2);
  });

  it('shows only the rows the filters keep, and the given sentence when they keep none', () => {
    expect(firstCells(render({ sorting: [{ id: 'label', desc: false }], filters: [{ id: 'kind', value: 'water' }] }))).toEqual(['W-2', 'W-10']);
    const none = render({ sorting: [], filters: [{ id: 'kind', value: 'sewer' }], emptyText: 'No pipes match these filters.' });
    expect(none).toBe('<p class="rounded-md border border-ink-200 bg-white px-4 py-6 text-center text-sm text-ink-600">No pipes match these filters.</p>');
    // Without a sentence the (empty) table stays, header and all.
    const bare = render({ sorting: [], filters: [{ id: 'kind', value: 'sewer' }] });
    expect(bare).toContain('<tbody></tbody>');
    expect(bare).toContain('<span>Line</span>');
  });

  it('draws the same frame as the plain DataTable, whose row headers are bold', () => {
    const plain = renderToStaticMarkup(
      createElement(DataTable<Pipe>, {
        caption: 'Pipes',
        rows: PIPES,
        rowKey: (p) => p.id,
        columns: [
          { key: 'label', header: 'Line', cell: (p) => p.label },
          { key: 'depth', header: 'Depth', numeric: true, cell: (p) => p.depth ?? '—' },
        ],
      }),
    );
    const sortable = render({ sorting: [] });
    const frame = (html: string) => html.slice(0, html.indexOf('<tr')).replace(/<caption class="sr-only">[^<]*<\/caption>/, '<caption/>');
    expect(frame(plain)).toBe(frame(sortable));
    expect(plain).toMatch(/<th scope="row" class="[^"]*font-medium[^"]*">W-10<\/th>/);
    expect(plain).toMatch(/<td class="[^"]*text-right tabular[^"]*">4.5<\/td>/);
  });
});
