import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HoleDto } from '@shared/api';
import type { HoleSurveyInput } from '@shared/schemas/hole';
import { api } from '@/lib/api-client';
import { invalidateAfterHoleWrite } from './invalidate';
import { holeKeys } from './keys';

/** The surveyor's as-surveyed values (PUT replaces all four; these win over ground − depth). */
export function surveyHole(projectId: number, holeId: number, input: HoleSurveyInput): Promise<HoleDto> {
  return api.put<HoleDto>(`/api/projects/${projectId}/holes/${holeId}/survey`, input);
}

export function useSurveyHole(projectId: number, holeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: HoleSurveyInput) => surveyHole(projectId, holeId, input),
    onSuccess: (hole) => {
      queryClient.setQueryData(holeKeys.detail(projectId, holeId), hole);
      return invalidateAfterHoleWrite(queryClient);
    },
  });
}
