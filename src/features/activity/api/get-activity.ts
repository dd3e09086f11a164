import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ActivityDto, Page } from '@shared/api';
import { api } from '@/lib/api-client';
import { activityKeys } from './keys';

export function getActivity(projectId: number, page: { limit: number; offset: number }, signal?: AbortSignal): Promise<Page<ActivityDto>> {
  return api.get<Page<ActivityDto>>(`/api/projects/${projectId}/activity`, { signal, query: page });
}

export const activityQueryOptions = (projectId: number, page: { limit: number; offset: number }) =>
  queryOptions({
    queryKey: activityKeys.list(projectId, page),
    queryFn: ({ signal }) => getActivity(projectId, page, signal),
    placeholderData: keepPreviousData,
  });

/** One page of the project's activity, newest first; the previous page stays shown while the next loads. */
export function useActivity(projectId: number, page: { limit: number; offset: number }) {
  return useQuery(activityQueryOptions(projectId, page));
}
