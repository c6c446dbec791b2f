import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeReleaseView } from '@shared/schemas/releases';
import { apiGet } from '@/lib/api-client';

export const getReleases = (airframeId: number, signal?: AbortSignal) =>
  apiGet<AirframeReleaseView[]>(`/airframes/${airframeId}/releases`, signal);

export const releasesQueryOptions = (airframeId: number) =>
  queryOptions({
    queryKey: ['airframes', airframeId, 'releases'] as const,
    queryFn: ({ signal }) => getReleases(airframeId, signal),
  });

/** Newest first. */
export const useReleases = (airframeId: number) =>
  useQuery({
    ...releasesQueryOptions(airframeId),
    select: (releases) => [...releases].sort((a, b) => b.signedAt.localeCompare(a.signedAt)),
  });
