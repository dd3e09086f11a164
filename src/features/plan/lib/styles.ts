/**
 * How the plan and the profile draw things. The APWA marking colours of line kinds come from
 * shared/domain.ts; everything else here is Threadline's own choice, explained in the legend.
 */
import type { ClearanceStatus, HoleStatus, QualityLevel } from '@shared/domain';

/** Clearance status colours (worst first), used for crossing markers, the profile and badges. */
export const STATUS_COLOURS: Record<ClearanceStatus, string> = {
  overlap: '#7f1d1d',
  conflict: '#dc2626',
  marginal: '#d97706',
  unverified: '#475569',
  clear: '#15803d',
};

export { CLEARANCE_STATUS_LABELS as STATUS_LABELS, CLEARANCE_STATUS_MEANINGS as STATUS_MEANINGS } from '@shared/domain';


export const STATUS_ORDER: Record<ClearanceStatus, number> = { overlap: 0, conflict: 1, marginal: 2, unverified: 3, clear: 4 };

/**
 * Line dash by ASCE 38 quality level: the surer the position, the more solid the line.
 * Values are Leaflet/SVG dash arrays in pixels for a 3-px line.
 */
export const QL_DASH: Record<QualityLevel, string | null> = {
  A: null,
  B: '14 6',
  C: '7 6',
  D: '2 6',
};

export const QL_DASH_MEANINGS: Record<QualityLevel, string> = {
  A: 'solid: QL-A, exposed and measured',
  B: 'long dashes: QL-B, designated by geophysics',
  C: 'short dashes: QL-C, surface features and records',
  D: 'dots: QL-D, records only',
};

/** Test holes on the map: fill and outline by status (planned holes are hollow). */
export const HOLE_STYLES: Record<HoleStatus, { fill: string; stroke: string; dash: string | null; label: string }> = {
  planned: { fill: '#ffffff', stroke: '#1e2226', dash: '2 2', label: 'Planned (hollow)' },
  dug: { fill: '#b6bdc4', stroke: '#1e2226', dash: null, label: 'Dug (grey)' },
  surveyed: { fill: '#35777e', stroke: '#0d1f23', dash: null, label: 'Surveyed (teal)' },
  reviewed: { fill: '#0d1f23', stroke: '#ffffff', dash: null, label: 'Reviewed (dark)' },
};

/** A suggested test hole: a dashed ring, no fill. */
export const SUGGESTED_STYLE = { stroke: '#7c2d92', dash: '3 3' };

/** The proposed bore: white (APWA white = proposed excavation) on a dark casing outline. */
export const BORE_STYLE = { outline: '#1e2226', fill: '#ffffff' };
