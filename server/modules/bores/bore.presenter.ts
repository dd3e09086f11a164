import type { BoreDto, PitDto } from '@shared/api';
import type { Bore } from './bore.entity';
import type { Pit } from './pit.entity';

export function presentBore(b: Bore): BoreDto {
  return {
    id: b.id,
    projectId: b.project.id,
    name: b.name,
    method: b.method,
    alignment: b.alignment,
    beginStation: b.beginStation,
    profile: b.profile,
    groundProfile: b.groundProfile,
    casingOd: b.casingOd,
    carrierSize: b.carrierSize ?? null,
    toleranceHorizontal: b.toleranceHorizontal,
    toleranceVertical: b.toleranceVertical,
    minCover: b.minCover,
    notes: b.notes ?? null,
    version: b.version,
    createdAt: b.createdAt.toISOString(),
    updatedAt: b.updatedAt.toISOString(),
  };
}

export function presentPit(p: Pit): PitDto {
  return {
    id: p.id,
    boreId: p.bore.id,
    kind: p.kind,
    footprint: p.footprint,
    bottomElevation: p.bottomElevation,
    notes: p.notes,
    version: p.version,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}
