import { useState } from 'react';
import type { LinearUnit, StationStyle } from '@shared/domain';
import type { LineDto } from '@shared/api';
import { formatStation, type BoreReport, type LineClearance } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { QualityLevelBadge } from '@/components/quality-level';
import { cn } from '@/components/ui/cn';
import { formatNumber } from '@/lib/format';
import { sameItem, useSelection, useSelectionStore, type PlanItem } from '../lib/selection';
import { STATUS_COLOURS, STATUS_LABELS, STATUS_ORDER } from '../lib/styles';

/** Up to this many lines far from the bore are listed without asking. */
const FAR_LINES_SHOWN = 30;

function StatusBadge({ lc, before }: { lc: LineClearance; before?: LineClearance }) {
  const changed = before && before.status !== lc.status;
  return (
    <span className="inline-flex flex-wrap items-center gap-1">
      {changed && (
        <>
          <span className="text-xs text-ink-500 line-through" title="Saved status">
            {STATUS_LABELS[before.status]}
          </span>
          <span aria-hidden className="text-ink-400">
            →
          </span>
        </>
      )}
      <span
        className="inline-flex items-center rounded-full px-2 py-0.5 text-xs font-semibold text-white"
        style={{ backgroundColor: STATUS_COLOURS[lc.status] }}
        data-testid="line-status"
      >
        {STATUS_LABELS[lc.status]}
      </span>
    </span>
  );
}

/**
 * Every line of the project against the chosen bore: relation, station, clearance, requirement,
 * margin and status, worst first; lines too far from the bore are listed last. Selecting a row
 * selects the line on the map and in the profile.
 */
export function ClearanceTable({ lines, report, baseReport, unit, stationStyle, editing }: {
  lines: readonly LineDto[];
  report: BoreReport | null;
  /** The saved report, to show what an edit changes. */
  baseReport: BoreReport | null;
  unit: LinearUnit;
  stationStyle: StationStyle;
  editing: boolean;
}) {
  const store = useSelectionStore();
  const selection = useSelection();
  const u = UNIT_SYMBOLS[unit];
  const byLine = new Map(report?.lines.map((l) => [l.lineId, l]) ?? []);
  const before = new Map(baseReport?.lines.map((l) => [l.lineId, l]) ?? []);
  const rows = [...lines].sort((a, b) => {
    const la = byLine.get(a.id);
    const lb = byLine.get(b.id);
    if (la && lb) return STATUS_ORDER[la.status] - STATUS_ORDER[lb.status] || (la.points[la.governingPoint]?.station ?? 0) - (lb.points[lb.governingPoint]?.station ?? 0);
    if (la) return -1;
    if (lb) return 1;
    return a.label.localeCompare(b.label);
  });
  const fmt = (v: number | null | undefined) => (v == null ? '—' : `${formatNumber(v, 2)}`);
  // Lines far from the bore are listed too, unless there are so many that they would bury the rest.
  const far = rows.filter((l) => !byLine.has(l.id));
  const [showFar, setShowFar] = useState(false);
  const hideFar = far.length > FAR_LINES_SHOWN && !showFar;
  const shown = hideFar ? rows.filter((l) => byLine.has(l.id)) : rows;

  return (
    <div className="relative overflow-x-auto rounded-lg border border-ink-200 bg-white" role="region" aria-label="Lines against the bore" tabIndex={0}>
      <table className="min-w-full border-collapse text-sm" data-testid="clearance-table">
        <caption className="sr-only">Every line of the project against the chosen bore, worst first. Figures in {u}.</caption>
        <thead className="bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
          <tr>
            <th scope="col" className="sticky left-0 z-10 bg-ink-50 px-3 py-2">Line</th>
            <th scope="col" className="px-3 py-2">Status</th>
            <th scope="col" className="px-3 py-2">Relation</th>
            <th scope="col" className="px-3 py-2">Station</th>
            <th scope="col" className="px-3 py-2 text-right">Clearance, {u}</th>
            <th scope="col" className="px-3 py-2 text-right">Required, {u}</th>
            <th scope="col" className="px-3 py-2 text-right">Margin, {u}</th>
            <th scope="col" className="px-3 py-2">QL</th>
          </tr>
        </thead>
        <tbody>
          {shown.map((line) => {
            const lc = byLine.get(line.id);
            const p = lc?.points[lc.governingPoint];
            const item: PlanItem = { type: 'line', id: line.id };
            const selected = sameItem(selection.selected, item);
            const hovered = sameItem(selection.hovered, item);
            return (
              <tr
                key={line.id}
                data-line-id={line.id}
                data-line-label={line.label}
                data-status={lc?.status ?? 'far'}
                aria-selected={selected}
                className={cn('cursor-pointer border-b border-ink-100 last:border-b-0', selected ? 'bg-sky-50' : hovered ? 'bg-ink-50' : 'hover:bg-ink-50')}
                onClick={() => store.select(selected ? null : item)}
                onMouseEnter={() => store.hover(item)}
                onMouseLeave={() => sameItem(store.get().hovered, item) && store.hover(null)}
              >
                <th scope="row" className={cn('sticky left-0 z-10 px-3 py-2 text-left font-medium', selected ? 'bg-sky-50' : 'bg-white')}>
                  <button
                    type="button"
                    className="flex max-w-64 items-start gap-2 text-left hover:underline"
                    aria-pressed={selected}
                    onClick={(e) => {
                      e.stopPropagation();
                      store.select(selected ? null : item);
                    }}
                  >
                    <KindSwatch kind={line.kind} showLabel={false} />
                    <span className="whitespace-normal">{line.label}</span>
                  </button>
                </th>
                <td className="px-3 py-2 whitespace-nowrap">{lc ? <StatusBadge lc={lc} before={editing ? before.get(line.id) : undefined} /> : <span className="text-xs text-ink-500">not near this bore</span>}</td>
                <td className="px-3 py-2 whitespace-nowrap text-ink-700">
                  {lc ? (lc.relation === 'crossing' ? `crosses${p?.position ? `, ${p.position}` : ''}` : `beside, ${p ? `${formatNumber(p.offset, 2)} ${p.side}` : ''}`) : '—'}
                </td>
                <td className="px-3 py-2 whitespace-nowrap tabular">{p ? formatStation(p.station, stationStyle) : '—'}</td>
                <td className="px-3 py-2 text-right tabular">{fmt(lc?.clearance)}</td>
                <td className="px-3 py-2 text-right tabular">{lc ? fmt(lc.required) : '—'}</td>
                <td className={cn('px-3 py-2 text-right tabular', lc?.margin != null && lc.margin < 0 && 'font-semibold text-danger-700')}>{fmt(lc?.margin)}</td>
                <td className="px-3 py-2">
                  <QualityLevelBadge level={line.qualityLevel} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {hideFar && (
        <p className="border-t border-ink-100 px-3 py-2 text-sm text-ink-600">
          {formatNumber(far.length, 0)} more lines are not near this bore.{' '}
          <button type="button" className="font-medium text-brand-700 underline" onClick={() => setShowFar(true)}>
            List them too
          </button>
        </p>
      )}
    </div>
  );
}
