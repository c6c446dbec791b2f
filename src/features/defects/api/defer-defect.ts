import type { DeferDefectInput, DefectView } from '@shared/schemas/defects';
import { apiPost } from '@/lib/api-client';
import { useTechLogMutation } from './tech-log-mutation';

export const deferDefect = (defectId: number, input: DeferDefectInput) =>
  apiPost<DefectView>(`/defects/${defectId}/defer`, input);

export const useDeferDefect = (defectId: number) =>
  useTechLogMutation((input: DeferDefectInput) => deferDefect(defectId, input));
