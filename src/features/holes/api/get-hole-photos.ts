import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PhotoDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { holeKeys } from './keys';

export function getHolePhotos(projectId: number, holeId: number, signal?: AbortSignal): Promise<PhotoDto[]> {
  return api.get<PhotoDto[]>(`/api/projects/${projectId}/holes/${holeId}/photos`, { signal });
}

export const holePhotosQueryOptions = (projectId: number, holeId: number) =>
  queryOptions({
    queryKey: holeKeys.photos(projectId, holeId),
    queryFn: ({ signal }) => getHolePhotos(projectId, holeId, signal),
    // Just after an upload the upright copies are still being made: ask again until they are.
    refetchInterval: (query) => (query.state.data?.some((p) => p.state === 'processing') ? 1500 : false),
  });

export function useHolePhotos(projectId: number, holeId: number) {
  return useQuery(holePhotosQueryOptions(projectId, holeId));
}
