import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto } from '@shared/api';
import { api } from '@/lib/api-client';
import { holeKeys } from './keys';

export function updatePhoto(projectId: number, photoId: number, input: { caption: string | null }): Promise<PhotoDto> {
  return api.patch<PhotoDto>(`/api/projects/${projectId}/photos/${photoId}`, input);
}

/** Change a photo's caption. */
export function useUpdatePhoto(projectId: number, holeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ photoId, caption }: { photoId: number; caption: string | null }) => updatePhoto(projectId, photoId, { caption }),
    onSuccess: (photo) => {
      queryClient.setQueryData<PhotoDto[]>(holeKeys.photos(projectId, holeId), (old) => old?.map((p) => (p.id === photo.id ? photo : p)));
      return queryClient.invalidateQueries({ queryKey: holeKeys.activity(projectId, holeId) });
    },
  });
}
