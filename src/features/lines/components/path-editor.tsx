import { useState } from 'react';
import type { GridPoint } from '@shared/schemas/common';
import { Button } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { cn } from '@/components/ui/cn';
import { asNumberOrNull, fieldMessage } from '@/lib/form';
import { parseVertices } from '../utils/parse-vertices';

type Row = { e: string; n: string };
type Msg = { message?: string } | undefined;
/** What react-hook-form reports for `path`: a message for the whole list, or per vertex and coordinate. */
export type PathErrors = (Msg & { [index: number]: Msg | (Msg & { 0?: Msg; 1?: Msg }) | undefined }) | undefined;

const toText = (v: number | null | undefined) => (v == null || Number.isNaN(v) ? '' : String(v));
const rowsOf = (path: readonly (readonly (number | null)[])[] | undefined): Row[] => {
  const rows = (path ?? []).map((p) => ({ e: toText(p[0]), n: toText(p[1]) }));
  while (rows.length < 2) rows.push({ e: '', n: '' });
  return rows;
};
/** A vertex as the schema reads it: blank → null ("is required"), bad text → NaN ("must be a number"). */
const pointOf = (r: Row) => [asNumberOrNull(r.e), asNumberOrNull(r.n)] as unknown as GridPoint;

/**
 * The plan path as grid E/N vertices in the project's unit: a list of rows to type into (add,
 * remove), and a box that takes a pasted list ("E, N" or "E N" per line) to replace the path or
 * extend it at its end. Every change hands the whole path to `onChange`; the schema checks it.
 */
export function PathEditor({
  value,
  onChange,
  onBlur,
  errors,
  unitSymbol,
  crsCode,
}: {
  value: readonly (readonly (number | null)[])[] | undefined;
  onChange: (path: GridPoint[]) => void;
  onBlur: () => void;
  errors: PathErrors;
  unitSymbol: string;
  crsCode: string;
}) {
  const [rows, setRows] = useState<Row[]>(() => rowsOf(value));
  const [pasted, setPasted] = useState('');
  const [pasteErrors, setPasteErrors] = useState<{ line: number; message: string }[]>([]);

  const change = (next: Row[]) => {
    setRows(next);
    onChange(next.map(pointOf));
  };
  const setCell = (index: number, key: keyof Row, text: string) => change(rows.map((r, i) => (i === index ? { ...r, [key]: text } : r)));
  const usePasted = (mode: 'replace' | 'append') => {
    const parsed = parseVertices(pasted);
    if (parsed.errors.length > 0 || parsed.points.length === 0) {
      setPasteErrors(parsed.errors.length > 0 ? parsed.errors : [{ line: 1, message: 'nothing to read: paste one “E, N” per line' }]);
      return;
    }
    setPasteErrors([]);
    const added = parsed.points.map(([e, n]) => ({ e: String(e), n: String(n) }));
    const kept = mode === 'append' ? rows.filter((r) => r.e.trim() !== '' || r.n.trim() !== '') : [];
    change([...kept, ...added]);
    setPasted('');
    onBlur();
  };

  const listError = errors?.message;
  const cellError = (index: number, axis: 0 | 1): string | undefined => {
    const vertex = errors?.[index] as (Msg & { 0?: Msg; 1?: Msg }) | undefined;
    return vertex?.[axis]?.message ?? (axis === 0 ? vertex?.message : undefined);
  };

  return (
    <fieldset className="space-y-3" aria-describedby="path-help">
      <legend className="text-sm font-medium text-ink-800">
        Plan path<span className="text-danger-600" aria-hidden title="Required"> *</span>
      </legend>
      <p id="path-help" className="text-xs text-ink-500">
        Grid easting and northing of each vertex in {crsCode}, in {unitSymbol}, in order along the line (at least two).
      </p>
      {listError && (
        <p className="text-sm text-danger-700" role="alert">
          {fieldMessage('Plan path', listError)}
        </p>
      )}
      <ol className="space-y-2" aria-label="Vertices">
        {rows.map((row, i) => {
          const eError = cellError(i, 0);
          const nError = cellError(i, 1);
          return (
            <li key={i} className="grid grid-cols-[2rem_minmax(0,1fr)_minmax(0,1fr)_auto] items-start gap-2">
              <span className="pt-3 text-right text-sm text-ink-500 tabular">{i + 1}</span>
              {(['e', 'n'] as const).map((key) => {
                const error = key === 'e' ? eError : nError;
                const name = `Vertex ${i + 1} ${key === 'e' ? 'easting' : 'northing'}`;
                return (
                  <div key={key} className="min-w-0">
                    <input
                      aria-label={name}
                      placeholder={key === 'e' ? 'E' : 'N'}
                      inputMode="decimal"
                      autoComplete="off"
                      value={row[key]}
                      onChange={(ev) => setCell(i, key, ev.target.value)}
                      onBlur={onBlur}
                      aria-invalid={error ? true : undefined}
                      className={cn(
                        'block min-h-11 w-full rounded-md border bg-white px-2 text-base tabular text-ink-900 shadow-xs sm:text-sm',
                        error ? 'border-danger-600' : 'border-ink-300',
                      )}
                    />
                    {error && <p className="mt-1 text-xs text-danger-700">{fieldMessage(name, error)}</p>}
                  </div>
                );
              })}
              <Button variant="ghost" size="sm" aria-label={`Remove vertex ${i + 1}`} disabled={rows.length <= 2} onClick={() => change(rows.filter((_, j) => j !== i))}>
                ✕
              </Button>
            </li>
          );
        })}
      </ol>
      <Button variant="secondary" size="sm" onClick={() => change([...rows, { e: '', n: '' }])}>
        Add vertex
      </Button>
      <div className="space-y-2 rounded-md bg-ink-50 p-3">
        <TextAreaField
          label="Paste vertices"
          hint={`One vertex per line, easting first: “E, N”, “E N” or two spreadsheet cells (${crsCode}, ${unitSymbol}).`}
          value={pasted}
          onChange={(ev) => setPasted(ev.target.value)}
          rows={3}
          className="font-mono"
        />
        {pasteErrors.length > 0 && (
          <div role="alert" className="text-sm text-danger-700">
            <p>Nothing was taken from the paste; correct these lines:</p>
            <ul className="list-disc pl-5" aria-label="Pasted lines not read">
              {pasteErrors.map((e) => (
                <li key={`${e.line}:${e.message}`}>
                  Line {e.line}: {e.message}
                </li>
              ))}
            </ul>
          </div>
        )}
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" size="sm" disabled={pasted.trim() === ''} onClick={() => usePasted('replace')}>
            Replace the path with these
          </Button>
          <Button variant="secondary" size="sm" disabled={pasted.trim() === ''} onClick={() => usePasted('append')}>
            Add them at the end
          </Button>
        </div>
      </div>
    </fieldset>
  );
}
