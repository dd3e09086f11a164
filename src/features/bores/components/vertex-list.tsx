import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { parseVertexText, type VertexRow } from '../utils/vertices';
import type { PathErrors } from '../utils/validate';

/**
 * A short list of grid E/N vertices: a row per vertex (add, remove), and a paste box that takes
 * lines of "E, N" or "E N" from a spreadsheet or a CAD list. Problems come by schema path
 * (`alignment.1.0` is row 2's easting) and are shown on their row.
 */
export function VertexList({
  legend,
  what,
  plural,
  path,
  rows,
  onChange,
  errors,
  unit,
  minRows,
}: {
  legend: string;
  /** "Vertex" or "Corner": names each row. */
  what: string;
  /** "vertices", "corners". */
  plural: string;
  /** The schema path of the list ("alignment", "footprint"). */
  path: string;
  rows: VertexRow[];
  onChange: (rows: VertexRow[]) => void;
  errors: PathErrors;
  unit: string;
  minRows: number;
}) {
  const id = useId();
  const [pasteOpen, setPasteOpen] = useState(false);
  const [pasted, setPasted] = useState('');
  const [pasteProblems, setPasteProblems] = useState<{ line: number; text: string }[]>([]);
  const listError = errors[path];
  const set = (i: number, key: keyof VertexRow, value: string) => onChange(rows.map((r, j) => (j === i ? { ...r, [key]: value } : r)));

  const usePasted = () => {
    const { rows: parsed, problems } = parseVertexText(pasted);
    setPasteProblems(problems);
    if (problems.length === 0 && parsed.length > 0) {
      onChange(parsed);
      setPasted('');
      setPasteOpen(false);
    }
  };

  return (
    <fieldset className="min-w-0 space-y-2" aria-describedby={listError ? `${id}-error` : undefined}>
      <legend className="text-sm font-medium text-ink-800">
        {legend} <span className="font-normal text-ink-500">(easting, northing in {unit})</span>
      </legend>
      <ol className="space-y-2">
        {rows.map((row, i) => {
          const rowError = errors[`${path}.${i}`];
          const eError = errors[`${path}.${i}.0`];
          const nError = errors[`${path}.${i}.1`];
          return (
            <li key={i} className="space-y-1">
              <div className="grid grid-cols-[2rem_minmax(0,1fr)_minmax(0,1fr)_auto] items-center gap-2">
                <span className="text-sm text-ink-600 tabular">{i + 1}</span>
                <input
                  aria-label={`${what} ${i + 1} easting`}
                  value={row.e}
                  inputMode="decimal"
                  autoComplete="off"
                  placeholder="E"
                  onChange={(e) => set(i, 'e', e.target.value)}
                  aria-invalid={eError || rowError ? true : undefined}
                  className={cn('min-h-11 w-full min-w-0 rounded-md border bg-white px-2 text-base tabular sm:text-sm', eError || rowError ? 'border-danger-600' : 'border-ink-300')}
                />
                <input
                  aria-label={`${what} ${i + 1} northing`}
                  value={row.n}
                  inputMode="decimal"
                  autoComplete="off"
                  placeholder="N"
                  onChange={(e) => set(i, 'n', e.target.value)}
                  aria-invalid={nError || rowError ? true : undefined}
                  className={cn('min-h-11 w-full min-w-0 rounded-md border bg-white px-2 text-base tabular sm:text-sm', nError || rowError ? 'border-danger-600' : 'border-ink-300')}
                />
                <Button variant="secondary" size="sm" aria-label={`Remove ${what.toLowerCase()} ${i + 1}`} disabled={rows.length <= minRows} onClick={() => onChange(rows.filter((_, j) => j !== i))}>
                  ✕
                </Button>
              </div>
              {(eError || nError || rowError) && (
                <p className="pl-10 text-sm text-danger-700">
                  {[eError && `${what} ${i + 1} easting ${eError}`, nError && `${what} ${i + 1} northing ${nError}`, rowError && `${what} ${i + 1} ${rowError}`].filter(Boolean).join('; ')}
                </p>
              )}
            </li>
          );
        })}
      </ol>
      {listError && (
        <p id={`${id}-error`} className="text-sm text-danger-700">
          {legend} {listError}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" size="sm" onClick={() => onChange([...rows, { e: '', n: '' }])}>
          Add {what.toLowerCase()}
        </Button>
        <Button variant="secondary" size="sm" aria-expanded={pasteOpen} onClick={() => setPasteOpen(!pasteOpen)}>
          Paste {plural}
        </Button>
      </div>
      {pasteOpen && (
        <div className="space-y-2 rounded-md border border-ink-200 bg-ink-50 p-3">
          <label htmlFor={`${id}-paste`} className="block text-sm font-medium text-ink-800">
            Pasted {plural}
          </label>
          <textarea
            id={`${id}-paste`}
            rows={4}
            value={pasted}
            spellCheck={false}
            onChange={(e) => setPasted(e.target.value)}
            placeholder={'645780.00, 3243450.00\n645830.00 3243450.00'}
            aria-describedby={`${id}-paste-hint`}
            className="block w-full rounded-md border border-ink-300 bg-white px-3 py-2 font-mono text-base sm:text-sm"
          />
          <p id={`${id}-paste-hint`} className="text-xs text-ink-500">
            One {what.toLowerCase()} a line: easting then northing in {unit}, separated by a comma, tab or spaces. Replaces the rows above.
          </p>
          {pasteProblems.length > 0 && (
            <div role="alert" className="text-sm text-danger-700">
              <p>These lines are not two numbers (easting, northing):</p>
              <ul className="list-disc pl-5">
                {pasteProblems.slice(0, 5).map((p) => (
                  <li key={p.line} className="break-all">
                    line {p.line}: <code className="font-mono text-xs">{p.text}</code>
                  </li>
                ))}
              </ul>
            </div>
          )}
          <Button size="sm" onClick={usePasted} disabled={pasted.trim() === ''}>
            Use pasted {plural}
          </Button>
        </div>
      )}
    </fieldset>
  );
}
