/**
 * The clearance engine (SPEC §4): every existing line against every proposed bore, with figures,
 * status, basis, pit conflicts, suggested test holes and the bore window. Pure: no I/O.
 *
 * Phases (exported separately so the benchmark can time them):
 *  1. `prepareScene` (scene.ts): check settings and rules, prepare lines (polylines, sizes,
 *     requirements) and their hole-based elevation models; bad lines and holes become warnings.
 *  2. `buildSegmentIndex` (spatial-index.ts): flatbush over all line segments.
 *  3. `analyseBore` (here): prepare the bore (bore-context.ts), find the line segments within its
 *     search distance W (candidates.ts: index query, then an exact distance test), compute each
 *     line's figures (line-analysis.ts, crossing.ts), pit conflicts, cover and the window (window.ts).
 *
 * Search distance W = casing radius + horizontal tolerance + verification distance
 *   + max over lines (half-width + horizontal requirement + quality-level uncertainty).
 * A line that does not cross is reported when its horizontal clearance is within its own
 * requirement + tolerance + uncertainty + verification distance (so it could fail, be marginal,
 * or deserves a hole); farther lines are not reported. The exact test makes the result
 * independent of how candidates were found (index or all pairs).
 *
 * Simplifications (documented for the designer):
 *  - The 3-D clear distance is the closest approach of the casing centreline (plan alignment ×
 *    profile) and the line centreline (plan path × top − height/2), over the line's segments
 *    within W of the bore, minus the casing radius and the line's half-height (boxes: half the
 *    height, not the true box-to-cylinder distance).
 *  - A line with no usable hole takes its top from the record depth below the bore's ground
 *    profile at the crossing (or closest) station, constant along the line for the 3-D figure.
 *  - A line that does not cross but whose plan footprint overlaps the casing's (running right
 *    above or below it) is judged on its 3-D clear distance (the least gap along the whole
 *    stretch) against the vertical requirement, and enters the bore window like a crossing.
 *  - The closest point of a line running parallel to the bore is the lowest-station point of the
 *    equally close stretch (a deterministic choice; verification is checked there).
 */
import type Flatbush from 'flatbush';
import { analyseLine } from './line-analysis';
import { coverConstraints, emptyCounts, prepareBore } from './bore-context';
import { findCandidates } from './candidates';
import { minimumCover } from './profile';
import { prepareScene, type Scene } from './scene';
import { buildSegmentIndex } from './spatial-index';
import type { BoreInput, BoreReport, ClearanceInput, ClearanceReport, Issue, LineClearance, PitConflict } from './types';
import { shiftWindow, windowPolygon, type VerticalConstraint } from './window';

export { prepareScene } from './scene';
export type { Scene, LineContext } from './scene';
export { prepareBore } from './bore-context';
export type { BoreContext } from './bore-context';
export { findCandidates } from './candidates';
export { analyseLine, pitConflictsOf } from './line-analysis';
export { buildSegmentIndex } from './spatial-index';

/** Options of a computation. */
export interface EngineOptions {
  /** How candidate line segments are found: 'index' (default, flatbush) or 'all' (every segment: the naive baseline). */
  search?: 'index' | 'all';
  /** Search box of the 2-D window polygon: |shift| ≤ shiftBound (project unit), |grade change| ≤ gradeBound. */
  windowShiftBound?: number;
  windowGradeBound?: number;
}

/** Phase 3: every figure for one bore. */
export function analyseBore(scene: Scene, bore: BoreInput, index: Flatbush | null, options: EngineOptions = {}): BoreReport {
  const prepared = prepareBore(scene, bore);
  if (!('align' in prepared)) return prepared;
  const b = prepared;
  const candidates = findCandidates(scene, b, index, options.search ?? 'index');
  const lines: LineClearance[] = [];
  const pitConflicts: PitConflict[] = [];
  for (const [li, segs] of candidates) {
    const r = analyseLine(scene, b, scene.lines[li]!, segs);
    if (r.clearance) lines.push(r.clearance);
    pitConflicts.push(...r.pitConflicts);
  }
  const keyStation = (c: LineClearance) => c.points[c.governingPoint]!.station;
  lines.sort((p, q) => keyStation(p) - keyStation(q) || p.lineId - q.lineId);
  pitConflicts.sort((p, q) => p.pitId - q.pitId || p.lineId - q.lineId);
  const counts = emptyCounts();
  for (const c of lines) counts[c.status]++;
  const warnings = [...b.warnings];

  let cover: BoreReport['cover'] = null;
  if (b.ground) {
    const m = minimumCover(b.profile, b.ground, b.radius, b.begin, b.end);
    if (m) {
      cover = { minimum: m.cover, station: m.station, belowMinimum: m.cover < bore.minCover };
      if (cover.belowMinimum) {
        warnings.push({
          code: 'COVER_BELOW_MINIMUM',
          message: `bore ${bore.name}: cover ${m.cover.toFixed(2)} at station ${m.station.toFixed(2)} is less than the minimum ${bore.minCover}`,
          boreId: bore.id,
        });
      }
    }
  }

  const constraints: VerticalConstraint[] = [];
  const withoutFigures = new Set<number>();
  for (const c of lines) {
    for (const p of c.points) {
      if (p.governing !== 'vertical') continue;
      if (p.margin === null || p.position === null) {
        withoutFigures.add(c.lineId);
        continue;
      }
      constraints.push({ lineId: c.lineId, station: p.boreStation, position: p.position, margin: p.margin, allowance: p.allowance });
    }
  }
  if (withoutFigures.size > 0) {
    warnings.push({
      code: 'LINES_WITHOUT_FIGURES',
      message: `bore ${bore.name}: ${withoutFigures.size} crossed line(s) have no vertical figures and are left out of the bore window`,
      boreId: bore.id,
    });
  }
  const coverC = coverConstraints(b);
  const shiftBound = options.windowShiftBound ?? 100;
  const gradeBound = options.windowGradeBound ?? 0.25;
  const window = {
    requirement: {
      shift: shiftWindow(constraints, coverC, false),
      polygon: windowPolygon(constraints, coverC, b.begin, false, shiftBound, gradeBound),
    },
    withAllowance: {
      shift: shiftWindow(constraints, coverC, true),
      polygon: windowPolygon(constraints, coverC, b.begin, true, shiftBound, gradeBound),
    },
    linesWithoutFigures: [...withoutFigures].sort((p, q) => p - q),
  };

  return {
    boreId: bore.id,
    name: bore.name,
    computed: true,
    error: null,
    length: b.align.length,
    beginStation: b.begin,
    endStation: b.end,
    casingRadius: b.radius,
    cover,
    lines,
    pitConflicts,
    suggestedHoles: lines.flatMap((c) => c.suggestedHoles),
    window,
    counts,
    warnings,
  };
}

/** Every clearance of every line against every bore (SPEC §4), with warnings; pure and synchronous. */
export function computeClearances(input: ClearanceInput, options: EngineOptions = {}): ClearanceReport {
  const scene = prepareScene(input);
  const index = options.search === 'all' ? null : buildSegmentIndex(scene.store);
  return {
    unit: input.unit,
    bores: input.bores.map((bore) => analyseBore(scene, bore, index, options)),
    warnings: scene.warnings,
  };
}

