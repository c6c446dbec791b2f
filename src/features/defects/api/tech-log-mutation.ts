import { useMutation, useQueryClient } from '@tanstack/react-query';

/**
 * A signed tech-log act changes the airframe's state everywhere: every query under ['airframes'] (lists, the
 * pilot's view, defects, releases) and the board are fetched again.
 */
export function useTechLogMutation<I, O>(act: (input: I) => Promise<O>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: act,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: ['airframes'] });
      void queryClient.invalidateQueries({ queryKey: ['board'] });
    },
  });
}
