import type { EntityManager } from '@mikro-orm/sqlite';
import type { StakeMarkDto, StakeoutDto, StakePointDto } from '@shared/api';
import { LINE_KIND_LABELS } from '@shared/domain';
import { computeClearances, prepareProfile, profileElevation, stationOffset } from '@shared/geometry';
import type { BoreInput, BoreReport, ClearanceReport, LineClearance } from '@shared/geometry/types';
import { UNIT_SYMBOLS } from '@shared/units';
import { loadClearanceInput } from '../clearances/clearance-input';
import { reportFrame } from '../clearances/clearance.service';
import type { Project } from '../projects/project.entity';
import { StakeMark } from './stake-mark.entity';

/** A point to stake as computed (before its mark is attached), with why a suggested hole is where it is. */
export type StakePoint = Omit<StakePointDto, 'mark' | 'movedSinceStaked'> & {
  /** For suggested holes: at the crossing, or at the line's closest point to the bore. */
  reason: 'crossing' | 'closest_point' | null;
};

/** A bore as the stake-out needs it: the engine's input (alignment, ground profile, pits). */
export type StakeBore = Pick<BoreInput, 'id' | 'alignment' | 'beginStation' | 'groundProfile' | 'pits'>;

export function presentStakeMark(m: StakeMark): StakeMarkDto {
  return {
    id: m.id,
    key: m.key,
    kind: m.kind,
    stakedAt: m.stakedAt.toISOString(),
    stakedById: m.stakedBy?.id ?? null,
    stakedByName: m.stakedBy?.name ?? null,
    note: m.note,
    easting: m.easting,
    northing: m.northing,
    elevation: m.elevation,
    createdAt: m.createdAt.toISOString(),
  };
}

/** Ground at a station from a bore's ground profile, or why there is none. */
function groundAt(bore: StakeBore, station: number, beyond: 'start' | 'end' | null): { elevation: number | null; note: string } {
  if (!bore.groundProfile?.length) return { elevation: null, note: 'The bore has no ground profile: take the ground elevation on site.' };
  try {
    const z = beyond ? null : profileElevation(prepareProfile(bore.groundProfile, 'ground profile', 1), station);
    return z === null
      ? { elevation: null, note: 'Outside the bore’s ground profile: take the ground elevation on site.' }
      : { elevation: z, note: 'Ground from the bore’s ground profile at this station (not at the offset).' };
  } catch {
    return { elevation: null, note: 'The bore’s ground profile is not usable: take the ground elevation on site.' };
  }
}

/**
 * The points a survey crew stakes (SPEC §5), from a clearance report:
 * - confirmed line positions over each crossing, where a dug hole verifies the crossing
 *   (elevation: top of line at the crossing);
 * - suggested test holes for lines not yet verified (elevation: ground from the bore's ground
 *   profile at the station; none without a profile);
 * - the corners of every pit footprint (elevation: pit bottom).
 * Point names are short for lath and point files: `X<boreId>-<lineId>`, `SH<boreId>-<lineId>`,
 * `P<pitId>-<corner>`. Keys are stable while the geometry keeps its records: `crossing:<boreId>:<lineId>` (with
 * `:<n>` for a line's second and later crossings), `suggested:<boreId>:<lineId>:<reason>`
 * (with `:<n>` likewise), `pit:<pitId>:<corner>`.
 */
export function stakePoints(report: ClearanceReport, bores: readonly StakeBore[], unit: Project['unit']): StakePoint[] {
  const points: StakePoint[] = [];
  const boreById = new Map(bores.map((b) => [b.id, b]));
  const u = UNIT_SYMBOLS[unit];
  /** What every point on a line shares: its bore and line. */
  const onLine = (br: BoreReport, line: LineClearance) => ({
    boreId: br.boreId,
    boreName: br.name,
    lineId: line.lineId,
    lineLabel: line.label,
    lineKind: line.kind,
    pitId: null,
    pitKind: null,
  });
  for (const br of report.bores) {
    const bore = boreById.get(br.boreId);
    if (!bore || !br.computed) continue;
    for (const line of br.lines) {
      let n = 0;
      for (const p of line.points) {
        if (p.kind !== 'crossing') continue;
        n += 1;
        if (!p.verified) continue;
        const suffix = n > 1 ? `:${n}` : '';
        const holes = p.verifyingHoles.map((h) => h.number);
        points.push({
          key: `crossing:${br.boreId}:${line.lineId}${suffix}`,
          kind: 'crossing',
          name: `X${br.boreId}-${line.lineId}${n > 1 ? `-${n}` : ''}`,
          description: `${line.label} (${LINE_KIND_LABELS[line.kind]}): top of line over ${br.name}${holes.length ? `, verified by ${holes.join(', ')}` : ''}`,
          ...onLine(br, line),
          easting: p.easting,
          northing: p.northing,
          elevation: p.lineTop,
          elevationRef: 'line_top',
          elevationNote: p.lineTop === null ? 'No top-of-line elevation could be worked out here.' : null,
          station: p.station,
          offset: p.offset,
          side: p.side,
          beyond: p.beyond,
          holes,
          reason: null,
        });
      }
      const count = new Map<string, number>();
      for (const s of line.suggestedHoles) {
        const k = (count.get(s.reason) ?? 0) + 1;
        count.set(s.reason, k);
        const at = stationOffset(bore.alignment, bore.beginStation, [s.easting, s.northing]);
        const ground = groundAt(bore, s.station, at.beyond);
        points.push({
          key: `suggested:${br.boreId}:${line.lineId}:${s.reason}${k > 1 ? `:${k}` : ''}`,
          kind: 'suggested_hole',
          name: `SH${br.boreId}-${line.lineId}${k > 1 ? `-${k}` : ''}`,
          description: `Suggested test hole on ${line.label} (${LINE_KIND_LABELS[line.kind]}) ${s.reason === 'crossing' ? 'where it crosses' : 'where it comes closest to'} ${br.name}`,
          ...onLine(br, line),
          easting: s.easting,
          northing: s.northing,
          elevation: ground.elevation,
          elevationRef: 'ground',
          elevationNote: ground.note,
          station: s.station,
          offset: s.offset,
          side: s.side,
          beyond: at.beyond,
          holes: [],
          reason: s.reason,
        });
      }
    }
    for (const pit of [...(bore.pits ?? [])].sort((a, b) => a.id - b.id)) {
      pit.footprint.forEach(([e, nth], i) => {
        const at = stationOffset(bore.alignment, bore.beginStation, [e, nth]);
        const corner = i + 1;
        points.push({
          key: `pit:${pit.id}:${corner}`,
          kind: 'pit_corner',
          name: `P${pit.id}-${corner}`,
          description: `${pit.kind === 'launch' ? 'Launch' : 'Receiving'} pit of ${br.name}, corner ${corner} of ${pit.footprint.length}; bottom ${pit.bottomElevation.toFixed(unit === 'm' ? 3 : 2)} ${u}`,
          boreId: br.boreId,
          boreName: br.name,
          lineId: null,
          lineLabel: null,
          lineKind: null,
          pitId: pit.id,
          pitKind: pit.kind,
          easting: e,
          northing: nth,
          elevation: pit.bottomElevation,
          elevationRef: 'pit_bottom',
          elevationNote: null,
          station: at.station,
          offset: at.offset,
          side: at.side,
          beyond: at.beyond,
          holes: [],
          reason: null,
        });
      });
    }
  }
  const order = { crossing: 0, suggested_hole: 1, pit_corner: 2 } as const;
  // By bore, then crossings and suggested holes up-station, then each pit's corners in footprint order.
  const along = (p: StakePoint) => (p.kind === 'pit_corner' ? 0 : p.station);
  return points.sort(
    (a, b) => a.boreName.localeCompare(b.boreName) || a.boreId - b.boreId || order[a.kind] - order[b.kind] || along(a) - along(b) || a.key.localeCompare(b.key, 'en', { numeric: true }),
  );
}

/** Every point of the project as it stands now (before marks are attached): one read of the project's rows. */
export async function currentStakePoints(em: EntityManager, project: Project): Promise<StakePoint[]> {
  const input = await loadClearanceInput(em, project);
  return stakePoints(computeClearances(input), input.bores, project.unit);
}

/**
 * The stake-out list with each point's mark (staked when, by whom) and how far the point has
 * moved since; filtered by bore when asked. Exports of point files can use this too.
 */
export async function stakeoutList(em: EntityManager, project: Project, boreId?: number): Promise<StakeoutDto> {
  const all = await currentStakePoints(em, project);
  const marks = await em.find(StakeMark, { project }, { populate: ['stakedBy'] });
  const byKey = new Map(marks.map((m) => [m.key, m]));
  const keys = new Set(all.map((p) => p.key));
  const points: StakePointDto[] = all
    .filter((p) => boreId === undefined || p.boreId === boreId)
    .map(({ reason: _reason, ...p }) => {
      const m = byKey.get(p.key);
      return { ...p, mark: m ? presentStakeMark(m) : null, movedSinceStaked: m ? Math.hypot(p.easting - m.easting, p.northing - m.northing) : null };
    });
  return {
    ...reportFrame(project),
    points,
    orphanMarks: marks.filter((m) => !keys.has(m.key)).map(presentStakeMark),
  };
}
