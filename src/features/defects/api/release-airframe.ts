import type { AirframeReleaseView, ReleaseAirframeInput } from '@shared/schemas/releases';
import { apiPost } from '@/lib/api-client';
import { useSignOnce } from '@/lib/sign-once';
import { useTechLogMutation } from './tech-log-mutation';

export const releaseAirframe = (airframeId: number, input: ReleaseAirframeInput) =>
  apiPost<AirframeReleaseView>(`/airframes/${airframeId}/release`, input);

export function useReleaseAirframe(airframeId: number) {
  const sign = useSignOnce((input: ReleaseAirframeInput, requestId) =>
    releaseAirframe(airframeId, { ...input, requestId }),
  );
  return useTechLogMutation(sign);
}
