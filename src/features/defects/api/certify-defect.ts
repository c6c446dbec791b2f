import type { CertifyInput, DefectView } from '@shared/schemas/defects';
import { apiPost } from '@/lib/api-client';
import { useTechLogMutation } from './tech-log-mutation';

export const certifyDefect = (defectId: number, input: CertifyInput) =>
  apiPost<DefectView>(`/defects/${defectId}/certify`, input);

export const useCertifyDefect = (defectId: number) =>
  useTechLogMutation((input: CertifyInput) => certifyDefect(defectId, input));
