import { useMutation } from '@tanstack/react-query';
import type { HandoverSent } from '@shared/schemas/handover';
import { apiPost } from '@/lib/api-client';
import type { ShiftWindow } from './get-handover';

export const sendHandover = (window: ShiftWindow) => apiPost<HandoverSent>('/handover/send', window);

export const useSendHandover = () => useMutation({ mutationFn: sendHandover });
