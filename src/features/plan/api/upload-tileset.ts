import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Problem, TilesetDto } from '@shared/api';
import { ApiError, api } from '@/lib/api-client';
import { planKeys } from './keys';

/** Upload an MBTiles file as the project's base map (administrators). Multipart, so not through the JSON helper. */
export async function uploadTileset(projectId: number, file: File): Promise<TilesetDto> {
  const body = new FormData();
  body.append('file', file);
  let response: Response;
  try {
    response = await fetch(`/api/projects/${projectId}/tiles`, { method: 'POST', body, credentials: 'same-origin', headers: { Accept: 'application/json, application/problem+json' } });
  } catch {
    throw new ApiError({ type: 'about:blank', title: 'Cannot reach the Threadline server', status: 0, detail: 'Check the connection and try again.' });
  }
  if (!response.ok) {
    let problem: Problem = { type: 'about:blank', title: response.statusText || 'Upload failed', status: response.status };
    try {
      problem = { ...problem, ...((await response.json()) as Partial<Problem>) };
    } catch {
      // not JSON: keep the status line
    }
    throw new ApiError(problem);
  }
  return (await response.json()) as TilesetDto;
}

/** Remove the uploaded base map (a demo project falls back to its bundled tiles). */
export function deleteTileset(projectId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/tiles`);
}

export function useUploadTileset(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadTileset(projectId, file),
    onSuccess: (tileset) => queryClient.setQueryData(planKeys.tileset(projectId), tileset),
  });
}

export function useDeleteTileset(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteTileset(projectId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: planKeys.tileset(projectId) }),
  });
}
