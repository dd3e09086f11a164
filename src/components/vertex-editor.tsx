import { useId, useState, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { fieldMessage } from '@/lib/form';
import { parsePairs, type PairParseOptions } from '@/lib/parse-pairs';

/** One column of the pair: its row key, its name in labels and messages ("easting", "station"). */
export interface PairColumn<K extends string> {
  key: K;
  name: string;
  /** Added to the input's accessible name, e.g. "(m, NAVD 88)". */
  labelSuffix?: string;
  placeholder: string;
  /** "decimal" for numbers; leave out for stations (they carry a "+"). */
  inputMode?: 'decimal' | 'text';
}

/**
 * A short list of value pairs typed row by row (add, remove) or pasted from a spreadsheet or a
 * CAD / survey list: grid E/N vertices of an alignment, a plan path or a pit footprint, or the
 * station–elevation points of a profile. Controlled: the rows are the text typed, and every change
 * hands all of them to `onChange`; the caller's schema checks them and hands back problems by row
 * and column. The paste box (`parsePairs`) replaces the rows or adds to their end, and takes
 * nothing from a paste with a bad line, naming each such line by number.
 */
/** The vertex editor's props (see VertexEditor). */
export interface VertexEditorProps<K extends string> {
  /** The fieldset's legend. */
  legend: ReactNode;
  /** A line under the legend (frame, units, order). */
  description?: ReactNode;
  /** "Vertex", "Corner", "Profile point", "Ground point": names each row. */
  what: string;
  /** "vertices", "corners", "points": names the paste box. */
  plural: string;
  /** "alignment", "path", "ground profile": in "Replace the … with these" and the list's messages. */
  listName: string;
  /** Names the list in its own problem ("Plan path needs …"); by default `listName`, capitalised. */
  listLabel?: string;
  columns: readonly [PairColumn<K>, PairColumn<K>];
  rows: Record<K, string>[];
  onChange: (rows: Record<K, string>[]) => void;
  onBlur?: () => void;
  minRows: number;
  /** The problem with row `index`'s first (0) or second (1) value, if any. */
  cellError: (index: number, column: 0 | 1) => string | undefined;
  /** A problem with row `index` as a whole, if any. */
  rowError?: (index: number) => string | undefined;
  /** A problem with the list as a whole ("needs at least two vertices"). */
  listError?: string;
  /** How a pasted line's values are read: their names, and a reader for the first (a station). */
  parse?: PairParseOptions;
}

export function VertexEditor<K extends string>({
  legend,
  description,
  what,
  plural,
  listName,
  listLabel,
  columns,
  rows,
  onChange,
  onBlur,
  minRows,
  cellError,
  rowError,
  listError,
  parse,
}: VertexEditorProps<K>) {
  const id = useId();
  const [first, second] = columns;
  const [pasteOpen, setPasteOpen] = useState(false);
  const [pasted, setPasted] = useState('');
  const [pasteErrors, setPasteErrors] = useState<{ line: number; message: string }[]>([]);
  const row = (a: string, b: string) => ({ [first.key]: a, [second.key]: b }) as Record<K, string>;
  const set = (i: number, key: K, value: string) => onChange(rows.map((r, j) => (j === i ? { ...r, [key]: value } : r)));

  const usePasted = (mode: 'replace' | 'append') => {
    const parsed = parsePairs(pasted, { names: [first.name, second.name], ...parse });
    if (parsed.errors.length > 0 || parsed.cells.length === 0) {
      setPasteErrors(parsed.errors.length > 0 ? parsed.errors : [{ line: 1, message: `nothing to read: paste one “${first.name}, ${second.name}” a line` }]);
      return;
    }
    setPasteErrors([]);
    const added = parsed.cells.map(([a, b]) => row(a, b));
    const kept = mode === 'append' ? rows.filter((r) => r[first.key].trim() !== '' || r[second.key].trim() !== '') : [];
    onChange([...kept, ...added]);
    setPasted('');
    setPasteOpen(false);
    onBlur?.();
  };

  const input = 'min-h-11 w-full min-w-0 rounded-md border bg-white px-2 text-base tabular sm:text-sm';
  const label = (i: number, c: PairColumn<K>) => `${what} ${i + 1} ${c.name}${c.labelSuffix ? ` ${c.labelSuffix}` : ''}`;

  return (
    <fieldset className="min-w-0 space-y-2" aria-describedby={listError ? `${id}-error` : undefined}>
      <legend className="text-sm font-medium text-ink-800">{legend}</legend>
      {description && <p className="text-xs text-ink-500">{description}</p>}
      {rows.length > 0 && (
        <ol className="space-y-2" aria-label={`${what} rows`}>
          {rows.map((r, i) => {
            const errs = [cellError(i, 0), cellError(i, 1)] as const;
            const whole = rowError?.(i);
            return (
              <li key={i} className="space-y-1">
                <div className="grid grid-cols-[2rem_minmax(0,1fr)_minmax(0,1fr)_auto] items-center gap-2">
                  <span className="text-sm text-ink-600 tabular">{i + 1}</span>
                  {columns.map((c, k) => (
                    <input
                      key={c.key}
                      aria-label={label(i, c)}
                      value={r[c.key]}
                      inputMode={c.inputMode ?? 'decimal'}
                      autoComplete="off"
                      spellCheck={false}
                      placeholder={c.placeholder}
                      onChange={(e) => set(i, c.key, e.target.value)}
                      onBlur={onBlur}
                      aria-invalid={errs[k] || whole ? true : undefined}
                      className={cn(input, errs[k] || whole ? 'border-danger-600' : 'border-ink-300')}
                    />
                  ))}
                  <Button
                    variant="secondary"
                    size="sm"
                    aria-label={`Remove ${what.toLowerCase()} ${i + 1}`}
                    disabled={rows.length <= minRows}
                    onClick={() => {
                      onChange(rows.filter((_, j) => j !== i));
                      onBlur?.();
                    }}
                  >
                    ✕
                  </Button>
                </div>
                {(errs[0] || errs[1] || whole) && (
                  <p className="pl-10 text-sm text-danger-700">
                    {[errs[0] && fieldMessage(`${what} ${i + 1} ${first.name}`, errs[0]), errs[1] && fieldMessage(`${what} ${i + 1} ${second.name}`, errs[1]), whole && fieldMessage(`${what} ${i + 1}`, whole)]
                      .filter(Boolean)
                      .join('; ')}
                  </p>
                )}
              </li>
            );
          })}
        </ol>
      )}
      {listError && (
        <p id={`${id}-error`} className="text-sm text-danger-700">
          {fieldMessage(listLabel ?? listName.charAt(0).toUpperCase() + listName.slice(1), listError)}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" size="sm" onClick={() => onChange([...rows, row('', '')])}>
          Add {what.toLowerCase()}
        </Button>
        <Button variant="secondary" size="sm" aria-expanded={pasteOpen} aria-controls={`${id}-paste-box`} onClick={() => setPasteOpen(!pasteOpen)}>
          Paste {plural}
        </Button>
      </div>
      {pasteOpen && (
        <div id={`${id}-paste-box`} className="space-y-2 rounded-md border border-ink-200 bg-ink-50 p-3">
          <label htmlFor={`${id}-paste`} className="block text-sm font-medium text-ink-800">
            Pasted {plural}
          </label>
          <textarea
            id={`${id}-paste`}
            rows={4}
            value={pasted}
            spellCheck={false}
            onChange={(e) => setPasted(e.target.value)}
            aria-describedby={`${id}-paste-hint`}
            className="block w-full rounded-md border border-ink-300 bg-white px-3 py-2 font-mono text-base sm:text-sm"
          />
          <p id={`${id}-paste-hint`} className="text-xs text-ink-500">
            One {what.toLowerCase()} a line, {first.name} then {second.name}, separated by a comma, semicolon, tab (two spreadsheet cells) or spaces. A header line is skipped.
          </p>
          {pasteErrors.length > 0 && (
            <div role="alert" className="text-sm text-danger-700">
              <p>Nothing was taken from the paste; correct these lines:</p>
              <ul className="list-disc pl-5" aria-label="Pasted lines not read">
                {pasteErrors.slice(0, 8).map((e) => (
                  <li key={`${e.line}:${e.message}`} className="break-words">
                    Line {e.line}: {e.message}
                  </li>
                ))}
              </ul>
            </div>
          )}
          <div className="flex flex-wrap gap-2">
            <Button size="sm" disabled={pasted.trim() === ''} onClick={() => usePasted('replace')}>
              Replace the {listName} with these
            </Button>
            <Button variant="secondary" size="sm" disabled={pasted.trim() === ''} onClick={() => usePasted('append')}>
              Add them at the end
            </Button>
          </div>
        </div>
      )}
    </fieldset>
  );
}

/** Grid easting and northing columns (rows `{ e, n }`), for alignments, plan paths and pit footprints. */
export const EN_COLUMNS: readonly [PairColumn<'e' | 'n'>, PairColumn<'e' | 'n'>] = [
  { key: 'e', name: 'easting', placeholder: 'E' },
  { key: 'n', name: 'northing', placeholder: 'N' },
];

/** The vertex editor for grid E/N rows, its legend naming the list, the axes and the unit: "Alignment (easting, northing in m)". */
export function GridVertexEditor({ name, unit, ...props }: Omit<VertexEditorProps<'e' | 'n'>, 'columns' | 'legend'> & { name: string; unit: string }) {
  return (
    <VertexEditor
      {...props}
      columns={EN_COLUMNS}
      legend={
        <>
          {name} <span className="font-normal text-ink-500">(easting, northing in {unit})</span>
        </>
      }
    />
  );
}
