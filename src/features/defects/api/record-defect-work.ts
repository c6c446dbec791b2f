import type { DefectView, DefectWorkInput } from '@shared/schemas/defects';
import { apiPost } from '@/lib/api-client';
import { useTechLogMutation } from './tech-log-mutation';

export const recordDefectWork = (defectId: number, input: DefectWorkInput) =>
  apiPost<DefectView>(`/defects/${defectId}/work`, input);

export const useRecordDefectWork = (defectId: number) =>
  useTechLogMutation((input: DefectWorkInput) => recordDefectWork(defectId, input));
