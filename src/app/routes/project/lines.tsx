import { lazy, Suspense, useMemo, useState } from 'react';
import { LINE_KINDS, LINE_KIND_LABELS, UNIT_LABELS, type LineKind } from '@shared/domain';
import { can } from '@shared/permissions';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { EmptyState, Loading } from '@/components/ui/states';
import { useLines } from '@/features/lines/api/get-lines';
import { LinesTable } from '@/features/lines/components/lines-table';
import { useSignedInUser } from '@/features/auth/api/get-session';
import { useWorkspace } from './workspace-context';

/** The import panel (with the CRS catalogue) loads only when someone opens it. */
const LineImportPanel = lazy(() => import('@/features/line-import/components/line-import-panel'));

/** Lines: the register of existing buried lines, with a search and a kind filter. */
export default function LinesTab() {
  const { project } = useWorkspace();
  const lines = useLines(project.id);
  const [search, setSearch] = useState('');
  const [kind, setKind] = useState<LineKind | ''>('');
  const user = useSignedInUser();
  const mayImport = can(user.role, 'line.write');
  const [importing, setImporting] = useState(false);
  const importPanel = importing && (
    <Suspense fallback={<Loading label="Opening the import…" />}>
      <LineImportPanel project={project} onClose={() => setImporting(false)} />
    </Suspense>
  );
  const importButton = mayImport && !importing && (
    <Button variant="secondary" onClick={() => setImporting(true)}>
      Import lines…
    </Button>
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
    if (importing) return <div className="space-y-4">{importPanel}</div>;
    return (
      <EmptyState title="No lines in the register yet" action={importButton || undefined}>
        <p>
          Lines are the existing buried utilities near the work: each with its owner, kind (shown in its APWA marking colour), size, material, quality
          level and plan path in {project.crsCode}. Where no test hole has exposed a line yet, its record depth stands in and it counts as unverified.
        </p>
        <p>
          {mayImport
            ? 'Import them from GeoJSON, a DXF drawing or a CSV point file.'
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
        {importButton}
      </div>
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
        <LinesTable lines={shown} unit={project.unit} />
      )}
      <p className="text-xs text-ink-500">
        {shown.length} of {lines.data.length} lines. Sizes are outside dimensions; depths are to the top of the line, in {UNIT_LABELS[project.unit]}.
      </p>
    </div>
  );
}
