import type { EntityManager } from '@mikro-orm/sqlite';
import { parseBearing } from '@shared/bearing';
import { NEW_LINE_STUB_HALF_METRES, type HoleCreateInput, type HoleUpdateInput, type NewLineInput } from '@shared/schemas/hole';
import { pointAtStationOffset } from '@shared/geometry/station';
import { UNIT_SYMBOLS, convertLength } from '@shared/units';
import { AppError, badRequest, forbidden } from '../../errors';
import { Bore } from '../bores/bore.entity';
import { UtilityLine } from '../lines/utility-line.entity';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';
import type { TestHole } from './test-hole.entity';

type PositionInput = Pick<HoleCreateInput, 'positionSource' | 'easting' | 'northing' | 'boreId' | 'station' | 'offset' | 'offsetSide' | 'gpsAccuracy'>;

export interface ResolvedPosition {
  positionSource: HoleCreateInput['positionSource'];
  easting: number;
  northing: number;
  approximate: boolean;
  bore: Bore | null;
  station: number | null;
  offset: number | null;
  offsetSide: 'L' | 'R' | null;
  gpsAccuracy: number | null;
}

/**
 * Turn the position the crew gave into grid E/N. Station/offset goes through the bore's
 * alignment; a phone fix is kept with its accuracy, flagged approximate, and refused when
 * worse than the project's limit.
 */
export async function resolvePosition(em: EntityManager, project: Project, input: PositionInput): Promise<ResolvedPosition> {
  if (input.positionSource === 'station') {
    const bore = await em.findOne(Bore, { id: input.boreId!, project });
    if (!bore) throw badRequest('The bore is not in this project.', [{ path: 'boreId', message: 'no such bore in this project' }]);
    const offset = input.offset ?? 0;
    const side = offset === 0 ? null : (input.offsetSide ?? null);
    let point: { easting: number; northing: number };
    try {
      point = pointAtStationOffset(bore.alignment, bore.beginStation, input.station!, offset, side ?? 'R');
    } catch (err) {
      throw badRequest('The station cannot be placed on the bore.', [{ path: 'station', message: err instanceof Error ? err.message : 'not on the bore' }]);
    }
    return { positionSource: 'station', easting: point.easting, northing: point.northing, approximate: false, bore, station: input.station!, offset, offsetSide: side, gpsAccuracy: null };
  }
  if (input.positionSource === 'gps') {
    const limit = project.settings.maxGpsAccuracy;
    if (input.gpsAccuracy! > limit) {
      throw badRequest('The phone position is not accurate enough.', [
        { path: 'gpsAccuracy', message: `accuracy ${input.gpsAccuracy} is worse than the project limit of ${limit} ${project.unit}; wait for a better fix or enter the position another way` },
      ]);
    }
  }
  return {
    positionSource: input.positionSource,
    easting: input.easting!,
    northing: input.northing!,
    approximate: input.positionSource === 'gps',
    bore: null,
    station: null,
    offset: null,
    offsetSide: null,
    gpsAccuracy: input.positionSource === 'gps' ? input.gpsAccuracy! : null,
  };
}

/** A reviewed hole is locked; field crews may edit only holes they logged themselves. */
export function assertCanEdit(user: User, hole: TestHole): void {
  if (hole.status === 'reviewed') {
    throw new AppError(409, 'locked', `Test hole ${hole.number} is reviewed and locked. A designer must reopen it, with a reason, before it can change.`);
  }
  if (user.role === 'field' && hole.createdBy?.id !== user.id) {
    throw forbidden('Field crews may edit only the test holes they logged.');
  }
}

/** Status after an edit of the crew's fields: a planned hole becomes dug once its depth is logged. */
export function statusAfterLogging(hole: TestHole, input: Pick<HoleUpdateInput, 'depthToTop'>): TestHole['status'] {
  if (hole.status === 'planned' && (input.depthToTop ?? hole.depthToTop) != null) return 'dug';
  return hole.status;
}

/**
 * The line on no record a hole exposed, made with the hole: kind unidentified (`unknown`), owner
 * and status unknown, quality level A (seen at this hole), its size, material and depth as the
 * crew measured them, drawn as a stub of 2 × {@link NEW_LINE_STUB_HALF_METRES} m through the hole
 * along the direction of run the crew gave. The schema has already checked that the direction
 * reads as a bearing and that the depth and size are there.
 */
export function unidentifiedLineAtHole(
  project: Project,
  newLine: NewLineInput,
  hole: Pick<HoleCreateInput, 'number' | 'direction' | 'depthToTop' | 'measuredSize' | 'boxWidth' | 'boxHeight' | 'material'>,
  at: { easting: number; northing: number },
): UtilityLine {
  const azimuthDeg = parseBearing(hole.direction);
  if (azimuthDeg == null) throw badRequest('The direction of run cannot be read.', [{ path: 'direction', message: 'is needed to draw the new line' }]);
  const azimuth = (azimuthDeg * Math.PI) / 180;
  const half = convertLength(NEW_LINE_STUB_HALF_METRES, 'm', project.unit);
  const dx = Math.sin(azimuth) * half;
  const dy = Math.cos(azimuth) * half;
  const round = (x: number) => Math.round(x * 1000) / 1000;
  const line = new UtilityLine(project, newLine.label, 'Unknown', 'unknown', [
    [round(at.easting - dx), round(at.northing - dy)],
    [round(at.easting + dx), round(at.northing + dy)],
  ]);
  const box = hole.boxWidth != null || hole.boxHeight != null;
  line.shape = box ? 'box' : 'round';
  line.diameter = box ? null : (hole.measuredSize ?? null);
  line.width = box ? (hole.boxWidth ?? null) : null;
  line.height = box ? (hole.boxHeight ?? null) : null;
  line.material = hole.material?.trim() || null;
  line.status = 'unknown';
  line.qualityLevel = 'A';
  line.recordDepth = hole.depthToTop ?? 0;
  const stub = `${(Math.round(2 * half * 10) / 10).toLocaleString('en-US')} ${UNIT_SYMBOLS[project.unit]}`;
  line.notes = `Found at test hole ${hole.number}. Drawn as a ${stub} stub along the direction of run the crew gave (${hole.direction!.trim()}); extend its path when more of it is known. Treat as live until identified.`;
  return line;
}
