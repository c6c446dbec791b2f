import type { AirframeReleaseView, ReleaseAirframeInput } from '@shared/schemas/releases';
import { apiPost } from '@/lib/api-client';
import { useTechLogMutation } from './tech-log-mutation';

export const releaseAirframe = (airframeId: number, input: ReleaseAirframeInput) =>
  apiPost<AirframeReleaseView>(`/airframes/${airframeId}/release`, input);

export const useReleaseAirframe = (airframeId: number) =>
  useTechLogMutation((input: ReleaseAirframeInput) => releaseAirframe(airframeId, input));
