import { useMemo, useState } from 'react';
import { LINE_KINDS, LINE_KIND_LABELS, UNIT_LABELS, type LineKind } from '@shared/domain';
import { ProblemAlert } from '@/components/ui/alert';
import { SelectField, TextField } from '@/components/ui/field';
import { EmptyState, Loading } from '@/components/ui/states';
import { useLines } from '@/features/lines/api/get-lines';
import { LinesTable } from '@/features/lines/components/lines-table';
import { useWorkspace } from './workspace-context';

/** Lines: the register of existing buried lines, with a search and a kind filter. */
export default function LinesTab() {
  const { project } = useWorkspace();
  const lines = useLines(project.id);
  const [search, setSearch] = useState('');
  const [kind, setKind] = useState<LineKind | ''>('');

  const shown = useMemo(() => {
    const needle = search.trim().toLowerCase();
    return (lines.data ?? []).filter(
      (l) => (!kind || l.kind === kind) && (!needle || `${l.label} ${l.owner} ${l.material ?? ''}`.toLowerCase().includes(needle)),
    );
  }, [lines.data, search, kind]);

  if (lines.isPending) return <Loading label="Loading lines…" />;
  if (lines.isError) return <ProblemAlert error={lines.error} />;

  if (lines.data.length === 0) {
    return (
      <EmptyState title="No lines in the register yet">
        <p>
          Lines are the existing buried utilities near the work: each with its owner, kind (shown in its APWA marking colour), size, material, quality
          level and plan path in {project.crsCode}. Where no test hole has exposed a line yet, its record depth stands in and it counts as unverified.
        </p>
        <p>Entering and importing lines is not built yet.</p>
      </EmptyState>
    );
  }

  const kindsPresent = LINE_KINDS.filter((k) => lines.data.some((l) => l.kind === k));
  return (
    <div className="space-y-4">
      <h2 className="text-lg font-semibold">Lines</h2>
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
