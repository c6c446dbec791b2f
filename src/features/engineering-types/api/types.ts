import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';
import type {
  CreateType,
  LimitsDiff,
  LimitsVersionDetail,
  TypeDetail,
} from '@shared/schemas/engineering-types';

export const typeQueryOptions = (id: number) =>
  queryOptions({
    queryKey: queryKeys.types.one(id),
    queryFn: ({ signal }) => apiGet<TypeDetail>(`/types/${id}`, signal),
  });
export const useType = (id: number) => useQuery(typeQueryOptions(id));

export const getLimitsVersion = (typeId: number, versionId: number, signal?: AbortSignal) =>
  apiGet<LimitsVersionDetail>(`/types/${typeId}/versions/${versionId}`, signal);

export const versionQueryOptions = (typeId: number, versionId: number) =>
  queryOptions({
    queryKey: queryKeys.types.version(typeId, versionId),
    queryFn: ({ signal }) => getLimitsVersion(typeId, versionId, signal),
  });
export const useLimitsVersion = (typeId: number, versionId: number | null) =>
  useQuery({ ...versionQueryOptions(typeId, versionId ?? 0), enabled: versionId !== null });

export const diffQueryOptions = (typeId: number, from: number, to: number) =>
  queryOptions({
    queryKey: queryKeys.types.diff(typeId, from, to),
    queryFn: ({ signal }) => apiGet<LimitsDiff>(`/types/${typeId}/diff?from=${from}&to=${to}`, signal),
  });
export const useLimitsDiff = (typeId: number, from: number | null, to: number | null) =>
  useQuery({
    ...diffQueryOptions(typeId, from ?? 0, to ?? 0),
    enabled: from !== null && to !== null && from !== to,
  });

export const useCreateType = () =>
  useRefreshingMutation(
    (input: CreateType) => apiPost<{ id: number; draftVersionId: number }>('/types', input),
    queryKeys.types.all,
  );

export const useSaveDraft = (typeId: number) =>
  useRefreshingMutation(
    (definition: AircraftTypeDefinition) =>
      apiPost<{ id: number; version: number; status: 'draft' }>(`/types/${typeId}/draft`, { definition }),
    queryKeys.types.one(typeId),
  );

export const usePublishDraft = (typeId: number) =>
  useRefreshingMutation(
    () => apiPost<{ id: number; version: number; publishedAt: string }>(`/types/${typeId}/draft/publish`),
    queryKeys.types.all,
  );
