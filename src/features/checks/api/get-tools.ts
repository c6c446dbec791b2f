import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Tool } from '@shared/schemas/tools';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

/** The tools register as the kiosk offers it; signing checks each tool again on the day. */
export const toolsRegisterQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.tools,
    queryFn: ({ signal }) => apiGet<Tool[]>('/tools', signal),
    staleTime: 5 * 60_000,
  });

export const useToolsRegister = (enabled: boolean) => useQuery({ ...toolsRegisterQueryOptions(), enabled });
