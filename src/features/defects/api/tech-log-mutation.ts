import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

/**
 * A signed tech-log act changes the airframe's state everywhere: every query under ['airframes'] (lists, the
 * board, the pilot's view, defects, releases) is fetched again.
 */
export const useTechLogMutation = <I, O>(act: (input: I) => Promise<O>) =>
  useRefreshingMutation(act, queryKeys.airframes.all);
