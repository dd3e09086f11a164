import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateAfterHoleWrite } from './invalidate';
import { holeKeys } from './keys';

export function deletePhoto(projectId: number, photoId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/photos/${photoId}`);
}

export function useDeletePhoto(projectId: number, holeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (photoId: number) => deletePhoto(projectId, photoId),
    onSuccess: (_void, photoId) => {
      queryClient.setQueryData<{ id: number }[]>(holeKeys.photos(projectId, holeId), (old) => old?.filter((p) => p.id !== photoId));
      return invalidateAfterHoleWrite(queryClient);
    },
  });
}
