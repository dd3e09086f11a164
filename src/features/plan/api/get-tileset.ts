import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TilesetDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { planKeys } from './keys';

/** The project's base map (MBTiles served by Threadline itself), or `available: false`. */
export function getTileset(projectId: number, signal?: AbortSignal): Promise<TilesetDto> {
  return api.get<TilesetDto>(`/api/projects/${projectId}/tiles`, { signal });
}

export const tilesetQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: planKeys.tileset(projectId), queryFn: ({ signal }) => getTileset(projectId, signal), staleTime: 5 * 60_000 });

export function useTileset(projectId: number) {
  return useQuery(tilesetQueryOptions(projectId));
}

/** URL template of the project's tiles for Leaflet; the version makes a replaced file bypass caches. */
export function tileUrlTemplate(projectId: number, version: string | null): string {
  return `/api/projects/${projectId}/tiles/{z}/{x}/{y}.png${version ? `?v=${encodeURIComponent(version)}` : ''}`;
}
