import type { EntityManager } from '@mikro-orm/sqlite';
import type { HoleCreateInput, HoleUpdateInput } from '@shared/schemas/hole';
import { pointAtStationOffset } from '@shared/geometry/station';
import { AppError, badRequest, forbidden } from '../../errors';
import { Bore } from '../bores/bore.entity';
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
