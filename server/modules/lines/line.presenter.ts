import type { LineDto } from '@shared/api';
import type { UtilityLine } from './utility-line.entity';

export function presentLine(l: UtilityLine): LineDto {
  return {
    id: l.id,
    projectId: l.project.id,
    label: l.label,
    owner: l.owner,
    kind: l.kind,
    shape: l.shape,
    diameter: l.diameter ?? null,
    width: l.width ?? null,
    height: l.height ?? null,
    material: l.material ?? null,
    status: l.status,
    qualityLevel: l.qualityLevel,
    path: l.path,
    recordDepth: l.recordDepth,
    requiredVertical: l.requiredVertical ?? null,
    requiredHorizontal: l.requiredHorizontal ?? null,
    contactEmail: l.contactEmail || null,
    notes: l.notes ?? null,
    version: l.version,
    createdAt: l.createdAt.toISOString(),
    updatedAt: l.updatedAt.toISOString(),
  };
}
