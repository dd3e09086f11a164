import { useId, useRef, useState } from 'react';
import type { ProjectDto, SurveyImportResultDto, SurveyShotRowDto } from '@shared/api';
import { UNIT_LABELS } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { DropZone, HiddenFileInput } from '@/components/ui/file-drop';
import { Badge } from '@/components/ui/states';
import { isApiError } from '@/lib/api-client';
import { formatNumber } from '@/lib/format';
import { useCommitSurveyImport } from '../api/commit-survey-import';
import { usePreviewSurveyImport } from '../api/preview-survey-import';

const OUTCOME: Record<SurveyShotRowDto['outcome'], { label: string; tone: string }> = {
  match: { label: 'Match', tone: 'bg-ok-100 text-ok-700' },
  no_hole: { label: 'No such hole', tone: 'bg-danger-100 text-danger-800' },
  ambiguous: { label: 'Ambiguous', tone: 'bg-caution-100 text-caution-800' },
  invalid: { label: 'Invalid row', tone: 'bg-danger-100 text-danger-800' },
  locked: { label: 'Hole locked', tone: 'bg-ink-200 text-ink-800' },
};

const CHANGE_LABELS: Record<string, string> = {
  surveyedEasting: 'Surveyed easting',
  surveyedNorthing: 'Surveyed northing',
  surveyedTopElevation: 'Surveyed top of line',
  surveyedGroundElevation: 'Surveyed ground',
  status: 'Status',
};

const MAX_BYTES = 2_000_000;

/**
 * Import a surveyor's point file (CSV: point, northing, easting, elevation, description):
 * choose the file, see what each row would change, and write it only when every row matches.
 * Nothing is written by the preview; the commit is all or nothing.
 */
export function SurveyImport({ project }: { project: ProjectDto }) {
  const preview = usePreviewSurveyImport(project.id);
  const commit = useCommitSurveyImport(project.id);
  const [file, setFile] = useState<{ name: string; csv: string } | null>(null);
  const [readError, setReadError] = useState<string | null>(null);
  const inputId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const unit = UNIT_SYMBOLS[project.unit];
  const datum = project.verticalDatum;

  async function choose(f: File | undefined) {
    setReadError(null);
    commit.reset();
    preview.reset();
    if (!f) return;
    if (f.size > MAX_BYTES) {
      setFile(null);
      setReadError(`${f.name} is ${formatNumber(f.size / 1_000_000, 1)} MB; point files up to 2 MB can be imported. Split the file.`);
      return;
    }
    const csv = await f.text();
    if (csv.trim() === '') {
      setFile(null);
      setReadError(`${f.name} is empty.`);
      return;
    }
    setFile({ name: f.name, csv });
    preview.mutate({ csv, fileName: f.name });
  }

  const result: SurveyImportResultDto | undefined = commit.data ?? preview.data;
  const problems = result?.rows.filter((r) => r.outcome !== 'match') ?? [];
  const ready = !!preview.data && problems.length === 0 && preview.data.rows.length > 0 && !commit.isSuccess;

  return (
    <div className="space-y-4">
      <DropZone label="Choose a point file" onFiles={(files) => void choose(files[0])}>
        <div className="space-y-1 text-sm text-ink-700">
          <p>
            A CSV point file with a header row <code className="rounded bg-ink-100 px-1 font-mono text-xs">point, northing, easting, elevation, description</code>,
            in {project.crsCode}, {UNIT_LABELS[project.unit]}, elevations {datum}.
          </p>
          <p>
            The point is the test-hole number. The description starts with <strong>TOP</strong> for a shot on the top of the line or <strong>GND</strong> for
            the ground beside the hole, followed by the line’s name when one excavation exposed several lines.
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <HiddenFileInput ref={inputRef} id={inputId} accept=".csv,.txt,text/csv,text/plain" label="Point file" onFiles={(files) => void choose(files?.[0])} />
          <Button className="min-h-12" onClick={() => inputRef.current?.click()} busy={preview.isPending}>
            {file ? 'Choose another file' : 'Choose point file'}
          </Button>
          <span className="text-sm text-ink-600">{file ? file.name : 'or drop it here'}</span>
        </div>
      </DropZone>

      {readError && <Alert tone="danger" title="The file cannot be read">{readError}</Alert>}
      {preview.isError && <ProblemAlert error={preview.error} />}

      {result && (
        <section aria-label="Import preview" className="space-y-3">
          {commit.isSuccess ? (
            <Alert tone="success" title="Survey shots imported">
              <p>
                {result.matched} {result.matched === 1 ? 'shot' : 'shots'} written onto {result.holesChanged} {result.holesChanged === 1 ? 'hole' : 'holes'}.
              </p>
            </Alert>
          ) : problems.length > 0 ? (
            <Alert tone="danger" title={`Nothing can be imported yet: ${problems.length} ${problems.length === 1 ? 'row needs' : 'rows need'} attention`}>
              <p>
                The import is all or nothing, and nothing has been written. Fix {problems.length === 1 ? 'row' : 'rows'}{' '}
                {problems.map((p) => p.row).join(', ')} in the file (rows counted with the header as row 1) and choose it again.
              </p>
            </Alert>
          ) : (
            <Alert tone="info" title={`Every row matches: ${result.matched} ${result.matched === 1 ? 'shot' : 'shots'} on ${result.holesChanged} ${result.holesChanged === 1 ? 'hole' : 'holes'}`}>
              <p>Check the changes below, then import. Nothing is written until you do.</p>
            </Alert>
          )}

          <div className="rounded-lg border border-ink-200 bg-white">
            <div aria-hidden className="hidden grid-cols-[3.5rem_minmax(7rem,1fr)_minmax(7rem,1fr)_minmax(10rem,1.4fr)_minmax(14rem,2fr)] gap-3 border-b border-ink-200 bg-ink-50 px-3 py-2 text-xs font-semibold tracking-wide text-ink-600 uppercase md:grid">
              <span>Row</span>
              <span>Point</span>
              <span>Shot</span>
              <span>Outcome</span>
              <span>
                Changes (before → after)
                <span className="block font-normal normal-case">
                  {unit}; elevations {datum}
                </span>
              </span>
            </div>
            <ol aria-label="Rows of the point file" className="divide-y divide-ink-100">
              {result.rows.map((r) => (
                <li
                  key={r.row}
                  aria-label={`Row ${r.row}`}
                  className={cn(
                    'grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 px-3 py-2.5 text-sm md:grid-cols-[3.5rem_minmax(7rem,1fr)_minmax(7rem,1fr)_minmax(10rem,1.4fr)_minmax(14rem,2fr)] md:gap-3',
                    r.outcome !== 'match' && 'bg-danger-50/60',
                  )}
                >
                  <span className="font-medium tabular">
                    <span className="md:hidden">Row </span>
                    {r.row}
                  </span>
                  <span className="flex flex-wrap items-baseline gap-x-2 md:block">
                    <span className="font-medium">{r.point || '—'}</span>
                    {r.lineLabel && <span className="text-xs text-ink-500 md:block">{r.lineLabel}</span>}
                  </span>
                  <span className="col-start-2 md:col-start-auto">
                    {r.shot === 'top' ? 'Top of line' : r.shot === 'ground' ? 'Ground' : '—'}
                    {!/^\s*(TOP|GND)\s*$/i.test(r.description) && <span className="ml-2 text-xs text-ink-500 md:ml-0 md:block">{r.description}</span>}
                  </span>
                  <span className="col-start-2 md:col-start-auto">
                    <Badge className={OUTCOME[r.outcome].tone}>{OUTCOME[r.outcome].label}</Badge>
                    {r.message && <span className="mt-1 block text-xs text-ink-700">{r.message}</span>}
                  </span>
                  <span className="col-start-2 md:col-start-auto">
                    {Object.keys(r.changes).length === 0 ? (
                      <span className="text-ink-500 md:inline">{r.outcome === 'match' ? 'no change' : ''}</span>
                    ) : (
                      <ul className="space-y-0.5">
                        {Object.entries(r.changes).map(([field, c]) => (
                          <li key={field}>
                            <span className="text-ink-600">{CHANGE_LABELS[field] ?? field}:</span> <del className="text-ink-500">{show(c.before)}</del>
                            <span aria-hidden> → </span>
                            <span className="sr-only"> becomes </span>
                            <ins className="font-medium no-underline">{show(c.after)}</ins>
                            <span className="text-xs whitespace-nowrap text-ink-500"> {field.includes('Elevation') ? `${unit} ${datum}` : unit}</span>
                          </li>
                        ))}
                      </ul>
                    )}
                  </span>
                </li>
              ))}
            </ol>
          </div>

          {commit.isError && (
            <ProblemAlert error={commit.error} />
          )}
          {commit.isError && isApiError(commit.error) && commit.error.status === 400 && (
            <p className="text-sm text-danger-700">Nothing was written. Fix the rows named above and choose the file again.</p>
          )}
          {!commit.isSuccess && (
            <div className="flex flex-wrap items-center gap-2">
              <Button className="min-h-12" disabled={!ready} busy={commit.isPending} onClick={() => file && commit.mutate({ csv: file.csv, fileName: file.name })}>
                Import {result.matched} {result.matched === 1 ? 'shot' : 'shots'}
              </Button>
              {!ready && problems.length > 0 && <span className="text-sm text-ink-600">Import is possible once every row matches.</span>}
            </div>
          )}
        </section>
      )}
    </div>
  );
}

function show(v: number | string | null | undefined): string {
  if (v == null) return '—';
  return typeof v === 'number' ? formatNumber(v, 3) : String(v);
}
