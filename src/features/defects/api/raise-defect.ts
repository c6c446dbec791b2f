import type { DefectView, RaiseDefectInput } from '@shared/schemas/defects';
import { apiPost } from '@/lib/api-client';
import { useTechLogMutation } from './tech-log-mutation';

export const raiseDefect = (airframeId: number, input: RaiseDefectInput) =>
  apiPost<DefectView>(`/airframes/${airframeId}/defects`, input);

export const useRaiseDefect = (airframeId: number) =>
  useTechLogMutation((input: RaiseDefectInput) => raiseDefect(airframeId, input));
