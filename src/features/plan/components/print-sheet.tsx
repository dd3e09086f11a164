/**
 * The printed plan-and-profile sheet (browser print, or "Save as PDF"): a title block, the map
 * with its scale bar and north arrow, the profile, the legend, and the reference frame (CRS,
 * unit, vertical datum, station style) with the time of the last clearance check.
 */
import './print-sheet.css';
import { useEffect } from 'react';
import { UNIT_LABELS, type LineKind } from '@shared/domain';
import type { BoreDto, ProjectDto } from '@shared/api';
import { formatStation } from '@shared/geometry';
import { formatDateTime } from '@/lib/format';
import { Legend } from './legend';

/** While the page is shown, print media uses the sheet layout (app chrome hidden). */
export function usePrintMode(): void {
  useEffect(() => {
    document.body.classList.add('tl-print-plan');
    return () => document.body.classList.remove('tl-print-plan');
  }, []);
}

export function PrintHeader({ project, bore, checkedAt }: { project: ProjectDto; bore: BoreDto | null; checkedAt: string }) {
  return (
    <div className="hidden border-b-2 border-ink-900 pb-2 print:block" data-testid="print-header">
      <div className="flex items-end justify-between gap-4">
        <div>
          <p className="text-xs tracking-wide text-ink-600 uppercase">Plan and profile</p>
          <p className="text-lg font-semibold">{bore ? `${bore.name}` : project.name}</p>
          <p className="text-xs">
            {project.name} · {project.client}
          </p>
        </div>
        <div className="text-right text-[11px] leading-snug">
          <p>
            CRS {project.crsCode} · {UNIT_LABELS[project.unit]} · elevations {project.verticalDatum}
          </p>
          <p>Stations {project.stationStyle === '100' ? '100-unit (12+34.56)' : '1000-unit (1+234.567)'}{bore && `, ${formatStation(bore.beginStation, project.stationStyle)} at the start`}</p>
          <p>Clearances checked {formatDateTime(checkedAt)} · printed {formatDateTime(new Date().toISOString())}</p>
        </div>
      </div>
    </div>
  );
}

export function PrintFooter({ project, kinds }: { project: ProjectDto; kinds: readonly LineKind[] }) {
  return (
    <div className="hidden space-y-2 border-t border-ink-300 pt-2 text-[10px] print:block" data-testid="print-footer">
      <Legend kinds={kinds} compact />
      <p>
        Grid: {project.crsCode}; every length in {UNIT_LABELS[project.unit]}; every elevation in {project.verticalDatum}. North arrow: up is true north;
        the scale bar reads grid distance. Clearances are a design aid: a licensed engineer checks them against the owners’ and the local authority’s
        requirements. Notify the one-call centre before any digging.
      </p>
    </div>
  );
}
