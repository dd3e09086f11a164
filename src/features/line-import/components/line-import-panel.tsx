import { useId, useMemo, useRef, useState } from 'react';
import type { LineImportPreviewDto, ProjectDto } from '@shared/api';
import { LINE_KINDS, LINE_KIND_LABELS, LINE_STATUSES, QUALITY_LEVELS, UNIT_LABELS, type LineKind, type LineStatus, type QualityLevel } from '@shared/domain';
import { CRS_CATALOGUE } from '@shared/geometry/crs';
import { LINE_IMPORT_FORMAT_LABELS, LINE_IMPORT_MAX_CHARS, type LineImportFormat, type LineImportInput } from '@shared/schemas/line-import';
import { UNIT_SYMBOLS } from '@shared/units';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Panel } from '@/components/ui/states';
import { isApiError } from '@/lib/api-client';
import { formatNumber } from '@/lib/format';
import { useCommitLineImport } from '../api/commit-line-import';
import { usePreviewLineImport } from '../api/preview-line-import';

type Choice = LineKind | 'skip' | '';
interface GroupChoice {
  kind: Choice;
  owner: string;
  diameter: string;
}

function formatOf(name: string): LineImportFormat | null {
  const n = name.toLowerCase();
  if (n.endsWith('.geojson') || n.endsWith('.json')) return 'geojson';
  if (n.endsWith('.dxf')) return 'dxf';
  if (n.endsWith('.csv') || n.endsWith('.txt')) return 'csv';
  return null;
}

const number = (s: string): number | undefined => (s.trim() === '' ? undefined : Number(s.trim().replace(/,/g, '')));

/**
 * Import existing lines from GeoJSON, DXF or a CSV point file: choose the file (and, where the
 * file does not say, its CRS), map each layer / property value / code to a line kind or skip it,
 * give what the file lacks (owner, size, record depth), check the preview, then import. Nothing
 * is written before the last step, and that step writes every line or none.
 */
export function LineImportPanel({ project, onClose }: { project: ProjectDto; onClose: () => void }) {
  const preview = usePreviewLineImport(project.id);
  const commit = useCommitLineImport(project.id);
  const fileRef = useRef<HTMLInputElement>(null);
  const fileId = useId();
  const [file, setFile] = useState<{ name: string; content: string; format: LineImportFormat } | null>(null);
  const [readError, setReadError] = useState<string | null>(null);
  const [sourceCrs, setSourceCrs] = useState('');
  /** The CRS choice the shown preview was read with. */
  const [readWith, setReadWith] = useState<string | null>(null);
  const [groups, setGroups] = useState<Record<string, GroupChoice>>({});
  const [owner, setOwner] = useState('');
  const [diameter, setDiameter] = useState('');
  const [recordDepth, setRecordDepth] = useState('');
  const [qualityLevel, setQualityLevel] = useState<QualityLevel>('D');
  const [status, setStatus] = useState<LineStatus>('active');
  const unit = UNIT_SYMBOLS[project.unit];
  const crsOptions = useMemo(() => [...CRS_CATALOGUE.values()].sort((a, b) => a.code.localeCompare(b.code, 'en', { numeric: true })), []);

  const input = (f: NonNullable<typeof file>, withMapping: boolean): LineImportInput => {
    const body: LineImportInput = { format: f.format, content: f.content, fileName: f.name, sourceCrs: sourceCrs || undefined };
    if (!withMapping) return body;
    body.mapping = {};
    for (const [key, g] of Object.entries(groups)) {
      if (!g.kind) continue;
      body.mapping[key] = { kind: g.kind, owner: g.owner.trim() || undefined, diameter: number(g.diameter) };
    }
    body.defaults = { owner: owner.trim() || undefined, diameter: number(diameter), recordDepth: number(recordDepth), qualityLevel, status };
    return body;
  };

  const run = (f: NonNullable<typeof file>, withMapping: boolean) => {
    setReadWith(sourceCrs);
    preview.mutate(input(f, withMapping), {
      onSuccess: (p) => {
        if (withMapping) return;
        const next: Record<string, GroupChoice> = {};
        for (const g of p.groups) next[g.key] = groups[g.key] ?? { kind: g.suggestedKind ?? '', owner: '', diameter: '' };
        setGroups(next);
      },
    });
  };

  async function choose(f: File | undefined) {
    setReadError(null);
    preview.reset();
    commit.reset();
    setGroups({});
    if (!f) return;
    const format = formatOf(f.name);
    if (!format) {
      setFile(null);
      setReadError(`${f.name}: choose a .geojson (or .json), .dxf or .csv file.`);
      return;
    }
    if (f.size > LINE_IMPORT_MAX_CHARS) {
      setFile(null);
      setReadError(`${f.name} is ${formatNumber(f.size / 1_000_000, 1)} MB; files up to ${LINE_IMPORT_MAX_CHARS / 1_000_000} MB can be imported. Split it, or keep only the layers you need.`);
      return;
    }
    const content = await f.text();
    if (format === 'dxf' && content.startsWith('AutoCAD Binary DXF')) {
      setFile(null);
      setReadError(`${f.name} is a binary DXF; save it from CAD as an ASCII DXF.`);
      return;
    }
    const chosen = { name: f.name, content, format };
    setFile(chosen);
    run(chosen, false);
  }

  const p: LineImportPreviewDto | undefined = preview.data;
  const allMapped = p ? p.groups.every((g) => groups[g.key]?.kind) : false;
  const committed = commit.data;
  const commitProblems = commit.error && isApiError(commit.error) ? commit.error.fieldErrors : [];
  const setGroup = (key: string, patch: Partial<GroupChoice>) => setGroups((all) => ({ ...all, [key]: { ...(all[key] ?? { kind: '', owner: '', diameter: '' }), ...patch } }));

  return (
    <Panel
      title="Import lines"
      actions={
        <Button variant="ghost" size="sm" onClick={onClose}>
          Close
        </Button>
      }
    >
      <div className="space-y-4 text-sm">
        <div className="space-y-1 text-ink-700">
          <p>
            GeoJSON (LineString and MultiLineString features, in the CRS its <code>crs</code> member names, else WGS 84 longitude/latitude), DXF polylines and lines
            (a layer per kind), or a CSV point file <code>point, northing, easting, elevation, description</code> where points sharing a code (the description’s
            first word) make one line, in file order. DXF and point files are taken in the project grid ({project.crsCode}, {UNIT_LABELS[project.unit]}) unless you
            choose their CRS.
          </p>
          <p>Line elevations come from test holes, so heights in the file are not stored. Nothing is written until you press Import, and then all lines or none.</p>
        </div>

        <div className="grid gap-3 sm:grid-cols-[auto_1fr] sm:items-end">
          <div className="flex flex-col gap-1">
            <label htmlFor={fileId} className="text-sm font-medium text-ink-800">
              Line file
            </label>
            <input
              ref={fileRef}
              id={fileId}
              type="file"
              accept=".geojson,.json,.dxf,.csv,.txt,application/geo+json,application/json,text/csv,image/vnd.dxf"
              className="block min-h-11 text-sm file:mr-3 file:min-h-11 file:rounded-md file:border file:border-ink-300 file:bg-white file:px-3 file:text-sm file:font-medium"
              onChange={(e) => void choose(e.target.files?.[0])}
            />
          </div>
          <SelectField
            label="Coordinates of the file"
            value={sourceCrs}
            onChange={(e) => {
              setSourceCrs(e.target.value);
              if (file) preview.reset();
            }}
            hint="Leave on the first choice unless the file is in another CRS; the lines are reprojected into the project grid."
          >
            <option value="">As the file says (GeoJSON) or the project grid (DXF, CSV)</option>
            <option value="EPSG:4326">EPSG:4326 WGS 84 longitude/latitude</option>
            {crsOptions.map((c) => (
              <option key={c.code} value={c.code}>
                {c.code} {c.name}
              </option>
            ))}
          </SelectField>
        </div>
        {file && readWith !== null && sourceCrs !== readWith && !preview.isPending && (
          <Button variant="secondary" onClick={() => run(file, false)}>
            Read the file again with this CRS
          </Button>
        )}

        {readError && (
          <Alert tone="danger" title="The file cannot be read">
            {readError}
          </Alert>
        )}
        {preview.isError && <ProblemAlert error={preview.error} />}
        {preview.isPending && <p role="status">Reading {file?.name}…</p>}

        {p && file && !committed && (
          <section aria-label="Import preview" className="space-y-4">
            <p className="text-ink-700">
              {LINE_IMPORT_FORMAT_LABELS[p.format]}: {p.itemCount} {p.itemCount === 1 ? 'line' : 'lines'} in {p.groups.length}{' '}
              {p.groups.length === 1 ? 'group' : 'groups'}. Coordinates: {p.source.crs} {p.source.name !== p.source.crs ? p.source.name : ''} ({p.source.how}), into{' '}
              {p.targetCrs}, {UNIT_LABELS[p.unit]}.
            </p>
            {p.ignored.length > 0 && <p className="text-ink-600">Left out (not lines): {p.ignored.map((i) => `${i.count} × ${i.what}`).join(', ')}.</p>}
            {p.warnings.map((w) => (
              <Alert key={w} tone="caution">
                {w}
              </Alert>
            ))}

            {p.groups.length > 0 && (
              <fieldset className="space-y-2">
                <legend className="font-semibold text-ink-900">Map each group to a line kind</legend>
                <div className="overflow-x-auto rounded-lg border border-ink-200 bg-white">
                  <table className="min-w-full text-sm">
                    <thead className="bg-ink-50 text-left text-xs font-semibold text-ink-600 uppercase">
                      <tr>
                        <th className="px-3 py-2">Group</th>
                        <th className="px-3 py-2">Lines</th>
                        <th className="px-3 py-2">Kind</th>
                        <th className="px-3 py-2">Owner (if the file gives none)</th>
                        <th className="px-3 py-2">Outside diameter ({unit})</th>
                      </tr>
                    </thead>
                    <tbody>
                      {p.groups.map((g) => {
                        const choice = groups[g.key] ?? { kind: '', owner: '', diameter: '' };
                        return (
                          <tr key={g.key} className="border-t border-ink-100">
                            <th scope="row" className="px-3 py-2 text-left font-medium">
                              {g.key}
                            </th>
                            <td className="px-3 py-2 tabular">{g.count}</td>
                            <td className="px-3 py-2">
                              <select
                                aria-label={`Kind for ${g.key}`}
                                value={choice.kind}
                                onChange={(e) => setGroup(g.key, { kind: e.target.value as Choice })}
                                className="min-h-11 rounded-md border border-ink-300 bg-white px-2"
                              >
                                <option value="">Choose…</option>
                                {LINE_KINDS.map((k) => (
                                  <option key={k} value={k}>
                                    {LINE_KIND_LABELS[k]}
                                  </option>
                                ))}
                                <option value="skip">Skip this group</option>
                              </select>
                            </td>
                            <td className="px-3 py-2">
                              <input
                                aria-label={`Owner for ${g.key}`}
                                value={choice.owner}
                                disabled={choice.kind === 'skip'}
                                onChange={(e) => setGroup(g.key, { owner: e.target.value })}
                                className="min-h-11 w-48 rounded-md border border-ink-300 px-2"
                              />
                            </td>
                            <td className="px-3 py-2">
                              <input
                                aria-label={`Outside diameter for ${g.key}`}
                                inputMode="decimal"
                                value={choice.diameter}
                                disabled={choice.kind === 'skip'}
                                onChange={(e) => setGroup(g.key, { diameter: e.target.value })}
                                className="min-h-11 w-28 rounded-md border border-ink-300 px-2"
                              />
                            </td>
                          </tr>
                        );
                      })}
                    </tbody>
                  </table>
                </div>
              </fieldset>
            )}

            <fieldset className="grid gap-3 sm:grid-cols-3 lg:grid-cols-5">
              <legend className="mb-1 font-semibold text-ink-900">For every line the file and its group say nothing about</legend>
              <TextField label="Default owner" value={owner} onChange={(e) => setOwner(e.target.value)} />
              <TextField label={`Default outside diameter (${unit})`} inputMode="decimal" value={diameter} onChange={(e) => setDiameter(e.target.value)} />
              <TextField
                label={`Record depth to top (${unit})`}
                inputMode="decimal"
                value={recordDepth}
                onChange={(e) => setRecordDepth(e.target.value)}
                hint="Assumed until a test hole exposes the line."
              />
              <SelectField label="Quality level" value={qualityLevel} onChange={(e) => setQualityLevel(e.target.value as QualityLevel)}>
                {[...QUALITY_LEVELS].reverse().map((q) => (
                  <option key={q} value={q}>
                    QL {q}
                  </option>
                ))}
              </SelectField>
              <SelectField label="Line status" value={status} onChange={(e) => setStatus(e.target.value as LineStatus)}>
                {LINE_STATUSES.map((s) => (
                  <option key={s} value={s}>
                    {s}
                  </option>
                ))}
              </SelectField>
            </fieldset>

            <div className="flex flex-wrap gap-2">
              <Button variant="secondary" disabled={!allMapped} busy={preview.isPending} onClick={() => run(file, true)}>
                Check the import
              </Button>
              <Button disabled={!p.ready || !allMapped} busy={commit.isPending} onClick={() => commit.mutate(input(file, true))}>
                {p.ready ? `Import ${p.willCreate} ${p.willCreate === 1 ? 'line' : 'lines'}` : 'Import'}
              </Button>
              {!allMapped && <span className="self-center text-ink-600">Choose a kind (or Skip) for every group, then check.</span>}
            </div>

            {p.problems.length > 0 && (
              <Alert tone="danger" title={`Nothing can be imported yet: ${p.problems.length} ${p.problems.length === 1 ? 'problem' : 'problems'}`}>
                <ul className="list-disc space-y-0.5 pl-5">
                  {p.problems.slice(0, 50).map((x) => (
                    <li key={`${x.path}:${x.message}`}>{x.message}</li>
                  ))}
                </ul>
                {p.problems.length > 50 && <p>…and {p.problems.length - 50} more.</p>}
              </Alert>
            )}
            {p.ready && allMapped && (
              <Alert tone="info" title="Ready to import">
                <p>Every line checks out. Nothing has been written yet.</p>
              </Alert>
            )}
            {commit.isError && (
              <Alert tone="danger" title="Nothing was imported">
                {commitProblems.length > 0 ? (
                  <ul className="list-disc pl-5">
                    {commitProblems.slice(0, 50).map((x) => (
                      <li key={`${x.path}:${x.message}`}>{x.message}</li>
                    ))}
                  </ul>
                ) : (
                  <ProblemAlert error={commit.error} />
                )}
              </Alert>
            )}

            {p.items.length > 0 && (
              <div className="overflow-x-auto rounded-lg border border-ink-200 bg-white">
                <table className="min-w-full text-sm">
                  <caption className="px-3 py-2 text-left text-xs text-ink-500">
                    Lines found{p.items.length < p.itemCount ? ` (first ${p.items.length} of ${p.itemCount})` : ''}; coordinates in {p.targetCrs}, {unit}
                  </caption>
                  <thead className="bg-ink-50 text-left text-xs font-semibold text-ink-600 uppercase">
                    <tr>
                      <th className="px-3 py-2">Where</th>
                      <th className="px-3 py-2">Group</th>
                      <th className="px-3 py-2">Label</th>
                      <th className="px-3 py-2 text-right">Vertices</th>
                      <th className="px-3 py-2 text-right">Length ({unit})</th>
                      <th className="px-3 py-2">Starts at (E, N)</th>
                    </tr>
                  </thead>
                  <tbody>
                    {p.items.map((i) => (
                      <tr key={i.ref} className="border-t border-ink-100">
                        <td className="px-3 py-1.5 whitespace-nowrap">{i.ref}</td>
                        <td className="px-3 py-1.5">{i.group}</td>
                        <td className="px-3 py-1.5">
                          {i.label}
                          {i.labelExists && <span className="ml-2 text-xs text-caution-800">(already in the register)</span>}
                        </td>
                        <td className="px-3 py-1.5 text-right tabular">{i.vertexCount}</td>
                        <td className="px-3 py-1.5 text-right tabular">{formatNumber(i.length, 2)}</td>
                        <td className="px-3 py-1.5 whitespace-nowrap tabular">
                          {formatNumber(i.start[0], 2)}, {formatNumber(i.start[1], 2)}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            )}
          </section>
        )}

        {committed && (
          <Alert tone="success" title={`${committed.created} ${committed.created === 1 ? 'line' : 'lines'} imported`}>
            <p>
              {committed.skipped > 0 && `${committed.skipped} left out with their skipped groups. `}The clearances were recomputed; check the Conflicts and Stake-out
              tabs for what the new lines changed.
            </p>
          </Alert>
        )}
      </div>
    </Panel>
  );
}

export default LineImportPanel;
