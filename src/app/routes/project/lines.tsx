import { lazy, Suspense, useMemo, useState } from 'react';
import { LINE_KINDS, LINE_KIND_LABELS, UNIT_LABELS, type LineKind } from '@shared/domain';
import { can } from '@shared/permissions';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { EmptyState, Loading } from '@/components/ui/states';
import { useLines } from '@/features/lines/api/get-lines';
import { LineForm } from '@/features/lines/components/line-form';
import { LinesTable } from '@/features/lines/components/lines-table';
import { useLocation } from 'react-router-dom';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useWorkspace } from './workspace-context';

/** The import panel (with the CRS catalogue) loads only when someone opens it. */
const LineImportPanel = lazy(() => import('@/features/line-import/components/line-import-panel'));

/** Lines: the register of existing buried lines, with a search and a kind filter; designers add and import lines here. */
export default function LinesTab() {
  const { project } = useWorkspace();
  const lines = useLines(project.id);
  const location = useLocation();
  const deleted = (location.state as { deleted?: string } | null)?.deleted;
  const [search, setSearch] = useState('');
  const [kind, setKind] = useState<LineKind | ''>('');
  const user = useSignedInUser();
  const mayWrite = can(user.role, 'line.write');
  const [importing, setImporting] = useState(false);
  const [adding, setAdding] = useState(false);
  const [added, setAdded] = useState<string | null>(null);
  const importPanel = importing && (
    <Suspense fallback={<Loading label="Opening the import…" />}>
      <LineImportPanel project={project} onClose={() => setImporting(false)} />
    </Suspense>
  );
  const addPanel = adding && (
    <section aria-label="Add a line" className="rounded-lg border border-ink-200 bg-white p-4">
      <h3 className="mb-3 text-base font-semibold">Add a line</h3>
      <LineForm
        project={project}
        onDone={(line) => {
          setAdding(false);
          setAdded(line.label);
        }}
        onCancel={() => setAdding(false)}
      />
    </section>
  );
  const open = (what: 'add' | 'import') => {
    setAdded(null);
    setAdding(what === 'add');
    setImporting(what === 'import');
  };
  const buttons = mayWrite && !importing && !adding && (
    <div className="flex flex-wrap gap-2">
      <Button onClick={() => open('add')}>{lines.data?.length === 0 ? 'Add the first line' : 'Add line'}</Button>
      <Button variant="secondary" onClick={() => open('import')}>
        Import lines…
      </Button>
    </div>
  );
  const notices = (
    <>
      {added && <Alert tone="success">Line “{added}” added. The clearances are checked again against every bore.</Alert>}
      {deleted && !added && <Alert tone="success">Line “{deleted}” deleted.</Alert>}
    </>
  );

  const shown = useMemo(() => {
    const needle = search.trim().toLowerCase();
    return (lines.data ?? []).filter(
      (l) => (!kind || l.kind === kind) && (!needle || `${l.label} ${l.owner} ${l.material ?? ''}`.toLowerCase().includes(needle)),
    );
  }, [lines.data, search, kind]);

  if (lines.isPending) return <Loading label="Loading lines…" />;
  if (lines.isError) return <ProblemAlert error={lines.error} />;

  if (lines.data.length === 0) {
    if (importing || adding) return <div className="space-y-4">{importPanel}{addPanel}</div>;
    return (
      <EmptyState title="No lines in the register yet" action={buttons || undefined}>
        <p>
          Lines are the existing buried utilities near the work: each with its owner, kind (shown in its APWA marking colour), size, material, quality
          level and plan path in {project.crsCode}. Where no test hole has exposed a line yet, its record depth stands in and it counts as unverified.
        </p>
        <p>
          {mayWrite
            ? 'Add each line with its plan path (type the vertices or paste them from a spreadsheet or CAD list), or import them from GeoJSON, a DXF drawing or a CSV point file.'
            : 'A design engineer enters or imports them; your role reads them.'}
        </p>
      </EmptyState>
    );
  }

  const kindsPresent = LINE_KINDS.filter((k) => lines.data.some((l) => l.kind === k));
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-semibold">Lines</h2>
        {buttons}
      </div>
      {notices}
      {addPanel}
      {importPanel}
      <div className="grid gap-3 sm:grid-cols-[1fr_16rem]">
        <TextField label="Search lines" type="search" placeholder="Label, owner or material" value={search} onChange={(e) => setSearch(e.target.value)} />
        <SelectField label="Kind" value={kind} onChange={(e) => setKind(e.target.value as LineKind | '')}>
          <option value="">All kinds</option>
          {kindsPresent.map((k) => (
            <option key={k} value={k}>
              {LINE_KIND_LABELS[k]}
            </option>
          ))}
        </SelectField>
      </div>
      {shown.length === 0 ? (
        <p className="rounded-md bg-white px-4 py-6 text-center text-sm text-ink-600">No line matches this search.</p>
      ) : (
        <LinesTable lines={shown} unit={project.unit} projectId={project.id} />
      )}
      <p className="text-xs text-ink-500">
        {shown.length} of {lines.data.length} lines. Sizes are outside dimensions; depths are to the top of the line, in {UNIT_LABELS[project.unit]}.
      </p>
    </div>
  );
}
