import type { ClearanceStatus, DepthReference, ExcavationMethod, HoleStatus, PositionSource } from '@shared/domain';
import { CLEARANCE_STATUSES } from '@shared/domain';
import type { ClearancesDto } from '@shared/api';

export const HOLE_STATUS_LABELS: Record<HoleStatus, string> = {
  planned: 'Planned',
  dug: 'Dug',
  surveyed: 'Surveyed',
  reviewed: 'Reviewed',
};

/** What each step of the workflow means, for the status stepper. */
export const HOLE_STATUS_MEANINGS: Record<HoleStatus, string> = {
  planned: 'position chosen, not dug yet',
  dug: 'exposed and measured by the crew',
  surveyed: 'tied in by the surveyor',
  reviewed: 'accepted by the designer; locked',
};

export const SOURCE_LABELS: Record<PositionSource, string> = {
  grid: 'typed E/N',
  station: 'station/offset',
  gps: 'phone GPS',
  map: 'picked on map',
  survey: 'surveyed',
};

export const REFERENCE_LABELS: Record<DepthReference, string> = { top: 'to top', centre: 'to centre', bottom: 'to bottom' };

export const METHOD_LABELS: Record<ExcavationMethod, string> = { air: 'Air (vacuum)', water: 'Water (hydro)' };

export { CLEARANCE_STATUS_LABELS as CLEARANCE_LABELS, CLEARANCE_STATUS_MEANINGS as CLEARANCE_MEANINGS } from '@shared/domain';


/** Worst status first (index 0 = overlap). */
export function clearanceRank(status: ClearanceStatus): number {
  return CLEARANCE_STATUSES.indexOf(status);
}

export interface LineClearanceSummary {
  status: ClearanceStatus;
  /** The bore(s) the status was found against, worst first. */
  bores: { boreId: number; name: string; status: ClearanceStatus }[];
}

/** Each line's worst status over every bore of the report (lines near no bore are absent). */
export function worstStatusByLine(report: ClearancesDto['report'] | undefined): Map<number, LineClearanceSummary> {
  const byLine = new Map<number, LineClearanceSummary>();
  if (!report) return byLine;
  for (const bore of report.bores) {
    for (const line of bore.lines) {
      const entry = byLine.get(line.lineId) ?? { status: line.status, bores: [] };
      entry.bores.push({ boreId: bore.boreId, name: bore.name, status: line.status });
      if (clearanceRank(line.status) < clearanceRank(entry.status)) entry.status = line.status;
      byLine.set(line.lineId, entry);
    }
  }
  for (const entry of byLine.values()) entry.bores.sort((a, b) => clearanceRank(a.status) - clearanceRank(b.status));
  return byLine;
}
