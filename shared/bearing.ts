/**
 * Read a direction of run as crews write it and return a grid azimuth in degrees (0 = north,
 * clockwise), or null when it cannot be read. Accepts quadrant bearings (`N 83° E`, `S12W`,
 * `N 83 E`), azimuths (`83`, `83°`, `263.5 deg`), compass points (`NE`, `E`, `NNE`) and runs
 * written with a dash (`E-W`, `NE-SW`: the first direction is used; a line has no sense of
 * direction, so either end will do).
 */
export function parseBearing(text: string | null | undefined): number | null {
  if (!text) return null;
  const t = text.trim().toUpperCase().replace(/DEGREES?|DEG|°|º/g, ' ').replace(/\s+/g, ' ').trim();
  if (t === '') return null;

  const quadrant = /^([NS])\s*(\d+(?:\.\d+)?)(?:\s+(\d+(?:\.\d+)?)'?)?\s*([EW])$/.exec(t);
  if (quadrant) {
    const deg = Number(quadrant[2]) + (quadrant[3] ? Number(quadrant[3]) / 60 : 0);
    if (deg > 90) return null;
    const ns = quadrant[1]!;
    const ew = quadrant[4]!;
    if (ns === 'N') return ew === 'E' ? deg : (360 - deg) % 360;
    return ew === 'E' ? 180 - deg : 180 + deg;
  }

  const azimuth = /^(\d+(?:\.\d+)?)$/.exec(t);
  if (azimuth) {
    const deg = Number(azimuth[1]);
    return deg >= 0 && deg <= 360 ? deg % 360 : null;
  }

  const first = t.split(/\s*[-–/ ]\s*|\s+TO\s+/)[0] ?? '';
  const POINTS: Record<string, number> = {
    N: 0, NNE: 22.5, NE: 45, ENE: 67.5, E: 90, ESE: 112.5, SE: 135, SSE: 157.5,
    S: 180, SSW: 202.5, SW: 225, WSW: 247.5, W: 270, WNW: 292.5, NW: 315, NNW: 337.5,
    NORTH: 0, EAST: 90, SOUTH: 180, WEST: 270,
  };
  return POINTS[first] ?? null;
}
