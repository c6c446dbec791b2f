import { useQuery } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import { toolsQueryOptions } from '@/lib/shared-queries';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';
import type { CreateToolInput, Tool, UpdateToolInput } from '@shared/schemas/tools';

/** The tags of the tools asked for (`?ids=`), or of every tool in use. */
export const useToolTags = (ids: number[] | null) =>
  useQuery({
    ...toolsQueryOptions(),
    select: (tools) => tools.filter((t) => t.retiredAt === null && (ids === null || ids.includes(t.id))),
  });

export const useRegisterTool = () =>
  useRefreshingMutation((input: CreateToolInput) => apiPost<Tool>('/tools', input), queryKeys.tools);

export const useUpdateTool = () =>
  useRefreshingMutation(
    ({ id, input }: { id: number; input: UpdateToolInput }) =>
      apiPost<{ tool: Tool; changed: string[] }>(`/tools/${id}`, input),
    queryKeys.tools,
  );

export const useRetireTool = () =>
  useRefreshingMutation((id: number) => apiPost<Tool>(`/tools/${id}/retire`), queryKeys.tools);
