import { useState } from 'react';
import { LINE_KINDS, LINE_KIND_LABELS, type LinearUnit } from '@shared/domain';
import type { ClearanceRuleDto } from '@shared/api';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { DataTable, type Column } from '@/components/ui/data-table';
import { EmptyState, Loading } from '@/components/ui/states';
import { formatLength } from '@/lib/format';
import { useDeleteRule } from '../api/delete-rule';
import { useRules } from '../api/get-rules';
import { RuleCreateForm, RuleEditForm } from './rule-forms';

type Mode = { type: 'view' } | { type: 'add' } | { type: 'edit'; rule: ClearanceRuleDto } | { type: 'delete'; rule: ClearanceRuleDto };

/**
 * Required clearance by line kind. A line's own owner requirement overrides its kind's rule.
 * Designers and administrators edit; others read.
 */
export function RulesPanel({ projectId, unit, canEdit }: { projectId: number; unit: LinearUnit; canEdit: boolean }) {
  const rules = useRules(projectId);
  const remove = useDeleteRule(projectId);
  const [mode, setMode] = useState<Mode>({ type: 'view' });
  const done = () => setMode({ type: 'view' });

  if (rules.isPending) return <Loading label="Loading clearance rules…" />;
  if (rules.isError) return <ProblemAlert error={rules.error} />;

  const ruled = new Set(rules.data.map((r) => r.kind));
  const freeKinds = LINE_KINDS.filter((kind) => !ruled.has(kind));
  const sorted = [...rules.data].sort((a, b) => LINE_KINDS.indexOf(a.kind) - LINE_KINDS.indexOf(b.kind));

  const columns: Column<ClearanceRuleDto>[] = [
    { key: 'kind', header: 'Line kind', cell: (r) => <KindSwatch kind={r.kind} /> },
    { key: 'v', header: `Vertical (${UNIT_SYMBOLS[unit]})`, cell: (r) => formatLength(r.vertical, unit), numeric: true },
    { key: 'h', header: `Horizontal (${UNIT_SYMBOLS[unit]})`, cell: (r) => formatLength(r.horizontal, unit), numeric: true },
    { key: 'source', header: 'Source', cell: (r) => r.source ?? '—', wrap: true },
  ];
  if (canEdit) {
    columns.push({
      key: 'actions',
      header: <span className="sr-only">Actions</span>,
      cell: (r) => (
        <div className="flex gap-1">
          <Button variant="ghost" size="sm" onClick={() => setMode({ type: 'edit', rule: r })} aria-label={`Edit rule for ${LINE_KIND_LABELS[r.kind]}`}>
            Edit
          </Button>
          <Button variant="ghost" size="sm" onClick={() => setMode({ type: 'delete', rule: r })} aria-label={`Delete rule for ${LINE_KIND_LABELS[r.kind]}`}>
            Delete
          </Button>
        </div>
      ),
    });
  }

  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-600">
        Clearances are edge to edge: from the casing’s outside to the line’s outside. An owner’s requirement entered on a line overrides the rule for its
        kind. These values are presets your team sets from the owners’ and the local authority’s requirements.
      </p>
      {remove.error && <ProblemAlert error={remove.error} />}

      {rules.data.length === 0 ? (
        <EmptyState title="No clearance rules yet">
          <p>Without a rule for a kind, only lines carrying their owner’s own requirement can be checked.</p>
          {!canEdit && <p>A design engineer or the administrator sets the rules.</p>}
        </EmptyState>
      ) : (
        <DataTable caption="Clearance rules" columns={columns} rows={sorted} rowKey={(r) => r.id} />
      )}

      {canEdit && mode.type === 'edit' && (
        <section className="rounded-md border border-brand-200 bg-brand-50/50 p-4" aria-label="Edit rule">
          <h3 className="mb-3 text-sm font-semibold">
            Rule for <KindSwatch kind={mode.rule.kind} />
          </h3>
          <RuleEditForm key={mode.rule.id} projectId={projectId} unit={unit} rule={mode.rule} onDone={done} />
        </section>
      )}
      {canEdit && mode.type === 'delete' && (
        <div role="alertdialog" aria-label="Confirm delete" className="flex flex-wrap items-center gap-2 rounded-md border border-danger-100 bg-danger-50 p-3 text-sm">
          <span className="grow">Delete the rule for {LINE_KIND_LABELS[mode.rule.kind]}? Lines of this kind without an owner’s value will have no requirement.</span>
          <Button variant="danger" size="sm" busy={remove.isPending} onClick={() => remove.mutate(mode.rule.id, { onSuccess: done })}>
            Delete rule
          </Button>
          <Button variant="secondary" size="sm" onClick={done}>
            Keep
          </Button>
        </div>
      )}
      {canEdit && mode.type === 'add' && (
        <section className="rounded-md border border-brand-200 bg-brand-50/50 p-4" aria-label="New rule">
          <RuleCreateForm projectId={projectId} unit={unit} kinds={freeKinds} onDone={done} />
        </section>
      )}
      {canEdit && mode.type === 'view' && freeKinds.length > 0 && (
        <Button variant="secondary" onClick={() => setMode({ type: 'add' })}>
          Add a rule
        </Button>
      )}
    </div>
  );
}
