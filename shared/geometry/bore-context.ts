/**
 * A bore prepared for the engine: checked alignment and profiles, pits, the 3-D casing
 * centreline and the search distance W. A bore whose own geometry is unusable yields a report
 * with computed: false and the reason.
 */
import type { ClearanceStatus } from '../domain';
import { CLEARANCE_STATUSES } from '../domain';
import { isGeometryError } from './errors';
import { preparePit, type PreparedPit } from './pit';
import { pointAtChainage, preparePolyline, type PreparedPolyline } from './polyline';
import { prepareProfile, profileElevation, type PreparedProfile } from './profile';
import { finiteNonNegative, type Scene } from './scene';
import type { BoreInput, BoreReport, Issue } from './types';
import type { CoverConstraint } from './window';

/** A bore ready for the engine. */
export interface BoreContext {
  input: BoreInput;
  align: PreparedPolyline;
  begin: number;
  end: number;
  profile: PreparedProfile;
  ground: PreparedProfile | null;
  radius: number;
  pits: PreparedPit[];
  /** 3-D casing centreline relative to (ox, oy), where the profile covers the alignment. */
  bore3d: { xs: Float64Array; ys: Float64Array; zs: Float64Array } | null;
  ox: number;
  oy: number;
  /** Search distance W. */
  reach: number;
  warnings: Issue[];
}

/** A zero count for every status. */
export function emptyCounts(): Record<ClearanceStatus, number> {
  return Object.fromEntries(CLEARANCE_STATUSES.map((s) => [s, 0])) as Record<ClearanceStatus, number>;
}

function failedBore(bore: BoreInput, message: string): BoreReport {
  const error: Issue = { code: 'BORE_INVALID', message: `bore ${bore.name}: ${message}`, boreId: bore.id };
  return {
    boreId: bore.id, name: bore.name, computed: false, error, length: null,
    beginStation: bore.beginStation, endStation: null, casingRadius: null, cover: null,
    lines: [], pitConflicts: [], suggestedHoles: [], window: null, counts: emptyCounts(), warnings: [error],
  };
}

/** Prepare a bore; returns a failed report (computed: false) when its own geometry is unusable. */
export function prepareBore(scene: Scene, bore: BoreInput): BoreContext | BoreReport {
  const checks: [boolean, string][] = [
    [Number.isFinite(bore.beginStation), 'begin station must be a finite number'],
    [Number.isFinite(bore.casingOd) && bore.casingOd > 0, 'casing outside diameter must be a finite number greater than zero'],
    [finiteNonNegative(bore.toleranceHorizontal), 'horizontal tolerance must be a finite number, zero or more'],
    [finiteNonNegative(bore.toleranceVertical), 'vertical tolerance must be a finite number, zero or more'],
    [finiteNonNegative(bore.minCover), 'minimum cover must be a finite number, zero or more'],
  ];
  for (const [ok, message] of checks) if (!ok) return failedBore(bore, message);
  let align: PreparedPolyline;
  let profile: PreparedProfile;
  let ground: PreparedProfile | null;
  try {
    align = preparePolyline(bore.alignment, 'alignment', 'DEGENERATE_ALIGNMENT');
    profile = prepareProfile(bore.profile, 'bore profile', 2);
    ground = prepareProfile(bore.groundProfile ?? [], 'ground profile', 0);
  } catch (e) {
    if (!isGeometryError(e)) throw e;
    return failedBore(bore, e.message);
  }
  const warnings: Issue[] = [];
  const begin = bore.beginStation;
  const end = begin + align.length;
  const tol = (s: number) => 1e-9 * Math.max(1, Math.abs(s));
  if (profile.start > begin + tol(begin) || profile.end < end - tol(end)) {
    warnings.push({
      code: 'PROFILE_DOES_NOT_COVER_ALIGNMENT',
      message: `bore ${bore.name}: the profile runs from station ${profile.start} to ${profile.end} but the alignment from ${begin} to ${end}; crossings outside the profile have no figures`,
      boreId: bore.id,
    });
  }
  if (ground.stations.length === 0) {
    warnings.push({ code: 'NO_GROUND_PROFILE', message: `bore ${bore.name} has no ground profile: cover and record-depth elevations cannot be computed`, boreId: bore.id });
    ground = null;
  } else if (ground.start > begin + tol(begin) || ground.end < end - tol(end)) {
    warnings.push({
      code: 'GROUND_DOES_NOT_COVER_ALIGNMENT',
      message: `bore ${bore.name}: the ground profile runs from station ${ground.start} to ${ground.end} but the alignment from ${begin} to ${end}`,
      boreId: bore.id,
    });
  }
  const pits: PreparedPit[] = [];
  for (const pit of bore.pits ?? []) {
    const p = preparePit(pit, bore.id);
    if ('code' in p) warnings.push(p);
    else pits.push(p);
  }
  const radius = bore.casingOd / 2;
  const ox = align.xs[0]!;
  const oy = align.ys[0]!;
  // 3-D centreline: breaks at alignment vertices and profile points, where the profile covers the alignment.
  let bore3d: BoreContext['bore3d'] = null;
  const lo = Math.max(begin, profile.start);
  const hi = Math.min(end, profile.end);
  if (lo < hi) {
    const stations = new Set<number>([lo, hi]);
    for (let k = 0; k < align.cum.length; k++) {
      const s = begin + align.cum[k]!;
      if (s > lo && s < hi) stations.add(s);
    }
    for (const s of profile.stations) if (s > lo && s < hi) stations.add(s);
    const sorted = [...stations].sort((a, b) => a - b);
    const xs = new Float64Array(sorted.length);
    const ys = new Float64Array(sorted.length);
    const zs = new Float64Array(sorted.length);
    sorted.forEach((s, i) => {
      const p = pointAtChainage(align, s - begin);
      xs[i] = p.x - ox;
      ys[i] = p.y - oy;
      zs[i] = profileElevation(profile, s)!;
    });
    bore3d = { xs, ys, zs };
  }
  const reach = radius + bore.toleranceHorizontal + scene.input.settings.verificationDistance + scene.maxReach;
  return { input: bore, align, begin, end, profile, ground, radius, pits, bore3d, ox, oy, reach, warnings };
}

/** Spare cover (ground − top of casing − minimum cover) at every profile break, for the bore window. */
export function coverConstraints(b: BoreContext): CoverConstraint[] {
  if (!b.ground) return [];
  const ground = b.ground;
  const lo = Math.max(b.begin, b.profile.start, ground.start);
  const hi = Math.min(b.end, b.profile.end, ground.end);
  if (!(lo <= hi)) return [];
  const stations = new Set<number>([lo, hi]);
  for (const s of b.profile.stations) if (s > lo && s < hi) stations.add(s);
  for (const s of ground.stations) if (s > lo && s < hi) stations.add(s);
  return [...stations]
    .sort((p, q) => p - q)
    .map((s) => ({ station: s, slack: profileElevation(ground, s)! - (profileElevation(b.profile, s)! + b.radius) - b.input.minCover }));
}

