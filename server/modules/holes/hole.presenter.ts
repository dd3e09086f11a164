import type { HoleDto, PhotoDto } from '@shared/api';
import type { Photo } from './photo.entity';
import type { TestHole } from './test-hole.entity';

export function presentHole(h: TestHole, photoCount = 0): HoleDto {
  return {
    id: h.id,
    projectId: h.project.id,
    clientId: h.clientId,
    number: h.number,
    lineId: h.line.id,
    status: h.status,
    positionSource: h.positionSource,
    easting: h.easting,
    northing: h.northing,
    approximate: h.approximate,
    boreId: h.bore?.id ?? null,
    station: h.station ?? null,
    offset: h.offset ?? null,
    offsetSide: h.offsetSide ?? null,
    gpsAccuracy: h.gpsAccuracy ?? null,
    groundElevation: h.groundElevation ?? null,
    depthToTop: h.depthToTop ?? null,
    depthReference: h.depthReference,
    measuredSize: h.measuredSize ?? null,
    boxWidth: h.boxWidth ?? null,
    boxHeight: h.boxHeight ?? null,
    depthToBottom: h.depthToBottom ?? null,
    material: h.material ?? null,
    condition: h.condition ?? null,
    direction: h.direction ?? null,
    method: h.method ?? null,
    ticketNumber: h.ticketNumber ?? null,
    surfaceType: h.surfaceType ?? null,
    markerSet: h.markerSet ?? null,
    crew: h.crew ?? null,
    dugAt: h.dugAt ? h.dugAt.toISOString() : null,
    surveyedEasting: h.surveyedEasting ?? null,
    surveyedNorthing: h.surveyedNorthing ?? null,
    surveyedTopElevation: h.surveyedTopElevation ?? null,
    surveyedGroundElevation: h.surveyedGroundElevation ?? null,
    reviewNote: h.reviewNote ?? null,
    notes: h.notes ?? null,
    createdById: h.createdBy?.id ?? null,
    photoCount,
    version: h.version,
    createdAt: h.createdAt.toISOString(),
    updatedAt: h.updatedAt.toISOString(),
  };
}

export function presentPhoto(p: Photo, projectId: number): PhotoDto {
  const base = `/api/projects/${projectId}/photos/${p.id}`;
  return {
    id: p.id,
    holeId: p.hole.id,
    caption: p.caption ?? null,
    takenAt: p.takenAt ? p.takenAt.toISOString() : null,
    gpsLat: p.gpsLat ?? null,
    gpsLon: p.gpsLon ?? null,
    width: p.width,
    height: p.height,
    url: `${base}/file`,
    thumbnailUrl: `${base}/thumbnail`,
    uploadedById: p.uploadedBy?.id ?? null,
    createdAt: p.createdAt.toISOString(),
  };
}
