/**
 * Vertical profiles: station–elevation points with straight grades between them (SPEC §4.3).
 * Used for the bore's casing centreline and for the ground along the bore.
 */
import { GeometryError } from './errors';

/** A station–elevation pair as stored on a bore. */
export interface ProfilePointLike {
  station: number;
  elevation: number;
}

/** A profile checked once: finite values, strictly increasing stations. */
export interface PreparedProfile {
  readonly stations: Float64Array;
  readonly elevations: Float64Array;
  /** First and last station (NaN for an empty profile). */
  readonly start: number;
  readonly end: number;
}

/**
 * Check and prepare a profile. Throws INVALID_NUMBER for a non-finite value, PROFILE_NOT_ORDERED
 * when stations do not strictly increase, PROFILE_TOO_SHORT below `minPoints`.
 */
export function prepareProfile(points: readonly ProfilePointLike[], what: string, minPoints = 2): PreparedProfile {
  if (!Array.isArray(points)) throw new GeometryError('INVALID_INPUT', `${what} must be a list of station–elevation points`);
  if (points.length < minPoints) {
    throw new GeometryError('PROFILE_TOO_SHORT', `${what} needs at least ${minPoints} points (got ${points.length})`);
  }
  const stations = new Float64Array(points.length);
  const elevations = new Float64Array(points.length);
  for (let i = 0; i < points.length; i++) {
    const p = points[i]!;
    if (!p || !Number.isFinite(p.station) || !Number.isFinite(p.elevation)) {
      throw new GeometryError('INVALID_NUMBER', `${what}: point ${i + 1} needs a finite station and elevation`, { point: i });
    }
    if (i > 0 && !(p.station > stations[i - 1]!)) {
      throw new GeometryError(
        'PROFILE_NOT_ORDERED',
        `${what}: stations must increase (point ${i + 1} at ${p.station} follows ${stations[i - 1]!})`,
        { point: i },
      );
    }
    stations[i] = p.station;
    elevations[i] = p.elevation;
  }
  return {
    stations,
    elevations,
    start: points.length > 0 ? stations[0]! : NaN,
    end: points.length > 0 ? stations[points.length - 1]! : NaN,
  };
}

/** Tolerance for "at the end of the profile": rounding of a computed station must not fall outside. */
function endTolerance(station: number): number {
  return 1e-9 * Math.max(1, Math.abs(station));
}

/** True when the station lies within the profile (end points included). */
export function profileCovers(profile: PreparedProfile, station: number): boolean {
  const n = profile.stations.length;
  if (n === 0) return false;
  const tol = endTolerance(station);
  return station >= profile.start - tol && station <= profile.end + tol;
}

/**
 * Elevation at a station, linear between profile points; null outside the profile (no silent
 * extrapolation: the caller flags it). A single-point profile covers only its own station.
 */
export function profileElevation(profile: PreparedProfile, station: number): number | null {
  if (!Number.isFinite(station) || !profileCovers(profile, station)) return null;
  const { stations, elevations } = profile;
  const n = stations.length;
  if (station <= stations[0]!) return elevations[0]!;
  if (station >= stations[n - 1]!) return elevations[n - 1]!;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (stations[mid]! <= station) lo = mid;
    else hi = mid;
  }
  const s0 = stations[lo]!;
  const s1 = stations[hi]!;
  const f = (station - s0) / (s1 - s0);
  return elevations[lo]! + f * (elevations[hi]! - elevations[lo]!);
}

/** Elevation at a station, throwing STATION_OUTSIDE_PROFILE outside the profile. */
export function profileElevationOrThrow(profile: PreparedProfile, station: number, what = 'profile'): number {
  const z = profileElevation(profile, station);
  if (z === null) {
    throw new GeometryError(
      'STATION_OUTSIDE_PROFILE',
      `station ${station} is outside the ${what} (${profile.start} to ${profile.end})`,
      { station, start: profile.start, end: profile.end },
    );
  }
  return z;
}

/** Cover at a station = ground − (centreline + casing radius); null when either profile misses the station. */
export function coverAt(bore: PreparedProfile, ground: PreparedProfile, casingRadius: number, station: number): number | null {
  const c = profileElevation(bore, station);
  const g = profileElevation(ground, station);
  if (c === null || g === null) return null;
  return g - (c + casingRadius);
}

/** Least cover over a station range, checked at every break of either profile (cover is linear between). */
export function minimumCover(
  bore: PreparedProfile, ground: PreparedProfile, casingRadius: number, from: number, to: number,
): { cover: number; station: number } | null {
  const lo = Math.max(from, bore.start, ground.start);
  const hi = Math.min(to, bore.end, ground.end);
  if (!(lo <= hi)) return null;
  const stations = [lo, hi];
  for (const s of bore.stations) if (s > lo && s < hi) stations.push(s);
  for (const s of ground.stations) if (s > lo && s < hi) stations.push(s);
  let best: { cover: number; station: number } | null = null;
  for (const s of stations) {
    const c = coverAt(bore, ground, casingRadius, s);
    if (c !== null && (best === null || c < best.cover || (c === best.cover && s < best.station))) best = { cover: c, station: s };
  }
  return best;
}
