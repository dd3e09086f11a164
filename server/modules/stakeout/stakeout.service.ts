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
 * The point name, made from the point's stable key and nothing else (not from list order), so a
 * point keeps its name while its bore, line or pit keeps its record, and the Stake-out screen,
 * the point file, the DXF and the zip all say the same name:
 * - `crossing:<boreId>:<lineId>[:<n>]` → `X<boreId>-<lineId>[-<n>]` (confirmed crossing);
 * - `suggested:<boreId>:<lineId>:crossing[:<k>]` → `SH<boreId>-<lineId>[-<k>]` (suggested test hole at
 *   the crossing); `…:closest_point[:<k>]` → `SH<boreId>-<lineId>N[-<k>]` (at the nearest point);
 * - `pit:<pitId>:<corner>` → `P<pitId>-<corner>`.
 * Distinct keys give distinct names (the letters and hyphens tell the forms apart). With ids up to
 * five digits a name is at most 16 characters, what data collectors commonly take for a point name
 * (common practice; many take 10 to 16).
 */
export function stakePointName(key: string): string {
  const [form, a, b, c, d] = key.split(':');
  if (form === 'crossing' && a && b) return `X${a}-${b}${c ? `-${c}` : ''}`;
  if (form === 'suggested' && a && b && (c === 'crossing' || c === 'closest_point')) return `SH${a}-${b}${c === 'closest_point' ? 'N' : ''}${d ? `-${d}` : ''}`;
  if (form === 'pit' && a && b) return `P${a}-${b}`;
  throw new Error(`Not a stake point key: ${key}`);
}

/** What the elevation is, in the words of the descriptions (and why there is none). */
function elevationWords(ref: StakePoint['elevationRef'], elevation: number | null): string {
  if (elevation === null) return ref === 'ground' ? 'no elevation: take the ground on site' : 'no elevation';
  return { line_top: 'top of line', ground: 'ground', pit_bottom: 'pit bottom' }[ref];
}

/**
 * The points a survey crew stakes (SPEC §5), from a clearance report:
 * - confirmed line positions over each crossing, where a dug hole verifies the crossing
 *   (elevation: top of line at the crossing);
 * - suggested test holes for lines not yet verified (elevation: ground from the bore's ground
 *   profile at the station; none without a profile);
 * - the corners of every pit footprint (elevation: pit bottom).
 * Each point's name (`stakePointName`, from its key) and description (what it is, which line of
 * which kind, which bore, what the elevation is; no commas of its own, for point files) are made here and
 * only here: the Stake-out screen and every export use them as they are. Keys are stable while the geometry keeps its records: `crossing:<boreId>:<lineId>` (with
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
          name: '',
          description: `Confirmed crossing ${line.label} (${LINE_KIND_LABELS[line.kind]}) over ${br.name}; ${elevationWords('line_top', p.lineTop)}${holes.length ? `; ${holes.join(' ')}` : ''}`,
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
          name: '',
          description: `Suggested test hole ${line.label} (${LINE_KIND_LABELS[line.kind]}) ${s.reason === 'crossing' ? 'at its crossing of' : 'nearest'} ${br.name}; ${elevationWords('ground', ground.elevation)}`,
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
          name: '',
          description: `Pit corner ${corner} of ${pit.footprint.length} ${pit.kind === 'launch' ? 'launch' : 'receiving'} pit of ${br.name}; pit bottom ${pit.bottomElevation.toFixed(unit === 'm' ? 3 : 2)} ${u}`,
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
  for (const p of points) p.name = stakePointName(p.key);
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
