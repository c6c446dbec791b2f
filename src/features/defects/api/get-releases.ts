import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeReleaseView } from '@shared/schemas/releases';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getReleases = (airframeId: number, signal?: AbortSignal) =>
  apiGet<AirframeReleaseView[]>(`/airframes/${airframeId}/releases`, signal);

export const releasesQueryOptions = (airframeId: number) =>
  queryOptions({
    queryKey: queryKeys.airframes.releases(airframeId),
    queryFn: ({ signal }) => getReleases(airframeId, signal),
  });

/** Newest first. */
export const useReleases = (airframeId: number) =>
  useQuery({
    ...releasesQueryOptions(airframeId),
    select: (releases) => [...releases].sort((a, b) => b.signedAt.localeCompare(a.signedAt)),
  });
