import type { DefectView, InspectionInput } from '@shared/schemas/defects';
import { apiPost } from '@/lib/api-client';
import { useTechLogMutation } from './tech-log-mutation';

export const recordDefectInspection = (defectId: number, input: InspectionInput) =>
  apiPost<DefectView>(`/defects/${defectId}/inspection`, input);

export const useRecordDefectInspection = (defectId: number) =>
  useTechLogMutation((input: InspectionInput) => recordDefectInspection(defectId, input));
