import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';

/** A mutation after whose success every query under the given keys is fetched again. */
export function useRefreshingMutation<I, O>(
  mutationFn: (input: I) => Promise<O>,
  ...keys: readonly QueryKey[]
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: () => {
      for (const queryKey of keys) void queryClient.invalidateQueries({ queryKey });
    },
  });
}
