import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import { kiosksQueryOptions } from './get-kiosks';

export interface KioskEnrolment {
  id: number;
  name: string;
  code: string;
  enrolPath: string;
  expiresAt: string;
}

export const createKiosk = (name: string) => apiPost<KioskEnrolment>('/kiosks', { name });

export function useCreateKiosk() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createKiosk,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: kiosksQueryOptions().queryKey }),
  });
}
