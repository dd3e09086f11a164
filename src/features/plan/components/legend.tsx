import { CLEARANCE_STATUSES, HOLE_STATUSES, LINE_KIND_COLOURS, LINE_KIND_LABELS, QUALITY_LEVELS, type LineKind } from '@shared/domain';
import { HOLE_STYLES, QL_DASH, QL_DASH_MEANINGS, STATUS_COLOURS, STATUS_LABELS, STATUS_MEANINGS, SUGGESTED_STYLE } from '../lib/styles';
import type { LayerState } from './plan-map';

const LAYER_LABELS: Record<keyof LayerState, string> = {
  basemap: 'Base map',
  lines: 'Lines',
  holes: 'Test holes',
  suggested: 'Suggested test holes',
  conflicts: 'Crossing markers',
  bores: 'Bores and pits',
  stations: 'Station labels',
};

/** Layer toggles: one checkbox per overlay. */
export function LayerToggles({ layers, onChange, basemapAvailable }: { layers: LayerState; onChange: (next: LayerState) => void; basemapAvailable: boolean }) {
  return (
    <fieldset className="space-y-0.5">
      <legend className="mb-1 text-sm font-semibold text-ink-900">Layers</legend>
      {(Object.keys(LAYER_LABELS) as (keyof LayerState)[]).map((key) => (
        <label key={key} className="flex min-h-9 items-center gap-2.5 text-sm text-ink-800">
          <input
            type="checkbox"
            className="size-4.5 accent-brand-700"
            checked={layers[key]}
            disabled={key === 'basemap' && !basemapAvailable}
            onChange={(e) => onChange({ ...layers, [key]: e.target.checked })}
          />
          {LAYER_LABELS[key]}
          {key === 'basemap' && !basemapAvailable && <span className="text-xs text-ink-500">(none: plain grid)</span>}
        </label>
      ))}
    </fieldset>
  );
}

function LineSample({ colour, dash, opacity = 1 }: { colour: string; dash?: string | null; opacity?: number }) {
  return (
    <svg aria-hidden viewBox="0 0 36 8" className="h-2 w-9 shrink-0">
      <line x1="1" y1="4" x2="35" y2="4" stroke={colour} strokeWidth="3" strokeDasharray={dash ?? undefined} opacity={opacity} />
    </svg>
  );
}

/** What every colour, dash and mark on the plan and the profile means. */
export function Legend({ kinds, compact = false }: { kinds: readonly LineKind[]; compact?: boolean }) {
  const item = 'flex items-center gap-2';
  return (
    <div className={compact ? 'grid grid-cols-2 gap-x-6 gap-y-2 text-[11px]' : 'space-y-3 text-xs text-ink-700'} data-testid="plan-legend">
      <section>
        <h3 className="mb-1 text-xs font-semibold text-ink-900">Line kinds (APWA marking colours)</h3>
        <ul className="space-y-0.5">
          {kinds.map((k) => (
            <li key={k} className={item}>
              <LineSample colour={LINE_KIND_COLOURS[k]} />
              {LINE_KIND_LABELS[k]}
            </li>
          ))}
          <li className={item}>
            <LineSample colour="#6b7280" opacity={0.45} />
            Abandoned lines are faded
          </li>
        </ul>
      </section>
      <section>
        <h3 className="mb-1 text-xs font-semibold text-ink-900">Line style by quality level (ASCE 38)</h3>
        <ul className="space-y-0.5">
          {[...QUALITY_LEVELS].reverse().map((q) => (
            <li key={q} className={item}>
              <LineSample colour="#374151" dash={QL_DASH[q]} />
              {QL_DASH_MEANINGS[q]}
            </li>
          ))}
        </ul>
      </section>
      <section>
        <h3 className="mb-1 text-xs font-semibold text-ink-900">Bores, pits and test holes</h3>
        <ul className="space-y-0.5">
          <li className={item}>
            <svg aria-hidden viewBox="0 0 36 10" className="h-2.5 w-9 shrink-0">
              <line x1="1" y1="5" x2="35" y2="5" stroke="#1e2226" strokeWidth="8" />
              <line x1="1" y1="5" x2="35" y2="5" stroke="#ffffff" strokeWidth="3.5" />
            </svg>
            Proposed bore (white: proposed excavation), ticks at stations
          </li>
          <li className={item}>
            <svg aria-hidden viewBox="0 0 36 12" className="h-3 w-9 shrink-0">
              <rect x="8" y="1" width="20" height="10" fill="#6b7681" fillOpacity="0.35" stroke="#1e2226" strokeDasharray="4 3" />
            </svg>
            Launch or receiving pit
          </li>
          {HOLE_STATUSES.map((s) => (
            <li key={s} className={item}>
              <svg aria-hidden viewBox="0 0 36 14" className="h-3.5 w-9 shrink-0">
                <circle cx="18" cy="7" r="5" fill={HOLE_STYLES[s].fill} stroke={HOLE_STYLES[s].stroke === '#ffffff' ? '#0d1f23' : HOLE_STYLES[s].stroke} strokeWidth="1.5" strokeDasharray={HOLE_STYLES[s].dash ?? undefined} />
              </svg>
              Test hole: {HOLE_STYLES[s].label.toLowerCase()}
            </li>
          ))}
          <li className={item}>
            <svg aria-hidden viewBox="0 0 36 18" className="h-4 w-9 shrink-0">
              <circle cx="18" cy="9" r="7" fill="none" stroke={SUGGESTED_STYLE.stroke} strokeWidth="2" strokeDasharray={SUGGESTED_STYLE.dash} />
            </svg>
            Suggested test hole (where to dig next)
          </li>
        </ul>
      </section>
      <section>
        <h3 className="mb-1 text-xs font-semibold text-ink-900">Clearance status (markers, profile)</h3>
        <ul className="space-y-0.5">
          {CLEARANCE_STATUSES.map((s) => (
            <li key={s} className="flex items-start gap-2">
              <svg aria-hidden viewBox="0 0 36 18" className="mt-0.5 h-4 w-9 shrink-0">
                <circle cx="18" cy="9" r="7" fill="#ffffff" stroke={STATUS_COLOURS[s]} strokeWidth="3" />
              </svg>
              <span>
                <strong className="font-semibold">{STATUS_LABELS[s]}</strong>
                {!compact && <>: {STATUS_MEANINGS[s]}</>}
              </span>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
