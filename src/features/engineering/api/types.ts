import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPost } from '@/lib/api-client';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';
import type { CreateType, LimitsDiff, LimitsVersionDetail, TypeDetail, TypeSummary } from '@shared/schemas/engineering-types';

export const typesQueryOptions = () =>
  queryOptions({
    queryKey: ['types'] as const,
    queryFn: ({ signal }) => apiGet<TypeSummary[]>('/types', signal),
  });
export const useTypes = () => useQuery(typesQueryOptions());

export const typeQueryOptions = (id: number) =>
  queryOptions({
    queryKey: [...typesQueryOptions().queryKey, id] as const,
    queryFn: ({ signal }) => apiGet<TypeDetail>(`/types/${id}`, signal),
  });
export const useType = (id: number) => useQuery(typeQueryOptions(id));

export const versionQueryOptions = (typeId: number, versionId: number) =>
  queryOptions({
    queryKey: [...typeQueryOptions(typeId).queryKey, 'versions', versionId] as const,
    queryFn: ({ signal }) => apiGet<LimitsVersionDetail>(`/types/${typeId}/versions/${versionId}`, signal),
  });
export const useLimitsVersion = (typeId: number, versionId: number | null) =>
  useQuery({ ...versionQueryOptions(typeId, versionId ?? 0), enabled: versionId !== null });

export const diffQueryOptions = (typeId: number, from: number, to: number) =>
  queryOptions({
    queryKey: [...typeQueryOptions(typeId).queryKey, 'diff', from, to] as const,
    queryFn: ({ signal }) => apiGet<LimitsDiff>(`/types/${typeId}/diff?from=${from}&to=${to}`, signal),
  });
export const useLimitsDiff = (typeId: number, from: number | null, to: number | null) =>
  useQuery({
    ...diffQueryOptions(typeId, from ?? 0, to ?? 0),
    enabled: from !== null && to !== null && from !== to,
  });

export function useCreateType() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateType) => apiPost<{ id: number; draftVersionId: number }>('/types', input),
    onSuccess: () => void qc.invalidateQueries({ queryKey: typesQueryOptions().queryKey }),
  });
}

export function useSaveDraft(typeId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (definition: AircraftTypeDefinition) =>
      apiPost<{ id: number; version: number; status: 'draft' }>(`/types/${typeId}/draft`, { definition }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: typeQueryOptions(typeId).queryKey }),
  });
}

export function usePublishDraft(typeId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () =>
      apiPost<{ id: number; version: number; publishedAt: string }>(`/types/${typeId}/draft/publish`),
    onSuccess: () => void qc.invalidateQueries({ queryKey: typesQueryOptions().queryKey }),
  });
}
